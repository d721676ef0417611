// Global setup of the `integration` project. With DATABASE_URL set (npm test passes its throwaway server), it only
// migrates to latest; without it, it starts its own throwaway MariaDB and removes it in teardown.
import knex from 'knex';
import type { TestProject } from 'vitest/node';
import { knexConfig } from '../../knexfile';
import { startThrowawayMariadb, type ThrowawayMariadb } from '../../scripts/lib/throwaway-mariadb';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

let server: ThrowawayMariadb | undefined;

export async function setup(project: TestProject): Promise<void> {
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    server = await startThrowawayMariadb();
    databaseUrl = server.databaseUrl;
    process.env.DATABASE_URL = databaseUrl;
  }
  const db = knex(knexConfig(databaseUrl));
  try {
    await db.migrate.latest();
  } finally {
    await db.destroy();
  }
  project.provide('databaseUrl', databaseUrl);
}

export async function teardown(): Promise<void> {
  await server?.dispose();
  server = undefined;
}
