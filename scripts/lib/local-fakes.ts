// Hook for local stand-ins of outside services (mail, payments, object storage) that later issues add.
// Each fake starts on loopback and returns the env variables that point the app at it.
import { join } from 'node:path';
import { startS3Fake } from './fakes/s3';

export interface LocalFakes {
  env: Record<string, string>;
  names: string[];
  stop(): Promise<void>;
}

type FakeStarter = (dir: string) => Promise<{ name: string; env: Record<string, string>; stop(): Promise<void> } | null>;

// Object storage: an S3 fake unless real S3 is configured (STORAGE_S3_BUCKET) or LOCAL_S3_FAKE=off asks for the
// plain local folder (STORAGE_DIR) instead.
const startS3 = (dir: string) =>
  process.env.STORAGE_S3_BUCKET || process.env.LOCAL_S3_FAKE === 'off' ? Promise.resolve(null) : startS3Fake(join(dir, 's3'));

const STARTERS: FakeStarter[] = [startS3];

/** Starts every fake; `dir` holds their files (default .data/fakes, kept between `npm start` runs). */
export async function startLocalFakes(dir = join('.data', 'fakes')): Promise<LocalFakes> {
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
