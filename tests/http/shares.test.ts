import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorResponseSchema } from '@/lib/contracts/errors';
import { shareBinnedResponseSchema, shareListResponseSchema, shareResponseSchema } from '@/lib/contracts/shares';
import { sweepBin } from '@/lib/sessions/bin';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, serverStore } from './support/recordings-http';
import { roleRequests } from './support/role-matrix';

// What a coach sent a student, after sending: the note edited (PATCH /api/shares/:id), the share removed to the bin
// (DELETE) and brought back (POST .../restore) or swept after 30 days, and the coach's list per player
// (GET /api/athletes/:id/shares). Role matrix as in the rest of the API: no session 401, admin and researcher 403, the
// student 403 (a coach's route), another coach 404 with the same answer as an unknown id.
// Demo ids (db/demo): athlete 1 = student@'s player on coach@'s roster; session 1 is theirs.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, HttpSession>();
let db: Knex;
const made: number[] = [];

const { send, matrix } = roleRequests(sessions, actors, 'coach');

async function share(note: string): Promise<number> {
  const res = await send('coach', 'POST', '/api/shares', { sessionId: 1, note });
  expect(res.status).toBe(201);
  const id = shareResponseSchema.parse(res.body).share.id;
  made.push(id);
  return id;
}

const studentShareIds = async () => shareListResponseSchema.parse((await send('student', 'GET', '/api/shares')).body).shares.map((s) => s.id);
const coachShareIds = async () => shareListResponseSchema.parse((await send('coach', 'GET', '/api/athletes/1/shares')).body).shares.map((s) => s.id);

beforeAll(async () => {
  db = serverDb();
  sessions.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors.filter((a) => a !== 'none')) sessions.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor as Exclude<Actor, 'none'>], DEMO_PASSWORD));
});

afterAll(async () => {
  if (made.length > 0) await db('shares').whereIn('id', made).delete();
  await db.destroy();
});

describe('GET /api/athletes/:id/shares', () => {
  it('the coach reads what was sent to the player, newest first; the role matrix', async () => {
    const first = await share('First look at the lesson.');
    const second = await share('Second look.');
    const ids = await coachShareIds();
    expect(ids.indexOf(second)).toBeGreaterThanOrEqual(0);
    expect(ids.indexOf(second)).toBeLessThan(ids.indexOf(first));
    const shares = shareListResponseSchema.parse((await send('coach', 'GET', '/api/athletes/1/shares')).body).shares;
    expect(shares.every((s) => s.athleteId === 1)).toBe(true);
    const times = shares.map((s) => s.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(shares.find((s) => s.id === first)).toMatchObject({ kind: 'lesson', sessionId: 1, swingId: null, note: 'First look at the lesson.', href: '/sessions/1/summary' });
    await matrix('GET', '/api/athletes/1/shares', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
  });
});

describe('PATCH /api/shares/:id', () => {
  it('the coach edits the note (trimmed; empty clears it); others as the rest of the API', async () => {
    const id = await share('Before the edit.');
    await matrix('PATCH', `/api/shares/${id}`, { note: '  After the edit.  ' }, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    const edited = await send('coach', 'PATCH', `/api/shares/${id}`, { note: '  After the edit.  ' });
    expect(shareResponseSchema.parse(edited.body).share).toMatchObject({ id, note: 'After the edit.' });
    // the student reads the new note
    const seen = shareListResponseSchema.parse((await send('student', 'GET', '/api/shares')).body).shares.find((s) => s.id === id);
    expect(seen?.note).toBe('After the edit.');
    const cleared = await send('coach', 'PATCH', `/api/shares/${id}`, { note: '   ' });
    expect(cleared.status).toBe(200);
    expect(shareResponseSchema.parse(cleared.body).share.note).toBeNull();
  });

  it('another coach gets exactly the answer of an unknown id', async () => {
    const id = await share('Not for the other coach.');
    const other = await send('coach2', 'PATCH', `/api/shares/${id}`, { note: 'x' });
    const unknown = await send('coach', 'PATCH', '/api/shares/999999999', { note: 'x' });
    expect(other.status).toBe(404);
    expect(unknown.status).toBe(404);
    expect(other.body).toEqual(unknown.body);
    expect((await send('coach2', 'DELETE', `/api/shares/${id}`)).body).toEqual((await send('coach', 'DELETE', '/api/shares/999999999')).body);
  });

  it('422 names the field: too long, not text, missing', async () => {
    const id = await share('Kept as it is.');
    for (const body of [{ note: 'x'.repeat(501) }, { note: 5 }, {}]) {
      const res = await send('coach', 'PATCH', `/api/shares/${id}`, body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      const error = errorResponseSchema.parse(res.body).error;
      expect(Object.keys(error.fieldErrors ?? {})).toEqual(['note']);
    }
    // 500 characters are accepted
    expect((await send('coach', 'PATCH', `/api/shares/${id}`, { note: 'y'.repeat(500) })).status).toBe(200);
  });
});

describe('the bin of shares', () => {
  it('DELETE -> gone from the student and the coach list -> restore -> back', async () => {
    const id = await share('To the bin and back.');
    expect(await studentShareIds()).toContain(id);
    await matrix('DELETE', `/api/shares/${id}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect(await studentShareIds()).not.toContain(id);
    expect(await coachShareIds()).not.toContain(id);
    // in the bin: unknown to a second delete and to an edit
    expect((await send('coach', 'DELETE', `/api/shares/${id}`)).status).toBe(404);
    expect((await send('coach', 'PATCH', `/api/shares/${id}`, { note: 'x' })).status).toBe(404);
    await matrix('POST', `/api/shares/${id}/restore`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 });
    expect(await studentShareIds()).toContain(id);
    expect(await coachShareIds()).toContain(id);
    // not in the bin: nothing to restore
    expect((await send('coach', 'POST', `/api/shares/${id}/restore`)).status).toBe(404);

    const again = await send('coach', 'DELETE', `/api/shares/${id}`);
    expect(again.status).toBe(200);
    const binned = shareBinnedResponseSchema.parse(again.body).share;
    expect(binned.id).toBe(id);
    expect(binned.name).toMatch(/^Lesson summary of \d{4}-\d{2}-\d{2}$/);
    expect(binned.restorableUntil).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });

  it('after 30 days: restore 409, the sweep removes it; a share not binned stays', async () => {
    const old = await share('Removed long ago.');
    const kept = await share('Still here.');
    expect((await send('coach', 'DELETE', `/api/shares/${old}`)).status).toBe(200);
    await db('shares').where({ id: old }).update({ binned_at: db.raw('NOW(3) - INTERVAL 31 DAY') });
    expect((await send('coach', 'POST', `/api/shares/${old}/restore`)).status).toBe(409);
    const store = serverStore();
    if (!store) return;
    const swept = await sweepBin(db, store);
    expect(swept.shares).toBeGreaterThanOrEqual(1);
    expect(await db('shares').where({ id: old }).first('id')).toBeUndefined();
    expect(await db('shares').where({ id: kept }).first('id')).toBeDefined();
  });
});
