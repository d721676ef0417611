import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { sampleRecording } from './support/recordings-http';

// Every athlete, user and me route handler (and the athlete routes added since) x every role (+ no session). Expected statuses follow the access rules:
// - no session -> 401 JSON; a role without access -> 403 JSON;
// - an athlete outside the viewer's scope (coach B asking for coach A's athlete, a student asking for someone
//   else) -> 404, not 403: the API does not confirm that ids on other rosters exist.
// Demo ids (db/demo/scenario.ts): athlete 1 = Ada Fenwick (coach@, and student@'s own profile), athlete 4 on
// coach2@'s roster.

type Actor = 'none' | 'admin' | 'coach' | 'coach2' | 'student' | 'researcher';
const actors: Actor[] = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'];

type Case = { method: 'GET' | 'POST' | 'PATCH' | 'DELETE'; path: string; body?: () => unknown; expected: Record<Actor, number> };

// Unique per run: the same database may serve several runs.
const run = Date.now().toString(36);
let counter = 0;
const newAthlete = () => ({
  displayName: `Matrix Athlete ${run}-${++counter}`,
  handedness: 'left',
  stanceWidthMm: 420,
  dateOfBirth: null,
  homeClub: null,
});
const newUser = () => ({
  email: `matrix-${run}-${++counter}@stanceline.test`,
  name: `Matrix User ${run}-${counter}`,
  role: 'coach',
  password: 'a-long-enough-password',
});

const newInvitation = () => ({ email: `matrix-invite-${run}-${++counter}@stanceline.test`, role: 'student', athleteId: 3 });

