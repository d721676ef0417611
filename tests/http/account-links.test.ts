import { beforeAll, describe, expect, it } from 'vitest';
import { accountLinkResponseSchema } from '@/lib/contracts/account-links';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';

// Linking a student account to a player: an admin for any player of the academy, a coach for a player on their
// roster; the student then sees that player. Role matrix, field errors and the one-player-per-account rule.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const people = new Map<Actor, HttpSession>();
const run = Date.now().toString(36);
let n = 0;

const send = (actor: Actor, method: string, path: string, body?: unknown) =>
  people.get(actor)!.json(path, { method, headers: body === undefined ? {} : { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });

async function newAthlete(): Promise<number> {
  const res = await send('coach', 'POST', '/api/athletes', { displayName: `Link Player ${run}-${++n}`, handedness: 'right', stanceWidthMm: 400, dateOfBirth: null, homeClub: null });
  expect(res.status).toBe(201);
  return (res.body as { athlete: { id: number } }).athlete.id;
}

async function newStudent(): Promise<string> {
  const email = `link-${run}-${++n}@stanceline.test`;
  const res = await send('admin', 'POST', '/api/users', { email, name: `Link Student ${run}-${n}`, role: 'student', password: 'a-long-enough-password' });
  expect(res.status).toBe(201);
  return email;
}

beforeAll(async () => {
  people.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors) if (actor !== 'none') people.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor], DEMO_PASSWORD));
});

describe('POST /api/athletes/:id/account', () => {
  it('a coach links a new student account to a player on their roster; the student then sees that player', async () => {
    const athleteId = await newAthlete();
    const email = await newStudent();
    const res = await send('coach', 'POST', `/api/athletes/${athleteId}/account`, { email: email.toUpperCase() });
    expect(res.status).toBe(200);
    expect(accountLinkResponseSchema.parse(res.body)).toMatchObject({ athleteId, account: { email } });
    const student = await signedIn(env.E2E_BASE_URL, email, 'a-long-enough-password');
    const mine = await student.json('/api/athletes');
    expect((mine.body as { athletes: { id: number }[] }).athletes.map((a) => a.id)).toEqual([athleteId]);
    // unlink: the student no longer sees the player
    expect((await send('coach', 'DELETE', `/api/athletes/${athleteId}/account`)).status).toBe(200);
    expect(((await student.json('/api/athletes')).body as { athletes: unknown[] }).athletes).toEqual([]);
  });

  it('refuses a non-student account, an unknown address and a bad one on the email field; one player per account', async () => {
    const athleteId = await newAthlete();
    const coachAccount = await send('coach', 'POST', `/api/athletes/${athleteId}/account`, { email: DEMO.coach2 });
    expect(coachAccount.status).toBe(422);
    expect((coachAccount.body as any).error.fieldErrors.email[0]).toMatch(/not a student account/);
    expect(((await send('coach', 'POST', `/api/athletes/${athleteId}/account`, { email: 'nobody@stanceline.test' })).body as any).error.fieldErrors.email).toBeDefined();
    expect(((await send('coach', 'POST', `/api/athletes/${athleteId}/account`, { email: 'not-an-address' })).body as any).error.fieldErrors.email).toBeDefined();
    expect((await send('coach', 'POST', `/api/athletes/${athleteId}/account`, { email: 'x@y.test', extra: 1 })).status).toBe(422);
    // the demo student is already Ada's (athlete 1)
    const taken = await send('coach', 'POST', `/api/athletes/${athleteId}/account`, { email: DEMO.student });
    expect(taken.status).toBe(409);
  });

  it('role matrix: admin any player of the academy, coach own roster, others refused', async () => {
    const expected: Record<Actor, number> = { none: 401, admin: 200, coach: 200, coach2: 404, student: 403, researcher: 403 };
    for (const actor of actors) {
      const athleteId = await newAthlete(); // coach@'s roster
      const email = await newStudent();
      const res = await send(actor, 'POST', `/api/athletes/${athleteId}/account`, { email });
      expect(res.status, actor).toBe(expected[actor]);
      expect((await send(actor, 'DELETE', `/api/athletes/${athleteId}/account`)).status, `${actor} DELETE`).toBe(expected[actor]);
    }
    // another coach: the same 404 as an unknown id
    const email = await newStudent();
    const athleteId = await newAthlete();
    const existing = await send('coach2', 'POST', `/api/athletes/${athleteId}/account`, { email });
    const unknown = await send('coach2', 'POST', '/api/athletes/999999/account', { email });
    expect(existing).toEqual(unknown);
  });
});
