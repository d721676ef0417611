// Knex configuration for the CLI (npm run db:migrate / db:rollback / db:seed), scripts and tests.
// DATABASE_URL wins; without it, the project's own MariaDB (MARIADB_DIR, MARIADB_PORT) is used.
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Knex } from 'knex';
import { knexOptions } from './lib/db/connection';
import { databaseUrlFor, mariadbConfigFromEnv } from './scripts/lib/mariadb';

const root = dirname(fileURLToPath(import.meta.url));
export const migrationsDir = join(root, 'db', 'migrations');
export const seedsDir = join(root, 'db', 'seeds');

/**
 * Lists db/migrations/*.ts and loads each with a dynamic import from this module, so the same loader that read
 * this file (tsx for the CLI and scripts, Vite inside vitest) also compiles the migrations. Knex's own file
 * loader would call Node's import() directly, which cannot read TypeScript inside vitest.
 */
export class TsMigrationSource implements Knex.MigrationSource<string> {
  constructor(private readonly dir: string = migrationsDir) {}

  async getMigrations(): Promise<string[]> {
    return readdirSync(this.dir)
      .filter((name) => name.endsWith('.ts') && !name.endsWith('.d.ts'))
      .sort();
  }

  getMigrationName(name: string): string {
    return name;
  }

  async getMigration(name: string): Promise<Knex.Migration> {
    return (await import(pathToFileURL(join(this.dir, name)).href)) as Knex.Migration;
  }
}

export function resolveDatabaseUrl(env: NodeJS.ProcessEnv = process.env): string {
  return env.DATABASE_URL || databaseUrlFor(mariadbConfigFromEnv(env, root));
}

/** Full knex config for a database URL (defaults to resolveDatabaseUrl(), read when the first connection opens). */
export function knexConfig(databaseUrl?: string): Knex.Config {
  return {
    ...knexOptions(() => databaseUrl ?? resolveDatabaseUrl(), 3),
    migrations: { migrationSource: new TsMigrationSource(), tableName: 'knex_migrations' },
    // Seeds run under tsx (CLI, scripts), so knex's own loader is fine here; tests call the seed functions directly.
    seeds: { directory: seedsDir, loadExtensions: ['.ts'] },
  };
}

export default knexConfig();
