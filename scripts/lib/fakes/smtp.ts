// A local SMTP server (smtp-server) on loopback for `npm start` and `npm test`: nodemailer talks real SMTP to it, and
// it stores every message it accepts, as received, in `dir` as an .eml file (the admin's Outbox page reads them).
import { randomBytes } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

/** File name of a stored message: sortable by arrival (UTC timestamp first), unique by a random suffix. */
export function emlName(at: Date): string {
  return `${at.toISOString().replace(/[:.]/g, '-')}-${randomBytes(4).toString('hex')}.eml`;
}

export async function startSmtpFake(dir: string, port = 0): Promise<{ name: string; env: Record<string, string>; stop(): Promise<void> }> {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'], // plain SMTP on loopback only
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        try {
          writeFileSync(join(dir, emlName(new Date())), Buffer.concat(chunks));
          callback();
        } catch (error) {
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    name: `SMTP fake (smtp-server) at 127.0.0.1:${address.port}, messages in ${dir}`,
    env: { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(address.port), SMTP_SECURE: 'false', MAIL_DIR: dir, DEMO_MODE: 'true' },
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
