import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { athleteListResponseSchema, athleteResponseSchema } from '@/lib/contracts/athletes';
import { bandBinnedResponseSchema, bandResponseSchema, bandsResponseSchema } from '@/lib/contracts/bands';
import { assignmentBinnedResponseSchema, assignmentResponseSchema, assignmentsResponseSchema, drillBinnedResponseSchema, drillResponseSchema, drillsResponseSchema } from '@/lib/contracts/drills';
import { sweepBin } from '@/lib/sessions/bin';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, serverStore } from './support/recordings-http';
import { roleRequests } from './support/role-matrix';

// Edit and delete of what a coach fills in, against the running app: archive and restore a player, the bin of
// drills, bands and drill assignments (delete -> hidden everywhere -> restore within 30 days, 409 after, the sweep),
// a band's rename and share. Each route with the role matrix: no session 401, admin and researcher 403, another
// coach 404 for what is not theirs to know (lib/auth/access.ts), the student 403 on what they see but may not change.
// Demo ids (db/demo): athlete 1 = student@'s player on coach@'s (user 2) roster; drills 1-3 coach@'s; assignment 1 =
// drill 1 to athlete 1.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, HttpSession>();
let db: Knex;
/** a drill binned 31 days ago: the sweep at the end removes it */
let oldDrillId = 0;

const { send, matrix } = roleRequests(sessions, actors, 'coach');

const binnedDaysAgo = (table: string, id: number, days: number) => db(table).where({ id }).update({ binned_at: db.raw(`NOW(3) - INTERVAL ${days} DAY`) });

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  sessions.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors.filter((a) => a !== 'none')) sessions.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor as Exclude<Actor, 'none'>], DEMO_PASSWORD));
});

afterAll(async () => {
  await seedDemo(db);
  await db.destroy();
});