// PATCH keeps Ada's seeded stance width, so later tests see the demo data unchanged.
const cases: Case[] = [
  // liveness: open to anyone, says nothing about anyone
  { method: 'GET', path: '/api/health', expected: { none: 200, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
  { method: 'GET', path: '/api/me', expected: { none: 401, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
  { method: 'GET', path: '/api/athletes', expected: { none: 401, admin: 403, coach: 200, coach2: 200, student: 200, researcher: 403 } },
  { method: 'POST', path: '/api/athletes', body: newAthlete, expected: { none: 401, admin: 403, coach: 201, coach2: 201, student: 403, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/1', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/4', expected: { none: 401, admin: 403, coach: 404, coach2: 200, student: 404, researcher: 403 } },
  { method: 'PATCH', path: '/api/athletes/1', body: () => ({ stanceWidthMm: 380 }), expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/1/sessions', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/999999', expected: { none: 401, admin: 403, coach: 404, coach2: 404, student: 404, researcher: 403 } },
  // compare and progress answered 403 for an existing id and 404 for an unknown one; now 404 for both (lib/auth/access.ts)
  { method: 'GET', path: '/api/athletes/1/compare?a=context:lesson&b=context:practice&metrics=impact.leadPct', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/999999/compare?a=context:lesson&b=context:practice&metrics=impact.leadPct', expected: { none: 401, admin: 403, coach: 404, coach2: 404, student: 404, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/1/progress?metrics=impact.leadPct', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/999999/progress?metrics=impact.leadPct', expected: { none: 401, admin: 403, coach: 404, coach2: 404, student: 404, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/1/drill-assignments', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/not-a-number', expected: { none: 401, admin: 403, coach: 404, coach2: 404, student: 404, researcher: 403 } },
  { method: 'GET', path: '/api/users', expected: { none: 401, admin: 200, coach: 403, coach2: 403, student: 403, researcher: 403 } },
  { method: 'POST', path: '/api/users', body: newUser, expected: { none: 401, admin: 201, coach: 403, coach2: 403, student: 403, researcher: 403 } },
  // user 5 = the demo researcher; admin sets the role it already has, so the demo stays intact.
  { method: 'PATCH', path: '/api/users/5', body: () => ({ role: 'researcher' }), expected: { none: 401, admin: 200, coach: 403, coach2: 403, student: 403, researcher: 403 } },
  { method: 'PATCH', path: '/api/users/1', body: () => ({ active: false }), expected: { none: 401, admin: 403, coach: 403, coach2: 403, student: 403, researcher: 403 } },
  { method: 'PATCH', path: '/api/users/999999', body: () => ({ active: true }), expected: { none: 401, admin: 404, coach: 403, coach2: 403, student: 403, researcher: 403 } },
  // accounts by e-mail: invitations (admin any role; coach students for their own roster: athlete 3 is coach@'s)
  { method: 'GET', path: '/api/invitations', expected: { none: 401, admin: 200, coach: 200, coach2: 200, student: 403, researcher: 403 } },
  { method: 'POST', path: '/api/invitations', body: newInvitation, expected: { none: 401, admin: 201, coach: 201, coach2: 404, student: 403, researcher: 403 } },
  { method: 'DELETE', path: '/api/invitations/999999', expected: { none: 401, admin: 404, coach: 404, coach2: 404, student: 403, researcher: 403 } },
  { method: 'POST', path: '/api/invitations/999999/resend', expected: { none: 401, admin: 404, coach: 404, coach2: 404, student: 403, researcher: 403 } },
  // public: the token is the credential; a token that matches nothing is 400 for everyone
  { method: 'POST', path: '/api/invitations/accept', body: () => ({ token: 'A'.repeat(43), password: 'a-long-enough-password' }), expected: { none: 400, admin: 400, coach: 400, coach2: 400, student: 400, researcher: 400 } },
  { method: 'POST', path: '/api/password-reset', body: () => ({ email: `matrix-reset-${run}-${++counter}@stanceline.test` }), expected: { none: 202, admin: 202, coach: 202, coach2: 202, student: 202, researcher: 202 } },
  { method: 'POST', path: '/api/password-reset/confirm', body: () => ({ token: 'A'.repeat(43), password: 'a-long-enough-password' }), expected: { none: 400, admin: 400, coach: 400, coach2: 400, student: 400, researcher: 400 } },
  // sharing: session 1 is Ada's (coach@'s player, linked to student@)
  { method: 'GET', path: '/api/shares', expected: { none: 401, admin: 403, coach: 403, coach2: 403, student: 200, researcher: 403 } },
  { method: 'POST', path: '/api/shares', body: () => ({ sessionId: 1 }), expected: { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 } },
  { method: 'GET', path: '/api/athletes/1/shares', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
  { method: 'GET', path: '/api/me/mail-preferences', expected: { none: 401, admin: 403, coach: 403, coach2: 403, student: 200, researcher: 403 } },
  { method: 'PATCH', path: '/api/me/mail-preferences', body: () => ({ drillReminders: true }), expected: { none: 401, admin: 403, coach: 403, coach2: 403, student: 200, researcher: 403 } },
  // demo mode (npm test runs the SMTP fake): admins only
  { method: 'GET', path: '/api/outbox', expected: { none: 401, admin: 200, coach: 403, coach2: 403, student: 403, researcher: 403 } },
  // remote reviews: coach@ withdraws the seeded offer (afterAll offers it again); coach2@ has no offer, so 404
  { method: 'DELETE', path: '/api/review-offer', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
];

const sessions = new Map<Actor, HttpSession>();

beforeAll(async () => {
  const { E2E_BASE_URL } = e2eEnv();
  sessions.set('none', new HttpSession(E2E_BASE_URL));
  for (const actor of actors.filter((a): a is Exclude<Actor, 'none'> => a !== 'none')) {
    sessions.set(actor, await signedIn(E2E_BASE_URL, DEMO[actor], DEMO_PASSWORD));
  }
});

// the DELETE /api/review-offer case withdrew coach@'s offer: offer it again (the seeded values) for the files after this
afterAll(async () => {
  const res = await sessions.get('coach')?.json('/api/review-offer', { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }) });
  expect(res?.status).toBe(200);
});

describe('access matrix', () => {
  for (const c of cases) {
    for (const actor of actors) {
      const expected = c.expected[actor];
      it(`${c.method} ${c.path} as ${actor} -> ${expected}`, async () => {
        const session = sessions.get(actor)!;
        const init: RequestInit = { method: c.method };
        if (c.body) {
          init.body = JSON.stringify(c.body());
          init.headers = { 'content-type': 'application/json' };
        }
        const res = await session.json(c.path, init);
        expect(res.status).toBe(expected);
        // Every answer of these handlers is JSON, errors included.
        expect(res.contentType).toContain('application/json');
        if (expected >= 400) {
          expect(res.body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
        }
      });
    }
  }
});

// One answer for "not yours": for another coach, an object on someone else's roster or in someone else's library
// answers exactly like an id that does not exist (same status, same error code and message), so ids cannot be probed.
describe('another coach cannot tell an existing id from an unknown one', () => {
  const UNKNOWN = 999999;
  const probes: { what: string; method: 'GET' | 'PATCH' | 'DELETE' | 'POST'; path: (id: number) => string; body?: unknown; id: () => Promise<number> }[] = [
    { what: 'athlete', method: 'GET', path: (id) => `/api/athletes/${id}`, id: async () => 1 },
    { what: 'athlete (compare)', method: 'GET', path: (id) => `/api/athletes/${id}/compare?a=context:lesson&b=context:practice&metrics=impact.leadPct`, id: async () => 1 },
    { what: 'athlete (progress)', method: 'GET', path: (id) => `/api/athletes/${id}/progress?metrics=impact.leadPct`, id: async () => 1 },
    { what: 'session', method: 'GET', path: (id) => `/api/sessions/${id}/recordings`, id: async () => 1 },
    { what: 'session (drill report)', method: 'GET', path: (id) => `/api/sessions/${id}/drill-report`, id: async () => 1 },
    { what: 'recording', method: 'GET', path: (id) => `/api/recordings/${id}`, id: async () => (await sample()).recordingId },
    { what: 'recording (overview)', method: 'GET', path: (id) => `/api/recordings/${id}/overview`, id: async () => (await sample()).recordingId },
    { what: 'swing', method: 'GET', path: (id) => `/api/swings/${id}`, id: async () => (await sample()).swingId },
    { what: 'swing (score)', method: 'GET', path: (id) => `/api/swings/${id}/score`, id: async () => (await sample()).swingId },
    { what: 'swing (overlay list)', method: 'GET', path: (id) => `/api/swings/${id}/overlay-options`, id: async () => (await sample()).swingId },
    { what: 'target', method: 'PATCH', path: (id) => `/api/targets/${id}`, body: { name: 'Probe' }, id: async () => 5 },
    { what: 'drill', method: 'PATCH', path: (id) => `/api/drills/${id}`, body: { name: 'Probe' }, id: async () => 1 },
    { what: 'drill assignment', method: 'PATCH', path: (id) => `/api/drill-assignments/${id}`, body: { dueDate: '2026-12-24' }, id: async () => 1 },
  ];
  // a recording and a swing of coach@'s (uploaded once for this file)
  const sample = () => sampleRecording(sessions.get('coach')!);
  for (const probe of probes) {
    it(`${probe.what}: coach2 gets the same 404 for coach@'s ${probe.what} as for an unknown id`, async () => {
      const coach2 = sessions.get('coach2')!;
      const init: RequestInit = { method: probe.method };
      if (probe.body) {
        init.body = JSON.stringify(probe.body);
        init.headers = { 'content-type': 'application/json' };
      }
      const existing = await coach2.json(probe.path(await probe.id()), init);
      const unknown = await coach2.json(probe.path(UNKNOWN), init);
      expect(existing.status).toBe(404);
      expect(unknown.status).toBe(404);
      expect(existing.body).toEqual(unknown.body);
    });
  }
});

describe('scoping and validation details', () => {
  it('a coach lists only their own athletes', async () => {
    const res = await sessions.get('coach')!.json('/api/athletes');
    const names = (res.body as { athletes: { displayName: string }[] }).athletes.map((a) => a.displayName);
    expect(names).toContain('Ada Fenwick');
    expect(names).not.toContain('Rafe Dunmoor'); // coach2's athlete in the demo scenario
  });

  it('a student sees exactly their own profile', async () => {
    const res = await sessions.get('student')!.json('/api/athletes');
    const athletes = (res.body as { athletes: { id: number; displayName: string }[] }).athletes;
    expect(athletes.map((a) => a.displayName)).toEqual(['Ada Fenwick']);
  });

  it('filters by search text, handedness and session context', async () => {
    const coach = sessions.get('coach')!;
    const byName = (await coach.json('/api/athletes?q=fenw')).body as { athletes: { displayName: string }[] };
    expect(byName.athletes.map((a) => a.displayName)).toEqual(['Ada Fenwick']);
    const lefties = (await coach.json('/api/athletes?handedness=left')).body as { athletes: { handedness: string }[] };
    expect(lefties.athletes.length).toBeGreaterThan(0);
    expect(lefties.athletes.every((a) => a.handedness === 'left')).toBe(true);
    const onCourse = (await coach.json('/api/athletes?context=on-course')).body as { athletes: { displayName: string }[] };
    expect(onCourse.athletes.map((a) => a.displayName)).toContain('Ada Fenwick'); // seeded on-course session 2026-03-03
    expect(onCourse.athletes.map((a) => a.displayName)).not.toContain('Jonah Pelliker'); // lesson + practice only
  });

  it('rejects an unknown filter value with 422 and the field name', async () => {
    const res = await sessions.get('coach')!.json('/api/athletes?context=bunker');
    expect(res.status).toBe(422);
    expect(res.body).toMatchObject({ error: { fieldErrors: { context: expect.any(Array) } } });
  });

  it('POST /api/athletes answers 422 with field errors from the shared schema', async () => {
    const res = await sessions.get('coach')!.json('/api/athletes', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ displayName: '', handedness: 'both', stanceWidthMm: 1200, dateOfBirth: '2099-01-01', homeClub: null }),
    });
    expect(res.status).toBe(422);
    const fieldErrors = (res.body as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors;
    expect(Object.keys(fieldErrors).sort()).toEqual(['dateOfBirth', 'displayName', 'handedness', 'stanceWidthMm']);
    expect(fieldErrors.stanceWidthMm[0]).toMatch(/at most 900 mm/);
  });

  it('a malformed JSON body is a 422, not a 500', async () => {
    const res = await sessions.get('coach')!.json('/api/athletes', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"displayName":',
    });
    expect(res.status).toBe(422);
  });

  it('the last session date and context come with each athlete', async () => {
    const res = await sessions.get('coach')!.json('/api/athletes/1');
    // Ada's latest seeded session: 2026-03-03, on-course (db/demo/scenario.ts)
    expect(res.body).toMatchObject({ athlete: { displayName: 'Ada Fenwick', lastSession: { date: '2026-03-03', context: 'on-course' } } });
  });

  it('a changing request from another site (Origin header) is refused with 403', async () => {
    const res = await sessions.get('coach')!.json('/api/athletes', {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: 'http://elsewhere.example' },
      body: JSON.stringify(newAthlete()),
    });
    expect(res.status).toBe(403);
  });

  it('deactivating an account or changing its role takes effect on the next request', async () => {
    const admin = sessions.get('admin')!;
    const account = { ...newUser(), role: 'coach' };
    const created = await admin.json('/api/users', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(account),
    });
    expect(created.status).toBe(201);
    const id = (created.body as { user: { id: number } }).user.id;
    const member = await signedIn(e2eEnv().E2E_BASE_URL, account.email, account.password);
    expect((await member.json('/api/athletes')).status).toBe(200);

    const patch = (body: unknown) =>
      admin.json(`/api/users/${id}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    expect((await patch({ role: 'researcher' })).status).toBe(200);
    expect((await member.json('/api/athletes')).status).toBe(403); // same session cookie, new role
    expect((await patch({ active: false })).status).toBe(200);
    expect((await member.json('/api/me')).status).toBe(401); // same session cookie, account deactivated
  });

  it('a duplicate email for a new account is a 409', async () => {
    const res = await sessions.get('admin')!.json('/api/users', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: DEMO.coach, name: 'Copy', role: 'coach', password: 'a-long-enough-password' }),
    });
    expect(res.status).toBe(409);
  });
});
