// A scratch database (stanceline_t<random>) on the test server, so migration and seed tests never disturb the
// shared `stanceline` database other integration tests use.
import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';
import { inject } from 'vitest';
import { knexConfig } from '@/knexfile';

export interface ScratchDatabase {
  db: Knex;
  name: string;
  drop(): Promise<void>;
}

export function testDatabaseUrl(): string {
  return process.env.DATABASE_URL || inject('databaseUrl');
}

export async function createScratchDatabase(): Promise<ScratchDatabase> {
  const baseUrl = new URL(testDatabaseUrl());
  const name = `stanceline_t${randomBytes(4).toString('hex')}`;
  const admin = knex(knexConfig(baseUrl.href));
  await admin.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [name]);
  const scratchUrl = new URL(baseUrl.href);
  scratchUrl.pathname = `/${name}`;
  const db = knex(knexConfig(scratchUrl.href));
  return {
    db,
    name,
    async drop() {
      await db.destroy();
      await admin.raw('DROP DATABASE IF EXISTS ??', [name]);
      await admin.destroy();
    },
  };
}

/** Base tables of the current database, sorted. */
export async function listTables(db: Knex): Promise<string[]> {
  const rows = await db('information_schema.tables')
    .select<{ name: string }[]>({ name: 'table_name' })
    .whereRaw('table_schema = database()')
    .andWhere('table_type', 'BASE TABLE');
  return rows.map((row) => row.name).sort();
}
