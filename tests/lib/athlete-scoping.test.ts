import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Viewer } from '@/lib/auth/viewer';
import {
  createAthleteForCoach,
  findAthleteForViewer,
  getAthleteForViewer,
  listAthletesForViewer,
  updateAthleteForViewer,
} from '@/lib/db/athletes';
import { closeDb, db } from '@/lib/db/client';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import { listAcademyUsers, updateAcademyUser } from '@/lib/db/users';
import { NotFoundError, ForbiddenError } from '@/lib/http';
import { resetToDemo } from './db-fixture';

// Demo scenario ids (db/demo/scenario.ts): users 1 admin, 2 coach@, 3 coach2@, 4 student@ (athlete 1), 5 researcher@;
// athletes 1-3 on coach@'s roster, 4-6 on coach2@'s.
const viewer = (id: number, role: Viewer['role']): Viewer => ({ id, role, academyId: 1, name: 'x', email: 'x@stanceline.test' });
const admin = viewer(1, 'admin');
const coachA = viewer(2, 'coach');
const coachB = viewer(3, 'coach');
const student = viewer(4, 'student');
const researcher = viewer(5, 'researcher');

beforeEach(async () => {
  await resetToDemo();
});
afterAll(async () => {
  await resetToDemo(); // leave the shared test database as the demo scenario
  await closeDb();
});

describe('listAthletesForViewer(viewer, filters)', () => {
  it('a coach sees only the athletes linked to them', async () => {
    expect((await listAthletesForViewer(coachA)).map((a) => a.id).sort()).toEqual([1, 2, 3]);
    expect((await listAthletesForViewer(coachB)).map((a) => a.id).sort()).toEqual([4, 5, 6]);
  });

  it('a student sees only their own athlete profile', async () => {
    expect((await listAthletesForViewer(student)).map((a) => a.displayName)).toEqual(['Ada Fenwick']);
  });

  it('admins and researchers see no athletes through the roster query', async () => {
    expect(await listAthletesForViewer(admin)).toEqual([]);
    expect(await listAthletesForViewer(researcher)).toEqual([]);
  });

  it('a coach of another academy sees nothing, even with a link row', async () => {
    await db('academies').insert({ id: 2, name: 'Elsewhere Academy', slug: 'elsewhere' });
    const outsider = viewer(2, 'coach');
    expect(await listAthletesForViewer({ ...outsider, academyId: 2 })).toEqual([]);
  });

  it('filters by name or club text, handedness and session context', async () => {
    expect((await listAthletesForViewer(coachA, { q: 'FENW' })).map((a) => a.id)).toEqual([1]);
    expect((await listAthletesForViewer(coachA, { q: 'Fernmoor' })).map((a) => a.id)).toEqual([2]); // home club
    expect((await listAthletesForViewer(coachA, { handedness: 'left' })).map((a) => a.id)).toEqual([2]);
    // on-course sessions in the demo: athletes 1 (2026-03-03) and 3 (2026-03-10)
    expect((await listAthletesForViewer(coachA, { context: 'on-course' })).map((a) => a.id).sort()).toEqual([1, 3]);
  });

  it('treats LIKE wildcards in the search text literally', async () => {
    expect(await listAthletesForViewer(coachA, { q: '%' })).toEqual([]);
    expect(await listAthletesForViewer(coachA, { q: '_' })).toEqual([]);
  });

  it('carries the date and context of the latest session', async () => {
    const [ada] = await listAthletesForViewer(coachA, { q: 'Ada' });
    expect(ada.lastSession).toEqual({ date: '2026-03-03', context: 'on-course' });
    expect(ada.dateOfBirth).toBe('1994-03-12');
  });
});

describe('single athlete access', () => {
  it('another coach gets "not found" for an athlete outside their roster', async () => {
    expect(await findAthleteForViewer(coachB, 1)).toBeNull();
    await expect(getAthleteForViewer(coachB, 1)).rejects.toBeInstanceOf(NotFoundError);
    await expect(updateAthleteForViewer(coachB, 1, { stanceWidthMm: 500 })).rejects.toBeInstanceOf(NotFoundError);
    expect((await getAthleteForViewer(coachA, 1)).stanceWidthMm).toBe(380);
  });

  it('a student cannot open another athlete', async () => {
    expect(await findAthleteForViewer(student, 2)).toBeNull();
  });

  it('a new athlete joins the creating coach’s roster only', async () => {
    const created = await createAthleteForCoach(coachA, {
      displayName: 'Test Newcomer',
      handedness: 'left',
      stanceWidthMm: 420,
      dateOfBirth: '2011-05-01',
      homeClub: null,
    });
    expect(created).toMatchObject({ displayName: 'Test Newcomer', handedness: 'left', stanceWidthMm: 420, dateOfBirth: '2011-05-01', lastSession: null });
    expect((await listAthletesForViewer(coachA)).map((a) => a.id)).toContain(created.id);
    expect((await listAthletesForViewer(coachB)).map((a) => a.id)).not.toContain(created.id);
  });

  it('updates only the fields sent', async () => {
    const updated = await updateAthleteForViewer(coachA, 2, { homeClub: 'Harrow Vale Golf Club' });
    expect(updated).toMatchObject({ displayName: 'Jonah Pelliker', handedness: 'left', homeClub: 'Harrow Vale Golf Club' });
  });

  it('lists sessions newest first', async () => {
    const sessions = await listSessionsForAthlete(1);
    expect(sessions.map((s) => s.sessionDate)).toEqual(['2026-03-03', '2026-02-17', '2026-02-10']);
  });
});

describe('academy users', () => {
  it('lists the five demo accounts of the academy', async () => {
    expect((await listAcademyUsers(1)).map((u) => u.email).sort()).toEqual([
      'admin@stanceline.test',
      'coach2@stanceline.test',
      'coach@stanceline.test',
      'researcher@stanceline.test',
      'student@stanceline.test',
    ]);
  });

  it('an admin cannot deactivate themselves', async () => {
    await expect(updateAcademyUser({ id: 1, academyId: 1 }, 1, { active: false })).rejects.toBeInstanceOf(ForbiddenError);
    expect(await updateAcademyUser({ id: 1, academyId: 1 }, 3, { active: false })).toMatchObject({ id: 3, active: false });
  });
});
