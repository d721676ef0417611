import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb } from './support/recordings-http';

// The targets and drills routes against the running app: the role matrix of every route (a student reads their
// own targets and drills and writes only "practice done"; admin and researcher 403; another coach 404 for what is not
// theirs to know (lib/auth/access.ts); no session 401)
// and what the seeded common-practice defaults and demo drills look like.
// Demo ids (db/demo/scenario.ts, targets.ts, drills.ts): athlete 1 Ada Fenwick = student@, on coach@'s (user 2)
// roster; targets 1-4 the academy defaults, 5 coach@'s target for Ada; drills 1-3 coach@'s; assignment 1 = drill 1 to Ada.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, HttpSession>();
let db: Knex;

const send = (actor: Actor, method: string, path: string, body?: unknown) =>
  sessions.get(actor)!.json(path, { method, headers: body === undefined ? {} : { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });

async function matrix(method: string, path: string, body: (() => unknown) | undefined, expected: Record<Actor, number>) {
  const got = {} as Record<Actor, number>;
  // the owner last, so that a DELETE it makes does not turn the others' answers into 404
  for (const actor of [...actors.filter((a) => a !== 'coach'), 'coach' as const]) {
    const res = await send(actor, method, path, body?.());
    got[actor] = res.status;
    if (res.status >= 400) expect(res.contentType).toContain('application/json');
  }
  expect(got).toEqual(expected);
}

const newTarget = (athleteId: number | null = null) => ({
  name: 'Test target',
  clubGroup: 'irons',
  athleteId,
  checks: [{ event: 'impact', measure: 'leadPct', expected: 80, tolerance: 10 }],
  tempo: null,
});
const newDrill = () => ({ name: 'Test drill', steps: ['Step one.'], addressesChecks: [{ event: 'top', measure: 'trailHeelPct' }], cautions: 'Stop on pain.' });

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

describe('targets', () => {
  it('GET /api/targets role matrix', async () => {
    await matrix('GET', '/api/targets', undefined, { none: 401, admin: 403, coach: 200, coach2: 200, student: 200, researcher: 403 });
  });

  it('seeds one common-practice default per club group, saying so', async () => {
    const { body } = await send('coach', 'GET', '/api/targets');
    const targets = (body as { targets: any[] }).targets;
    const defaults = targets.filter((t) => t.isDefault);
    expect(defaults.map((t) => t.clubGroup).sort()).toEqual(['driver', 'irons', 'wedges', 'woods-hybrids']);
    for (const t of defaults) {
      expect(t.commonPractice).toBe(true);
      expect(`${t.name} ${t.description}`).toMatch(/common practice/i);
      expect(t.description).toMatch(/physician or physiotherapist/); // the usual caution: see a physician or physiotherapist on pain (common practice; low back pain is the most common golf
      // complaint: Lindsay & Vandervoort 2014, Asian J Sports Med 5(4):e24289)
    }
    expect(targets.map((t) => t.id)).toContain(5);
  });

  it('a student sees the defaults and the target made for them, not another coach’s', async () => {
    const created = await send('coach2', 'POST', '/api/targets', newTarget());
    expect(created.status).toBe(201);
    const ids = ((await send('student', 'GET', '/api/targets')).body as { targets: { id: number }[] }).targets.map((t) => t.id);
    expect(ids).toEqual(expect.arrayContaining([1, 2, 3, 4, 5]));
    expect(ids).not.toContain((created.body as { target: { id: number } }).target.id);
  });

  it('POST /api/targets role matrix, and a target for an athlete only by their coach', async () => {
    await matrix('POST', '/api/targets', () => newTarget(), { none: 401, admin: 403, coach: 201, coach2: 201, student: 403, researcher: 403 });
    await matrix('POST', '/api/targets', () => newTarget(1), { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 });
  });

  it('422 names the field that is wrong', async () => {
    const res = await send('coach', 'POST', '/api/targets', { ...newTarget(), checks: [{ event: 'impact', measure: 'leadPct', expected: 80, tolerance: -1 }] });
    expect(res.status).toBe(422);
    expect(Object.keys((res.body as any).error.fieldErrors)).toContain('checks.0.tolerance');
  });

  it('PATCH and DELETE /api/targets/:id role matrix; defaults editable but not deletable', async () => {
    await matrix('PATCH', '/api/targets/5', () => ({ name: 'Ada: wedges, softer shift' }), { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    await matrix('PATCH', '/api/targets/3', () => ({ description: 'Common practice starting point; edited in a test.' }), { none: 401, admin: 403, coach: 200, coach2: 200, student: 403, researcher: 403 });
    const mine = ((await send('coach', 'POST', '/api/targets', newTarget())).body as { target: { id: number } }).target.id;
    await matrix('DELETE', `/api/targets/${mine}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect((await send('coach', 'DELETE', '/api/targets/1')).status).toBe(409);
    expect((await send('coach', 'PATCH', '/api/targets/999999', { name: 'x' })).status).toBe(404);
  });
});

describe('drills', () => {
  it('GET /api/drills: the coach’s library with cautions; the student the drills given to them', async () => {
    await matrix('GET', '/api/drills', undefined, { none: 401, admin: 403, coach: 200, coach2: 200, student: 200, researcher: 403 });
    const coach = (await send('coach', 'GET', '/api/drills')).body as { drills: any[]; caution: string };
    expect(coach.drills.map((d) => d.id)).toEqual([1, 2, 3]);
    for (const d of coach.drills) expect(d.cautions).toMatch(/physician or physiotherapist/);
    expect(coach.caution).toMatch(/parent or guardian/);
    expect(((await send('coach2', 'GET', '/api/drills')).body as { drills: unknown[] }).drills).toEqual([]);
    expect(((await send('student', 'GET', '/api/drills')).body as { drills: { id: number }[] }).drills.map((d) => d.id)).toEqual([1]);
  });

  it('POST, PATCH, DELETE /api/drills role matrix (own library only)', async () => {
    await matrix('POST', '/api/drills', newDrill, { none: 401, admin: 403, coach: 201, coach2: 201, student: 403, researcher: 403 });
    await matrix('PATCH', '/api/drills/2', () => ({ name: 'Trail-heel coil check' }), { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    const id = ((await send('coach', 'POST', '/api/drills', newDrill())).body as { drill: { id: number } }).drill.id;
    await matrix('DELETE', `/api/drills/${id}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    const bad = await send('coach', 'POST', '/api/drills', { ...newDrill(), cautions: '' });
    expect(bad.status).toBe(422);
    expect(Object.keys((bad.body as any).error.fieldErrors)).toContain('cautions');
  });

  it('assignments: the coach assigns, everyone else is refused; lists per role', async () => {
    await matrix('POST', '/api/athletes/1/drill-assignments', () => ({ drillId: 2, dueDate: '2026-12-20' }), { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 });
    await matrix('GET', '/api/athletes/1/drill-assignments', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 });
    await matrix('GET', '/api/drill-assignments', undefined, { none: 401, admin: 403, coach: 200, coach2: 200, student: 200, researcher: 403 });
    const own = (await send('student', 'GET', '/api/drill-assignments')).body as { assignments: { athleteId: number }[] };
    expect(own.assignments.length).toBe(2);
    expect(own.assignments.every((a) => a.athleteId === 1)).toBe(true);
    expect(((await send('coach2', 'GET', '/api/drill-assignments')).body as { assignments: unknown[] }).assignments).toEqual([]);
    const bad = await send('coach', 'POST', '/api/athletes/1/drill-assignments', { drillId: 2, dueDate: '20-12-2026' });
    expect(bad.status).toBe(422);
    expect(Object.keys((bad.body as any).error.fieldErrors)).toContain('dueDate');
  });

  it('PATCH /api/drill-assignments/:id: the student writes only "practice done" and a note', async () => {
    await matrix('PATCH', '/api/drill-assignments/1', () => ({ practiceDone: true, studentNote: 'Did three sets.' }), { none: 401, admin: 403, coach: 403, coach2: 404, student: 200, researcher: 403 });
    const done = await send('student', 'GET', '/api/drill-assignments');
    const a = (done.body as { assignments: any[] }).assignments.find((x) => x.id === 1);
    expect(a).toMatchObject({ practiceDone: true, studentNote: 'Did three sets.' });
    expect(a.doneAt).not.toBeNull();
    // the student can take "done" back, and mark it again
    const undone = await send('student', 'PATCH', '/api/drill-assignments/1', { practiceDone: false });
    expect(undone.status).toBe(200);
    expect((undone.body as any).assignment).toMatchObject({ practiceDone: false, doneAt: null });
    expect((await send('student', 'PATCH', '/api/drill-assignments/1', { practiceDone: true })).status).toBe(200);
    expect((await send('student', 'PATCH', '/api/drill-assignments/1', { dueDate: '2026-12-31' })).status).toBe(403);
    const moved = await send('coach', 'PATCH', '/api/drill-assignments/1', { dueDate: '2026-02-18' });
    expect(moved.status).toBe(200);
    expect((moved.body as any).assignment.dueDate).toBe('2026-02-18');
    expect((await send('student', 'PATCH', '/api/drill-assignments/999999', { practiceDone: true })).status).toBe(404);
  });

  it('GET /api/sessions/:id/drill-report role matrix and shape', async () => {
    await matrix('GET', '/api/sessions/2/drill-report', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 });
    const r = (await send('coach', 'GET', '/api/sessions/2/drill-report')).body as any;
    expect(r.assignments.map((a: any) => a.drill.id)).toContain(1);
    const a = r.assignments.find((x: any) => x.id === 1);
    expect(a.checks.map((c: any) => `${c.event}.${c.measure}`)).toEqual(['impact.leadPct', 'transition.leadPct']);
    // session 1 (2026-02-10) is before the assignment (2026-02-11): its report has no assignment yet
    expect(((await send('coach', 'GET', '/api/sessions/1/drill-report')).body as any).assignments).toEqual([]);
  });
});
