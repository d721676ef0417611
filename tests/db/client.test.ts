import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db, getDb } from '@/lib/db/client';

// The app's client on the shared test database (migrated by tests/setup/global-db.ts).
afterAll(async () => {
  await closeDb();
});

describe('lib/db/client', () => {
  it('returns one cached instance', () => {
    expect(getDb()).toBe(getDb());
  });

  it('db works like a knex instance: queries, raw and transactions', async () => {
    const [rows] = await db.raw('SELECT 1 + 1 AS two');
    expect(rows).toEqual([{ two: 2 }]);
    const tables = await db('information_schema.tables').whereRaw('table_schema = database()').pluck('table_name');
    expect(tables).toContain('users');
    const inside = await db.transaction(async (trx) => (await trx.raw('SELECT @@in_transaction AS t'))[0][0].t);
    expect(inside).toBe(1);
  });

  it('returns DATE as YYYY-MM-DD and DATETIME as Date in UTC', async () => {
    const [[row]] = await db.raw("SELECT DATE('2026-03-01') AS d, TIMESTAMP('2026-03-01 12:34:56') AS dt, @@session.time_zone AS tz");
    expect(row.d).toBe('2026-03-01');
    expect(row.dt).toBeInstanceOf(Date);
    expect((row.dt as Date).toISOString()).toBe('2026-03-01T12:34:56.000Z');
    expect(row.tz).toBe('+00:00');
  });
});
