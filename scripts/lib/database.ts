// Migrate and seed a database by URL (scripts run under tsx, so knex's loaders can read the TypeScript files).
import knex from 'knex';
import { knexConfig } from '../../knexfile';
import { seedDemoRecordings } from '../../db/demo/recordings';
import { seedDemo, seedDemoIfEmpty } from '../../db/demo/seed-demo';
import { parseEnv } from '../../lib/env';
import { storeFromEnv } from '../../lib/storage';

async function withKnex<T>(databaseUrl: string, work: (db: knex.Knex) => Promise<T>): Promise<T> {
  const db = knex(knexConfig(databaseUrl));
  try {
    return await work(db);
  } finally {
    await db.destroy();
  }
}

/** Runs pending migrations; returns their names. */
export function migrateLatest(databaseUrl: string): Promise<string[]> {
  return withKnex(databaseUrl, async (db) => {
    const [, names] = (await db.migrate.latest()) as [number, string[]];
    return names;
  });
}

export const seedDemoIfEmptyAt = (databaseUrl: string) => withKnex(databaseUrl, seedDemoIfEmpty);
export const seedDemoAt = (databaseUrl: string) => withKnex(databaseUrl, seedDemo);

/** Adds the processed demo recordings, keeping their raw files in the store the app will use (same env). */
export const seedDemoRecordingsAt = (databaseUrl: string, appEnv: Record<string, string | undefined>) =>
  withKnex(databaseUrl, (db) => seedDemoRecordings(db, storeFromEnv(parseEnv({ ...appEnv, DATABASE_URL: databaseUrl, NODE_ENV: 'development' }))));
