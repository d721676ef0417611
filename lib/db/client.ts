// The one knex client of the app. Cached on globalThis so Next's dev reloads and route bundles share one pool.
import 'server-only';
import type { Knex } from 'knex';
import { getEnv } from '@/lib/env';
import { createKnex } from '@/lib/db/connection';

const globalForDb = globalThis as typeof globalThis & { __stancelineDb?: Knex };

function createDb(): Knex {
  // Small pool: one Node process, a 2-core machine, MariaDB max_connections 60 shared with tests.
  return createKnex(getEnv().DATABASE_URL, 5);
}

/** The shared knex instance (created on first call). */
export function getDb(): Knex {
  globalForDb.__stancelineDb ??= createDb();
  return globalForDb.__stancelineDb;
}

/**
 * `db` is the same client, created on first use rather than at import, so importing a module that uses it (for
 * example while `next build` collects pages) does not need DATABASE_URL yet. Use it exactly like a knex instance.
 */
export const db: Knex = new Proxy(function lazyDb() {} as unknown as Knex, {
  apply: (_target, thisArg, args: unknown[]) => Reflect.apply(getDb() as unknown as (...a: unknown[]) => unknown, thisArg, args),
  get: (_target, property) => {
    const real = getDb();
    const value: unknown = Reflect.get(real, property, real);
    return typeof value === 'function' ? (value as (...a: unknown[]) => unknown).bind(real) : value;
  },
  has: (_target, property) => Reflect.has(getDb(), property),
});

/** Closes the pool (tests and scripts call this so the process can exit). */
export async function closeDb(): Promise<void> {
  const instance = globalForDb.__stancelineDb;
  globalForDb.__stancelineDb = undefined;
  await instance?.destroy();
}
