import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { createScratchDatabase, type ScratchDatabase } from './scratch-database';

let scratch: ScratchDatabase;
beforeAll(async () => {
  scratch = await createScratchDatabase();
  await scratch.db.migrate.latest();
});
beforeEach(async () => {
  await seedDemo(scratch.db);
});
afterAll(async () => {
  await scratch?.drop();
});

const newUser = (email: string) => ({ academy_id: 1, email, name: 'Test Person', password_hash: 'x', role: 'coach' });
const newAthlete = (overrides: Record<string, unknown> = {}) => ({ academy_id: 1, display_name: 'Test Athlete', ...overrides });

describe('constraints', () => {
  it('rejects a duplicate e-mail', async () => {
    await expect(scratch.db('users').insert(newUser('coach@stanceline.test'))).rejects.toMatchObject({ code: 'ER_DUP_ENTRY' });
  });

  it('rejects an e-mail that is not stored lower-case', async () => {
    await expect(scratch.db('users').insert(newUser('New.Coach@stanceline.test'))).rejects.toMatchObject({
      errno: 4025 // MariaDB ER_CONSTRAINT_FAILED (mysql2 names codes after MySQL's table),
    });
    await expect(scratch.db('users').insert(newUser('new.coach@stanceline.test'))).resolves.toBeDefined();
  });

  it('rejects a duplicate academy slug', async () => {
    await expect(scratch.db('academies').insert({ name: 'Other', slug: 'harrow-vale' })).rejects.toMatchObject({
      code: 'ER_DUP_ENTRY',
    });
  });

  it('rejects rows that point at missing parents', async () => {
    await expect(scratch.db('users').insert({ ...newUser('orphan@stanceline.test'), academy_id: 999 })).rejects.toMatchObject({
      code: 'ER_NO_REFERENCED_ROW_2',
    });
    await expect(scratch.db('coach_athletes').insert({ coach_user_id: 2, athlete_id: 999 })).rejects.toMatchObject({
      code: 'ER_NO_REFERENCED_ROW_2',
    });
    await expect(
      scratch.db('practice_sessions').insert({ athlete_id: 999, session_date: '2026-04-01', context: 'lesson' }),
    ).rejects.toMatchObject({ code: 'ER_NO_REFERENCED_ROW_2' });
  });

  it('links one account to at most one athlete and one coach to an athlete once', async () => {
    await expect(scratch.db('athletes').insert(newAthlete({ user_id: 4 }))).rejects.toMatchObject({ code: 'ER_DUP_ENTRY' });
    await expect(scratch.db('coach_athletes').insert({ coach_user_id: 2, athlete_id: 1 })).rejects.toMatchObject({
      code: 'ER_DUP_ENTRY',
    });
  });

  it('keeps stance width within 150..900 mm and enums within their values', async () => {
    await expect(scratch.db('athletes').insert(newAthlete({ stance_width_mm: 149 }))).rejects.toMatchObject({
      errno: 4025 // MariaDB ER_CONSTRAINT_FAILED (mysql2 names codes after MySQL's table),
    });
    await expect(scratch.db('athletes').insert(newAthlete({ stance_width_mm: 901 }))).rejects.toMatchObject({
      errno: 4025 // MariaDB ER_CONSTRAINT_FAILED (mysql2 names codes after MySQL's table),
    });
    await expect(scratch.db('athletes').insert(newAthlete({ handedness: 'both' }))).rejects.toMatchObject({
      code: 'WARN_DATA_TRUNCATED',
    });
    const [id] = await scratch.db('athletes').insert(newAthlete());
    const row = await scratch.db('athletes').where({ id }).first();
    expect(row).toMatchObject({ handedness: 'right', stance_width_mm: 400, date_of_birth: null });
  });

  it('deleting an athlete cascades to its coach links and sessions', async () => {
    expect(await scratch.db('practice_sessions').where({ athlete_id: 1 }).count({ n: '*' })).toEqual([{ n: 3 }]);
    await scratch.db('athletes').where({ id: 1 }).delete();
    expect(await scratch.db('practice_sessions').where({ athlete_id: 1 }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await scratch.db('coach_athletes').where({ athlete_id: 1 }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('refuses to delete a coach who still has athletes', async () => {
    await expect(scratch.db('users').where({ id: 2 }).delete()).rejects.toMatchObject({ code: 'ER_ROW_IS_REFERENCED_2' });
  });

  it("deleting a student's account keeps the athlete, unlinked", async () => {
    await scratch.db('users').where({ id: 4 }).delete();
    const athlete = await scratch.db('athletes').where({ id: 1 }).first();
    expect(athlete).toMatchObject({ display_name: 'Ada Fenwick', user_id: null });
  });
});
