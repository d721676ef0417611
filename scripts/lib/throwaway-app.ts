// A whole app for a benchmark: a throwaway MariaDB (migrated, demo seeded), the local fakes, a build when the
// sources are newer than the last one, and `next start` on a free port. stop() ends all of it, in reverse order.
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { migrateLatest, seedDemoAt } from './database';
import { findFreePort } from './free-port';
import { startLocalFakes, type LocalFakes } from './local-fakes';
import { buildNeededBecause, nextEnv, runNextBuild, startNextServer, type NextServer } from './next-server';
import { startThrowawayMariadb } from './throwaway-mariadb';

export interface ThrowawayApp {
  server: NextServer;
  fakes: LocalFakes;
  stop(): Promise<void>;
}

export async function startThrowawayApp(root: string): Promise<ThrowawayApp> {
  const database = await startThrowawayMariadb(root);
  let fakes: LocalFakes | undefined;
  try {
    fakes = await startLocalFakes(join(database.config.dir, 'fakes'));
    await migrateLatest(database.databaseUrl);
    const port = await findFreePort();
    const env = nextEnv({
      STORAGE_DIR: join(database.config.dir, 'uploads'),
      DATABASE_URL: database.databaseUrl,
      NEXTAUTH_SECRET: randomBytes(32).toString('hex'),
      RESEARCH_CODE_SECRET: randomBytes(32).toString('hex'),
      ...fakes.env,
      NEXTAUTH_URL: `http://127.0.0.1:${port}`,
      PORT: String(port),
    });
    const reason = buildNeededBecause(root);
    if (reason) {
      console.log(`building the app (${reason}) ...`);
      if ((await runNextBuild(root, env)) !== 0) throw new Error('next build failed');
    }
    await seedDemoAt(database.databaseUrl);
    const server = await startNextServer(root, { port, env });
    const started = fakes;
    return {
      server,
      fakes: started,
      async stop() {
        await server.stop();
        await started.stop();
        await database.dispose();
      },
    };
  } catch (error) {
    await fakes?.stop();
    await database.dispose();
    throw error;
  }
}
