// Hook for local stand-ins of outside services (mail, payments, object storage) that later issues add.
// Each fake starts on loopback and returns the env variables that point the app at it.
import { dirname, join, resolve } from 'node:path';
import { startPaymentsFake } from './fakes/payments';
import { startS3Fake } from './fakes/s3';
import { startSmtpFake } from './fakes/smtp';

export interface LocalFakes {
  env: Record<string, string>;
  names: string[];
  stop(): Promise<void>;
}

type FakeStarter = (dir: string) => Promise<{ name: string; env: Record<string, string>; stop(): Promise<void> } | null>;

// Object storage: an S3 fake unless real S3 is configured (STORAGE_S3_BUCKET) or LOCAL_S3_FAKE=off asks for the
// plain local folder (STORAGE_DIR) instead. Its files go to S3_FAKE_DIR when set, else to `s3` in the fakes' folder,
// so two instances on one machine (another MARIADB_DIR, another checkout) never share a bucket folder.
export function s3FakeDir(dir: string, env: Record<string, string | undefined> = process.env): string {
  return env.S3_FAKE_DIR ? resolve(env.S3_FAKE_DIR) : join(dir, 's3');
}

const startS3 = (dir: string) =>
  process.env.STORAGE_S3_BUCKET || process.env.LOCAL_S3_FAKE === 'off' ? Promise.resolve(null) : startS3Fake(s3FakeDir(dir));

// Mail: an SMTP fake that keeps each message as an .eml file, unless a real relay is configured (SMTP_HOST) or
// LOCAL_SMTP_FAKE=off. Its messages go to MAIL_DIR when set; else `npm start` keeps them in .data/mail and any other
// fakes' folder (a test run's, a second instance's) gets its own `mail` folder inside.
export function mailFakeDir(dir: string, env: Record<string, string | undefined> = process.env): string {
  if (env.MAIL_DIR) return resolve(env.MAIL_DIR);
  if (resolve(dir) === resolve(join('.data', 'fakes'))) return resolve(join('.data', 'mail'));
  return join(resolve(dir), 'mail');
}

const startSmtp = (dir: string) =>
  process.env.SMTP_HOST || process.env.LOCAL_SMTP_FAKE === 'off' ? Promise.resolve(null) : startSmtpFake(mailFakeDir(dir));

// Payments: a fake of the provider's API (Checkout Sessions, Refunds, a pay page, signed webhooks) unless real keys are
// configured (PAYMENTS_SECRET_KEY) or LOCAL_PAYMENTS_FAKE=off. The webhook secret is kept in
// .data/payments-webhook-secret for `npm start`, in the fakes' own folder for any other run.
export function paymentsSecretFile(dir: string): string {
  if (resolve(dir) === resolve(join('.data', 'fakes'))) return resolve(join('.data', 'payments-webhook-secret'));
  return join(resolve(dir), 'payments-webhook-secret');
}

const startPayments = (dir: string) =>
  process.env.PAYMENTS_SECRET_KEY || process.env.LOCAL_PAYMENTS_FAKE === 'off' ? Promise.resolve(null) : startPaymentsFake(paymentsSecretFile(dir));

const STARTERS: FakeStarter[] = [startS3, startSmtp, startPayments];

/**
 * The fakes' folder of `npm start`: LOCAL_FAKES_DIR, else next to a MARIADB_DIR that picks another database (so a
 * second instance gets its own), else .data/fakes (kept between runs).
 */
export function defaultFakesDir(env: Record<string, string | undefined> = process.env): string {
  if (env.LOCAL_FAKES_DIR) return resolve(env.LOCAL_FAKES_DIR);
  if (env.MARIADB_DIR) return join(dirname(resolve(env.MARIADB_DIR)), `${resolve(env.MARIADB_DIR).split(/[\\/]/).pop()}-fakes`);
  return join('.data', 'fakes');
}

/** Starts every fake; `dir` holds their files (default: defaultFakesDir()). */
export async function startLocalFakes(dir = defaultFakesDir()): Promise<LocalFakes> {
  const started: NonNullable<Awaited<ReturnType<FakeStarter>>>[] = [];
  const stop = async () => {
    for (const fake of started.reverse()) await fake.stop().catch(() => undefined);
  };
  try {
    for (const start of STARTERS) {
      const fake = await start(dir);
      if (fake) started.push(fake);
    }
  } catch (error) {
    await stop();
    throw error;
  }
  return {
    env: Object.assign({}, ...started.map((fake) => fake.env)),
    names: started.map((fake) => fake.name),
    stop,
  };
}
