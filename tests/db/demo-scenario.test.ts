import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { createScratchDatabase, type ScratchDatabase } from './scratch-database';

// What the demo scenario (db/demo/scenario.ts) promises, read back from the database.
let scratch: ScratchDatabase;
beforeAll(async () => {
  scratch = await createScratchDatabase();
  await scratch.db.migrate.latest();
  await seedDemo(scratch.db);
});
afterAll(async () => {
  await scratch?.drop();
});

async function rosterOf(coachEmail: string): Promise<string[]> {
  const rows = await scratch
    .db('coach_athletes as ca')
    .join('users as u', 'u.id', 'ca.coach_user_id')
    .join('athletes as a', 'a.id', 'ca.athlete_id')
    .where('u.email', coachEmail)
    .orderBy('a.display_name')
    .select<{ name: string }[]>({ name: 'a.display_name' });
  return rows.map((row) => row.name);
}

describe('seeded demo scenario', () => {
  it('has one academy, harrow-vale', async () => {
    expect(await scratch.db('academies').select('name', 'slug')).toEqual([
      { name: 'Harrow Vale Golf Academy', slug: 'harrow-vale' },
    ]);
  });

  it('has the five demo accounts with their roles, all active', async () => {
    const users = await scratch.db('users').orderBy('id').select('email', 'name', 'role', 'active');
    expect(users.map(({ email, role }) => [email, role])).toEqual([
      ['admin@stanceline.test', 'admin'],
      ['coach@stanceline.test', 'coach'],
      ['coach2@stanceline.test', 'coach'],
      ['student@stanceline.test', 'student'],
      ['researcher@stanceline.test', 'researcher'],
    ]);
    expect(users.find((user) => user.email === 'coach@stanceline.test')?.name).toBe('Maren Solberg');
    expect(users.find((user) => user.email === 'coach2@stanceline.test')?.name).toBe('Tobias Quill');
    // `active` is TINYINT(1); the typeCast in lib/db/connection.ts turns it into a boolean.
    expect(users.every((user) => user.active === true)).toBe(true);
  });

  it("makes the student Ada Fenwick an athlete of coach@ with her own login", async () => {
    const ada = await scratch
      .db('athletes as a')
      .join('users as u', 'u.id', 'a.user_id')
      .where('u.email', 'student@stanceline.test')
      .first('a.display_name as name');
    expect(ada?.name).toBe('Ada Fenwick');
    const roster = await rosterOf('coach@stanceline.test');
    expect(roster).toHaveLength(3);
    expect(roster).toContain('Ada Fenwick');
  });

  it('gives coach2@ three athletes of their own and six athletes in all', async () => {
    const first = await rosterOf('coach@stanceline.test');
    const second = await rosterOf('coach2@stanceline.test');
    expect(second).toHaveLength(3);
    expect(second.filter((name) => first.includes(name))).toEqual([]);
    expect(await scratch.db('athletes').count({ n: '*' })).toEqual([{ n: 6 }]);
  });

  it('includes a left-handed athlete and a minor with a date of birth', async () => {
    const athletes = await scratch.db('athletes').select('handedness', 'date_of_birth');
    expect(athletes.some((a) => a.handedness === 'left')).toBe(true);
    // DATE comes back as a 'YYYY-MM-DD' string (dateStrings in lib/db/connection.ts).
    const births = athletes.map((a) => a.date_of_birth).filter((d): d is string => d !== null);
    births.forEach((d) => expect(d).toMatch(/^\d{4}-\d{2}-\d{2}$/));
    // Under 18 on 2026-01-01: born after 2008-01-01 (ISO strings compare as dates).
    expect(births.some((d) => d > '2008-01-01')).toBe(true);
  });

  it('has sessions for every athlete in all three contexts, dated in 2026', async () => {
    const sessions = await scratch.db('practice_sessions').select('athlete_id', 'session_date', 'context');
    expect(new Set(sessions.map((s) => s.athlete_id))).toEqual(new Set([1, 2, 3, 4, 5, 6]));
    expect(new Set(sessions.map((s) => s.context))).toEqual(new Set(['lesson', 'practice', 'on-course']));
    sessions.forEach((s) => expect(s.session_date).toMatch(/^2026-\d{2}-\d{2}$/));
  });
});
