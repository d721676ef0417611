import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@/db/demo/scenario';
import { seedDemo, seedDemoIfEmpty, TABLES_CHILD_FIRST } from '@/db/demo/seed-demo';
import { createScratchDatabase, type ScratchDatabase } from './scratch-database';

let scratch: ScratchDatabase;
beforeAll(async () => {
  scratch = await createScratchDatabase();
  await scratch.db.migrate.latest();
});
afterAll(async () => {
  await scratch?.drop();
});

/** Every row of every app table, timestamps left out (they record when the seed ran). */
async function snapshot() {
  const result: Record<string, unknown[]> = {};
  for (const table of TABLES_CHILD_FIRST) {
    const rows = await scratch.db(table).select('*').orderByRaw('1, 2');
    result[table] = rows.map(({ created_at: _c, updated_at: _u, ...rest }) => rest);
  }
  return result;
}

describe('demo seed', () => {
  it('seedDemoIfEmpty seeds an empty database and leaves a populated one alone', async () => {
    expect(await seedDemoIfEmpty(scratch.db)).toBe(true);
    await scratch.db('users').where({ email: 'coach2@stanceline.test' }).update({ name: 'Renamed By Test' });
    expect(await seedDemoIfEmpty(scratch.db)).toBe(false);
    const coach2 = await scratch.db('users').where({ email: 'coach2@stanceline.test' }).first();
    expect(coach2.name).toBe('Renamed By Test');
  });

  it('is idempotent: two runs give identical rows, ids and e-mails', async () => {
    await seedDemo(scratch.db);
    const first = await snapshot();
    await seedDemo(scratch.db);
    const second = await snapshot();
    expect(second).toEqual(first);
    expect(first.users.map((user) => (user as { email: string }).email)).toEqual([
      'admin@stanceline.test',
      'coach@stanceline.test',
      'coach2@stanceline.test',
      'student@stanceline.test',
      'researcher@stanceline.test',
    ]);
    expect(first.users.map((user) => (user as { id: number }).id)).toEqual([1, 2, 3, 4, 5]);
    expect(first.athletes).toHaveLength(6);
  });

  it('resets rows added since the last seed', async () => {
    await seedDemo(scratch.db);
    await scratch.db('login_attempts').insert({ email: 'x@y.test', ip: '127.0.0.1', succeeded: false, attempted_at: new Date() });
    await seedDemo(scratch.db);
    expect(await scratch.db('login_attempts').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('stores bcrypt hashes that verify against the demo password', async () => {
    await seedDemo(scratch.db);
    const users = await scratch.db('users').select('email', 'password_hash');
    for (const user of users) {
      expect(user.password_hash).toMatch(/^\$2[aby]\$10\$/);
      expect(bcrypt.compareSync(DEMO_PASSWORD, user.password_hash)).toBe(true);
      expect(bcrypt.compareSync('wrong-password', user.password_hash)).toBe(false);
    }
  });
});
