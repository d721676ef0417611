// npm run db:start | db:stop | db:status | db:url — the project's own MariaDB (MARIADB_DIR, MARIADB_PORT).
import { databaseUrlFor, mariadbConfigFromEnv, mariadbStatus, startMariadb, stopMariadb } from './lib/mariadb';

const USAGE = 'usage: node --import tsx scripts/db.ts start|stop|status|url';

async function main(command: string | undefined): Promise<number> {
  const config = mariadbConfigFromEnv();
  switch (command) {
    case 'start': {
      const started = await startMariadb(config);
      console.log(
        started.alreadyRunning
          ? `MariaDB already running (pid ${started.pid}) on 127.0.0.1:${config.port}, dir ${config.dir}`
          : `MariaDB started (pid ${started.pid}) on 127.0.0.1:${config.port}, dir ${config.dir}`,
      );
      console.log(`DATABASE_URL=${started.databaseUrl}`);
      return 0;
    }
    case 'stop': {
      const { wasRunning } = await stopMariadb(config);
      console.log(wasRunning ? `MariaDB stopped (${config.dir})` : `MariaDB was not running (${config.dir})`);
      return 0;
    }
    case 'status': {
      const status = await mariadbStatus(config);
      if (status.running) console.log(`running: pid ${status.pid}, 127.0.0.1:${config.port}, dir ${config.dir}`);
      else if (status.pid) console.log(`process ${status.pid} exists but does not answer ping (dir ${config.dir})`);
      else console.log(`not running (dir ${config.dir})`);
      return status.running ? 0 : 3;
    }
    case 'url':
      // For shells: export DATABASE_URL=$(npm run -s db:url)
      console.log(databaseUrlFor(config));
      return 0;
    default:
      console.error(USAGE);
      return 2;
  }
}

main(process.argv[2]).then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
