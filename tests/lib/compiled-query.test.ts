// compileOnce (lib/db/compiled.ts) on the real integration MariaDB: the SQL text made once gives the same rows as
// knex's builder made afresh for each value, and a parameter that would end up in the SQL text is refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/client';
import { compileOnce } from '@/lib/db/compiled';
import { resetToDemo } from './db-fixture';

beforeAll(async () => {
  await resetToDemo();
});
afterAll(async () => {
  await closeDb();
});

describe('compileOnce', () => {
  const build = (conn: typeof db, academyId: number, role: string) =>
    conn('users as u').leftJoin('athletes as a', (j) => j.on('a.user_id', 'u.id').andOnVal('a.academy_id', academyId)).where({ 'u.academy_id': academyId, 'u.role': role }).orderBy('u.id').select('u.id', 'u.email', 'u.active', 'a.id as athlete_id');
  const compiled = compileOnce(2, build);

  it('gives the rows the builder gives, for every value', async () => {
    for (const academyId of [1, 2, 999]) {
      for (const role of ['admin', 'coach', 'student', 'researcher', "o'brien"]) {
        const expected = await build(db, academyId, role);
        expect(await compiled.rows(db, academyId, role)).toEqual(expected);
      }
    }
    expect((await compiled.rows(db, 1, 'student')).length).toBeGreaterThan(0);
  });

  it('keeps one SQL text with placeholders, never a value', async () => {
    const sql = compiled.sql(db);
    expect(sql).toBe(build(db, 1, 'coach').toSQL().toNative().sql);
    expect(sql).not.toContain('coach');
  });

  it('refuses a parameter that is not a binding', () => {
    const bad = compileOnce(1, (conn, column: string) => conn('users').select(conn.raw(column)));
    expect(() => bad.sql(db)).toThrow(/SQL text|not a binding/);
    const unused = compileOnce<[number, number]>(2, (conn, id) => conn('users').where({ id }));
    expect(() => unused.sql(db)).toThrow(/parameter 1 is not a binding/);
  });
});
