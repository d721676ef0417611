// npm start: the project's MariaDB, migrations, the demo (only into an empty database), a kept NEXTAUTH_SECRET,
// a build when sources changed, then `next start` on 127.0.0.1:PORT.
// Ctrl-C stops Next and the local fakes; MariaDB keeps running for a fast restart (`npm run db:stop` stops it).
import { DEMO_PASSWORD, DEMO_USERS } from '../db/demo/scenario';
import { migrateLatest, seedDemoIfEmptyAt, seedDemoRecordingsAt } from './lib/database';
import { ensureFfmpegInstalled } from './lib/ffmpeg';
import { startLocalFakes } from './lib/local-fakes';
import { mariadbConfigFromEnv, startMariadb } from './lib/mariadb';
import { ensureNextauthSecret, ensureResearchCodeSecret } from './lib/nextauth-secret';
import { buildNeededBecause, nextEnv, runNextBuild, startNextServer, type NextServer } from './lib/next-server';

const root = process.cwd();

function parsePort(raw: string | undefined): number {
  const port = Number(raw ?? '3000');
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`PORT must be a TCP port number, got "${raw}"`);
  return port;
}

async function main(): Promise<number> {
  const port = parsePort(process.env.PORT);
  await ensureFfmpegInstalled();
  let databaseUrl = process.env.DATABASE_URL;
  if (databaseUrl) {
    console.log('Using DATABASE_URL from the environment (the project MariaDB is not started).');
  } else {
    const config = mariadbConfigFromEnv();
    const started = await startMariadb(config);
    databaseUrl = started.databaseUrl;
    console.log(`MariaDB ${started.alreadyRunning ? 'already running' : 'started'} on 127.0.0.1:${config.port} (${config.dir})`);
  }

  const applied = await migrateLatest(databaseUrl);
  console.log(applied.length ? `Applied migrations: ${applied.join(', ')}` : 'Database schema is up to date.');
  const fakes = await startLocalFakes();
  if (fakes.names.length) console.log(`Local fakes: ${fakes.names.join(', ')}`);

  if (await seedDemoIfEmptyAt(databaseUrl)) {
    const ready = await seedDemoRecordingsAt(databaseUrl, { ...process.env, ...fakes.env });
    console.log(`Empty database: seeded the demo academy and processed ${ready} demo recordings.`);
  }

  const url = `http://127.0.0.1:${port}`;
  const env = nextEnv({
    ...fakes.env,
    DATABASE_URL: databaseUrl,
    NEXTAUTH_SECRET: ensureNextauthSecret(root),
    RESEARCH_CODE_SECRET: ensureResearchCodeSecret(root),
    NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? url,
    PORT: String(port),
  });

  let server: NextServer | undefined;
  let stopping = false;
  const shutdown = async (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n${signal}: stopping Next${fakes.names.length ? ' and the local fakes' : ''}; MariaDB keeps running (npm run db:stop).`);
    await server?.stop();
    await fakes.stop();
    process.exit(signal === 'SIGINT' ? 130 : 143);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));

  try {
    const reason = buildNeededBecause(root);
    if (reason) {
      console.log(`Building the app (${reason}) ...`);
      const code = await runNextBuild(root, env);
      if (code !== 0) throw new Error(`next build failed (exit ${code}); fix the errors above and run npm start again`);
    }
    server = await startNextServer(root, { port, env });
  } catch (error) {
    await fakes.stop();
    throw error;
  }

  console.log(`\nStanceline is running at ${server.url}`);
  console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`);
  for (const user of DEMO_USERS) console.log(`  ${user.email.padEnd(28)} ${user.role.padEnd(11)} ${user.name}`);
  console.log('Press Ctrl-C to stop.');

  const code = await server.exited;
  if (!stopping) await fakes.stop();
  return code;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