describe('players: archive keeps the data', () => {
  it('DELETE /api/athletes/:id archives: off the roster, page and sessions kept; restore puts them back', async () => {
    const before = athleteListResponseSchema.parse((await send('coach', 'GET', '/api/athletes')).body).athletes.length;
    await matrix('DELETE', '/api/athletes/1', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    const one = athleteResponseSchema.parse((await send('coach', 'GET', '/api/athletes/1')).body).athlete;
    expect(one.archivedAt).not.toBeNull();
    const roster = athleteListResponseSchema.parse((await send('coach', 'GET', '/api/athletes')).body).athletes;
    expect(roster.map((a) => a.id)).not.toContain(1);
    expect(roster).toHaveLength(before - 1);
    const archived = athleteListResponseSchema.parse((await send('coach', 'GET', '/api/athletes?archived=true')).body).athletes;
    expect(archived.map((a) => a.id)).toEqual([1]);
    // nothing removed: the sessions still answer, for the coach and for the player themself
    expect((await send('coach', 'GET', '/api/athletes/1/sessions')).status).toBe(200);
    expect((await send('student', 'GET', '/api/athletes/1')).status).toBe(200);

    await matrix('POST', '/api/athletes/1/restore', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect(athleteResponseSchema.parse((await send('coach', 'GET', '/api/athletes/1')).body).athlete.archivedAt).toBeNull();
    expect(athleteListResponseSchema.parse((await send('coach', 'GET', '/api/athletes')).body).athletes).toHaveLength(before);
    expect((await send('coach', 'DELETE', '/api/athletes/999999')).status).toBe(404);
  });
});

describe('drills: the bin', () => {
  it('DELETE /api/drills/:id bins the drill and its assignments; restore brings both back; 409 after 30 days', async () => {
    const del = await send('coach', 'DELETE', '/api/drills/1');
    expect(del.status).toBe(200);
    const binned = drillBinnedResponseSchema.parse(del.body).drill;
    expect(binned).toMatchObject({ id: 1 });
    expect(binned.binnedAt).not.toBeNull();
    // gone from the library, from the coach's and the student's assignment lists, and from further writes
    expect(drillsResponseSchema.parse((await send('coach', 'GET', '/api/drills')).body).drills.map((d) => d.id)).not.toContain(1);
    expect(assignmentsResponseSchema.parse((await send('student', 'GET', '/api/drill-assignments')).body).assignments.map((a) => a.drill.id)).not.toContain(1);
    expect((await send('coach', 'PATCH', '/api/drills/1', { name: 'x' })).status).toBe(404);
    expect((await send('student', 'PATCH', '/api/drill-assignments/1', { practiceDone: true })).status).toBe(404);

    await matrix('POST', '/api/drills/1/restore', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect(drillsResponseSchema.parse((await send('coach', 'GET', '/api/drills')).body).drills.map((d) => d.id)).toContain(1);
    expect(assignmentsResponseSchema.parse((await send('student', 'GET', '/api/drill-assignments')).body).assignments.map((a) => a.id)).toContain(1);
    // a drill not in the bin has nothing to restore
    expect((await send('coach', 'POST', '/api/drills/1/restore')).status).toBe(404);

    const id = drillResponseSchema.parse(
      (await send('coach', 'POST', '/api/drills', { name: 'Old drill', steps: ['One.'], addressesChecks: [], cautions: 'Stop on pain.' })).body,
    ).drill.id;
    await matrix('DELETE', `/api/drills/${id}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    await binnedDaysAgo('drills', id, 31);
    oldDrillId = id;
    const late = await send('coach', 'POST', `/api/drills/${id}/restore`);
    expect(late.status).toBe(409);
    expect((late.body as { error: { message: string } }).error.message).toMatch(/30 days/);
  });
});

describe('drill assignments: the bin', () => {
  it('DELETE /api/drill-assignments/:id: the coach takes it back (student 403); restore within 30 days', async () => {
    await matrix('DELETE', '/api/drill-assignments/1', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect((await send('coach', 'GET', '/api/drill-assignments')).status).toBe(200);
    const student = assignmentsResponseSchema.parse((await send('student', 'GET', '/api/drill-assignments')).body).assignments;
    expect(student.map((a) => a.id)).not.toContain(1);
    // the binned assignment is unknown to every read and write until restored
    expect((await send('student', 'PATCH', '/api/drill-assignments/1', { practiceDone: true })).status).toBe(404);
    expect((await send('coach', 'DELETE', '/api/drill-assignments/1')).status).toBe(404);

    await matrix('POST', '/api/drill-assignments/1/restore', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    const back = assignmentsResponseSchema.parse((await send('student', 'GET', '/api/drill-assignments')).body).assignments;
    expect(back.map((a) => a.id)).toContain(1);

    const del = assignmentBinnedResponseSchema.parse((await send('coach', 'DELETE', '/api/drill-assignments/1')).body).assignment;
    expect(del.id).toBe(1);
    await binnedDaysAgo('drill_assignments', 1, 31);
    expect((await send('coach', 'POST', '/api/drill-assignments/1/restore')).status).toBe(409);
    await db('drill_assignments').where({ id: 1 }).update({ binned_at: null });
    expect(assignmentResponseSchema.parse((await send('student', 'PATCH', '/api/drill-assignments/1', { practiceDone: false })).body).assignment.id).toBe(1);
  });
});

describe('bands: edit and the bin', () => {
  let bandId = 0;
  beforeAll(async () => {
    // the route under test never reads the curves, so an empty band row stands in for a built one
    const [id] = await db('bands').insert({ academy_id: 1, owner_user_id: 2, name: 'Mid irons, spring', swing_ids: '[]', parameters: '{}', k: 1, shared: false, data: '{}' });
    bandId = Number(id);
  });

  it('PATCH /api/bands/:id renames and shares (the builder only); field errors on bad input', async () => {
    await matrix('PATCH', `/api/bands/${bandId}`, { name: 'Mid irons, April', shared: true }, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    const band = bandResponseSchema.parse((await send('coach', 'PATCH', `/api/bands/${bandId}`, { name: 'Mid irons, April' })).body).band;
    expect(band).toMatchObject({ id: bandId, name: 'Mid irons, April', shared: true });
    // shared now: the other coach of the academy sees it but may not change it
    expect((await send('coach2', 'PATCH', `/api/bands/${bandId}`, { shared: false })).status).toBe(403);
    const bad = await send('coach', 'PATCH', `/api/bands/${bandId}`, { name: '' });
    expect(bad.status).toBe(422);
    expect(Object.keys((bad.body as { error: { fieldErrors: Record<string, unknown> } }).error.fieldErrors)).toContain('name');
    expect((await send('coach', 'PATCH', `/api/bands/${bandId}`, { k: 2 })).status).toBe(422);
  });

  it('DELETE /api/bands/:id bins it; restore within 30 days; the sweep removes old ones', async () => {
    await matrix('DELETE', `/api/bands/${bandId}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 403, student: 403, researcher: 403 });
    // in the bin: unknown to a second delete
    expect((await send('coach', 'DELETE', `/api/bands/${bandId}`)).status).toBe(404);
    const listed = bandsResponseSchema.parse((await send('coach', 'GET', '/api/bands')).body).bands;
    expect(listed.map((b) => b.id)).not.toContain(bandId);
    expect((await send('coach', 'GET', `/api/bands/${bandId}`)).status).toBe(404);
    await matrix('POST', `/api/bands/${bandId}/restore`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect(bandsResponseSchema.parse((await send('coach', 'GET', '/api/bands')).body).bands.map((b) => b.id)).toContain(bandId);

    const again = await send('coach', 'DELETE', `/api/bands/${bandId}`);
    expect(again.status).toBe(200);
    const binned = bandBinnedResponseSchema.parse(again.body).band;
    expect(binned).toMatchObject({ id: bandId, name: 'Mid irons, April' });
    expect(binned.restorableUntil).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    await binnedDaysAgo('bands', bandId, 31);
    expect((await send('coach', 'POST', `/api/bands/${bandId}/restore`)).status).toBe(409);
    const store = serverStore();
    if (!store) return;
    const swept = await sweepBin(db, store);
    expect(swept.library).toBeGreaterThanOrEqual(1);
    expect(await db('bands').where({ id: bandId }).first('id')).toBeUndefined();
    expect(await db('drills').where({ id: oldDrillId }).first('id')).toBeUndefined();
    // a drill never binned stays
    expect(await db('drills').where({ id: 1 }).first('id')).toBeDefined();
  });
});
