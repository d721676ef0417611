// A MariaDB for one test run: fresh data dir under .data/test-*, a free port, removed again on stop.
import { randomBytes } from 'node:crypto';
import { rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { findFreePort } from './free-port';
import { startMariadb, stopMariadb, type MariadbConfig } from './mariadb';

export interface ThrowawayMariadb {
  config: MariadbConfig;
  databaseUrl: string;
  /** Stops the server and deletes its data dir; safe to call twice. */
  dispose(): Promise<void>;
}

export async function startThrowawayMariadb(root = process.cwd()): Promise<ThrowawayMariadb> {
  // Short name: the socket path inside it must stay under the Unix limit of ~100 characters.
  const dir = resolve(root, join('.data', `test-${randomBytes(4).toString('hex')}`));
  const config: MariadbConfig = { dir, port: await findFreePort() };
  let disposed = false;
  const dispose = async () => {
    if (disposed) return;
    disposed = true;
    try {
      await stopMariadb(config);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  };
  try {
    const started = await startMariadb(config);
    return { config, databaseUrl: started.databaseUrl, dispose };
  } catch (error) {
    await dispose().catch(() => undefined);
    throw error;
  }
}
