import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionRecordingsSchema } from '@/lib/contracts/recordings';
import { binnedRecordingSchema, sessionResponseSchema } from '@/lib/contracts/sessions';
import { sweepBin } from '@/lib/sessions/bin';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, serverStore, settled, upload } from './support/recordings-http';

// The sessions API against the running app: create, edit, bin, restore and the sweep; deleting a recording; the
// session's swing list with labels and a session-wide number; the role matrix of every new route.
// Every session here belongs to an athlete this file creates on coach@'s roster, so the demo athletes stay as seeded.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const people = new Map<Actor, HttpSession>();
let db: Knex;
let athleteId: number;
const run = Date.now().toString(36);

const send = (actor: Actor, method: string, path: string, body?: unknown) =>
  people.get(actor)!.json(path, { method, headers: body === undefined ? {} : { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
const fieldErrors = (body: unknown) => (body as { error: { fieldErrors?: Record<string, string[]> } }).error.fieldErrors ?? {};

/** An invented golf session from the synthetic generator, stamped with when it was recorded (spec/insole-csv.md `recorded_at`). */
function golfFile(seed: number, swings: number, recordedAt: string): string {
  const csv = generateSession({ seed, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings, withMarker: true }).csv();
  const [first, ...rest] = csv.split('\n');
  return [first, `# recorded_at: ${recordedAt}`, ...rest].join('\n');
}

async function newSession(body: Record<string, unknown> = { date: '2026-04-02', context: 'lesson' }): Promise<number> {
  const res = await send('coach', 'POST', `/api/athletes/${athleteId}/sessions`, body);
  expect(res.status).toBe(201);
  return sessionResponseSchema.parse(res.body).id;
}

async function uploadInto(sessionId: number, name: string, content: string): Promise<number> {
  const res = await upload(people.get('coach')!, { athleteId, sessionId, handedness: 'right', stanceWidthMm: 380 }, [{ name, content }]);
  expect(res.status).toBe(202);
  const id = res.body.recordings[0].id as number;
  const done = await settled(people.get('coach')!, id);
  expect(done.status).toBe('ready');
  return id;
}

beforeAll(async () => {
  people.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors) if (actor !== 'none') people.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor], DEMO_PASSWORD));
  db = serverDb();
  const athlete = await send('coach', 'POST', '/api/athletes', { displayName: `Session Player ${run}`, handedness: 'right', stanceWidthMm: 380, dateOfBirth: null, homeClub: null });
  expect(athlete.status).toBe(201);
  athleteId = (athlete.body as { athlete: { id: number } }).athlete.id;
});
afterAll(async () => {
  await db?.destroy();
});

describe('POST /api/athletes/:id/sessions', () => {
  it('answers 201 with the new session, which the athlete’s list then shows', async () => {
    const res = await send('coach', 'POST', `/api/athletes/${athleteId}/sessions`, { date: '2026-04-05', context: 'on-course', location: 'Hollowmere, hole 7', notes: 'wind from the left' });
    expect(res.status).toBe(201);
    const session = sessionResponseSchema.parse(res.body);
    expect(session).toMatchObject({ athleteId, sessionDate: '2026-04-05', context: 'on-course', location: 'Hollowmere, hole 7', notes: 'wind from the left', binnedAt: null });
    const list = await send('coach', 'GET', `/api/athletes/${athleteId}/sessions`);
    expect((list.body as { sessions: { id: number }[] }).sessions.map((s) => s.id)).toContain(session.id);
  });

  it('refuses bad input with 422 naming each field, and unknown fields', async () => {
    const bad = await send('coach', 'POST', `/api/athletes/${athleteId}/sessions`, { date: '2026-13-40', context: 'bunker', location: 'x'.repeat(121) });
    expect(bad.status).toBe(422);
    expect(Object.keys(fieldErrors(bad.body)).sort()).toEqual(['context', 'date', 'location']);
    const unknown = await send('coach', 'POST', `/api/athletes/${athleteId}/sessions`, { date: '2026-04-05', context: 'lesson', weather: 'rain' });
    expect(unknown.status).toBe(422);
    const missing = await send('coach', 'POST', `/api/athletes/${athleteId}/sessions`, { context: 'lesson' });
    expect(Object.keys(fieldErrors(missing.body))).toEqual(['date']);
  });
});

describe('PATCH /api/sessions/:id', () => {
  it('changes only the fields sent; an empty place clears it', async () => {
    const id = await newSession({ date: '2026-04-06', context: 'practice', location: 'Bay 3', notes: 'wedges' });
    const res = await send('coach', 'PATCH', `/api/sessions/${id}`, { context: 'lesson', location: '' });
    expect(res.status).toBe(200);
    expect(sessionResponseSchema.parse(res.body)).toMatchObject({ id, sessionDate: '2026-04-06', context: 'lesson', location: null, notes: 'wedges' });
    const empty = await send('coach', 'PATCH', `/api/sessions/${id}`, {});
    expect(empty.status).toBe(422);
    const bad = await send('coach', 'PATCH', `/api/sessions/${id}`, { date: 'yesterday' });
    expect(Object.keys(fieldErrors(bad.body))).toEqual(['date']);
  });
});

describe('the session’s swing list', () => {
  it('numbers swings 1..N over the session in time order with the file beside each, and carries their labels', async () => {
    const id = await newSession();
    // uploaded later but recorded earlier: its swings come first
    const later = await uploadInto(id, 'second-half.csv', golfFile(31, 2, '2026-04-02T10:30:00Z'));
    const earlier = await uploadInto(id, 'first-half.csv', golfFile(32, 3, '2026-04-02T10:00:00Z'));
    const view = sessionRecordingsSchema.parse((await send('coach', 'GET', `/api/sessions/${id}/recordings`)).body);
    expect(view.swings.map((s) => s.number)).toEqual(view.swings.map((_, i) => i + 1));
    const files = view.swings.map((s) => s.filename);
    const firstLater = files.indexOf('second-half.csv');
    expect(firstLater).toBeGreaterThan(0);
    expect(files.slice(0, firstLater).every((f) => f === 'first-half.csv')).toBe(true);
    expect(files.slice(firstLater).every((f) => f === 'second-half.csv')).toBe(true);
    expect(view.swings.every((s) => s.recordingId === (s.filename === 'first-half.csv' ? earlier : later))).toBe(true);
    // within one file, in time order
    for (const f of ['first-half.csv', 'second-half.csv']) {
      const starts = view.swings.filter((s) => s.filename === f).map((s) => s.startS);
      expect(starts).toEqual([...starts].sort((a, b) => a - b));
    }
    const target = view.swings[view.swings.length - 1];
    expect(target.labels).toEqual({ club: null, strike: null, flight: null, tags: [], rating: null });
    const put = await send('coach', 'PATCH', `/api/swings/${target.id}`, { labels: { club: 'iron-7', strike: 'thin', flight: 'fade', tags: ['tempo'], rating: 3 } });
    expect(put.status).toBe(200);
    const after = sessionRecordingsSchema.parse((await send('coach', 'GET', `/api/sessions/${id}/recordings`)).body);
    expect(after.swings.find((s) => s.id === target.id)!.labels).toEqual({ club: 'iron-7', strike: 'thin', flight: 'fade', tags: ['tempo'], rating: 3 });
    expect(after.swings.map((s) => s.number)).toEqual(view.swings.map((s) => s.number));
  });
});

describe('the bin', () => {
  it('DELETE /api/sessions/:id bins the session with its recordings; restore brings all of it back', async () => {
    const id = await newSession({ date: '2026-04-07', context: 'practice' });
    const rec = await uploadInto(id, 'binned.csv', golfFile(41, 2, '2026-04-07T09:00:00Z'));
    const swingId = (await send('coach', 'GET', `/api/recordings/${rec}`)).body as { swings: { id: number }[] };
    const del = await send('coach', 'DELETE', `/api/sessions/${id}`);
    expect(del.status).toBe(200);
    const binned = sessionResponseSchema.parse(del.body);
    expect(binned.binnedAt).not.toBeNull();
    expect(binned.restorableUntil).toBe(new Date(Date.parse(binned.binnedAt!) + 30 * 86_400_000).toISOString().slice(0, 10));
    const list = await send('coach', 'GET', `/api/athletes/${athleteId}/sessions`);
    expect((list.body as { sessions: { id: number }[] }).sessions.map((s) => s.id)).not.toContain(id);
    const bin = await send('coach', 'GET', `/api/athletes/${athleteId}/sessions/bin`);
    expect((bin.body as { sessions: { id: number }[] }).sessions.map((s) => s.id)).toContain(id);
    expect((await send('coach', 'GET', `/api/sessions/${id}/recordings`)).status).toBe(404);
    expect((await send('coach', 'GET', `/api/recordings/${rec}`)).status).toBe(404);
    expect((await send('coach', 'GET', `/api/swings/${swingId.swings[0].id}`)).status).toBe(404);
    expect((await send('coach', 'PATCH', `/api/sessions/${id}`, { notes: 'x' })).status).toBe(404);
    expect((await send('coach', 'DELETE', `/api/sessions/${id}`)).status).toBe(404);
    // an upload into a binned session is refused on its field
    const into = await upload(people.get('coach')!, { athleteId, sessionId: id }, [{ name: 'late.csv', content: golfFile(42, 1, '2026-04-07T09:30:00Z') }]);
    expect(into.status).toBe(422);
    expect(fieldErrors(into.body)).toHaveProperty('sessionId');

    const restore = await send('coach', 'POST', `/api/sessions/${id}/restore`);
    expect(restore.status).toBe(200);
    expect(sessionResponseSchema.parse(restore.body)).toMatchObject({ id, binnedAt: null, restorableUntil: null });
    expect((await send('coach', 'GET', `/api/recordings/${rec}`)).status).toBe(200);
    expect((await send('coach', 'GET', `/api/swings/${swingId.swings[0].id}`)).status).toBe(200);
    expect((await send('coach', 'POST', `/api/sessions/${id}/restore`)).status).toBe(404); // not in the bin any more
  });

  it('after 30 days a session cannot be restored, and the sweep removes it with its recordings and raw files', async () => {
    const id = await newSession({ date: '2026-04-08', context: 'lesson' });
    const rec = await uploadInto(id, 'old.csv', golfFile(51, 1, '2026-04-08T09:00:00Z'));
    const kept = await newSession({ date: '2026-04-09', context: 'lesson' });
    const keptRec = await uploadInto(kept, 'recent.csv', golfFile(52, 1, '2026-04-09T09:00:00Z'));
    const key = (await db('recordings').where({ id: rec }).first('storage_key')).storage_key as string;
    const store = serverStore();
    if (store) expect(await store.exists(key)).toBe(true);
    expect((await send('coach', 'DELETE', `/api/sessions/${id}`)).status).toBe(200);
    expect((await send('coach', 'DELETE', `/api/sessions/${kept}`)).status).toBe(200);
    // binned 31 days ago (the clock is the database's own NOW(3), set back directly)
    await db('practice_sessions').where({ id }).update({ binned_at: db.raw('NOW(3) - INTERVAL 31 DAY') });
    const late = await send('coach', 'POST', `/api/sessions/${id}/restore`);
    expect(late.status).toBe(409);
    expect((late.body as { error: { message: string } }).error.message).toMatch(/30 days/);
    if (!store) return;
    const swept = await sweepBin(db, store);
    expect(swept.sessions).toBeGreaterThanOrEqual(1);
    expect(await db('practice_sessions').where({ id }).first('id')).toBeUndefined();
    expect(await db('recordings').where({ id: rec }).first('id')).toBeUndefined();
    expect(await db('swings').where({ recording_id: rec }).first('id')).toBeUndefined();
    expect(await store.exists(key)).toBe(false);
    // the one binned a moment ago stays, restorable
    expect(await db('recordings').where({ id: keptRec }).first('id')).toBeDefined();
    expect((await send('coach', 'POST', `/api/sessions/${kept}/restore`)).status).toBe(200);
  });

  it('DELETE /api/recordings/:id: its GET then answers 404, the session lists it no more, and restore brings it back', async () => {
    const id = await newSession({ date: '2026-04-10', context: 'practice' });
    const rec = await uploadInto(id, 'wrong-file.csv', golfFile(61, 1, '2026-04-10T09:00:00Z'));
    const del = await send('coach', 'DELETE', `/api/recordings/${rec}`);
    expect(del.status).toBe(200);
    expect(binnedRecordingSchema.parse(del.body)).toMatchObject({ id: rec, sessionId: id, filename: 'wrong-file.csv' });
    expect((await send('coach', 'GET', `/api/recordings/${rec}`)).status).toBe(404);
    expect((await send('coach', 'POST', `/api/recordings/${rec}/reprocess`, {})).status).toBe(404);
    const view = sessionRecordingsSchema.parse((await send('coach', 'GET', `/api/sessions/${id}/recordings`)).body);
    expect(view.recordings).toEqual([]);
    expect(view.swings).toEqual([]);
    expect((await send('coach', 'DELETE', `/api/recordings/${rec}`)).status).toBe(404);
    expect((await send('coach', 'POST', `/api/recordings/${rec}/restore`)).status).toBe(200);
    expect((await send('coach', 'GET', `/api/recordings/${rec}`)).status).toBe(200);
  });
});

describe('role matrix of the session routes', () => {
  type Case = { name: string; method: string; path: () => Promise<string>; body?: unknown; expected: Record<Actor, number>; prepare?: (path: string) => Promise<void> };
  const binnedSession = async () => {
    const id = await newSession({ date: '2026-04-11', context: 'lesson' });
    expect((await send('coach', 'DELETE', `/api/sessions/${id}`)).status).toBe(200);
    return id;
  };
  const binnedRecording = async () => {
    const id = await newSession({ date: '2026-04-12', context: 'lesson' });
    const rec = await uploadInto(id, 'matrix.csv', golfFile(71, 1, '2026-04-12T09:00:00Z'));
    expect((await send('coach', 'DELETE', `/api/recordings/${rec}`)).status).toBe(200);
    return rec;
  };
  // success statuses for coach@ (the athlete's coach); coach2 does not coach this athlete -> 404 like an unknown id;
  // student, admin and researcher have no write role here -> 403; no session -> 401.
  const cases: Case[] = [
    { name: 'GET sessions', method: 'GET', path: async () => `/api/athletes/${athleteId}/sessions`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 404, researcher: 403 } },
    { name: 'POST sessions', method: 'POST', path: async () => `/api/athletes/${athleteId}/sessions`, body: { date: '2026-04-13', context: 'practice' }, expected: { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 } },
    { name: 'GET bin', method: 'GET', path: async () => `/api/athletes/${athleteId}/sessions/bin`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
    { name: 'PATCH session', method: 'PATCH', path: async () => `/api/sessions/${await newSession()}`, body: { notes: 'matrix' }, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
    { name: 'DELETE session', method: 'DELETE', path: async () => `/api/sessions/${await newSession()}`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
    { name: 'restore session', method: 'POST', path: async () => `/api/sessions/${await binnedSession()}/restore`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
    { name: 'restore recording', method: 'POST', path: async () => `/api/recordings/${await binnedRecording()}/restore`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
  ];
  for (const c of cases) {
    it(`${c.name}: ${actors.map((a) => `${a} ${c.expected[a]}`).join(', ')}`, async () => {
      // one object per case; the coach goes last so the others meet it unchanged
      const path = await c.path();
      for (const actor of [...actors.filter((a) => a !== 'coach'), 'coach' as const]) {
        const res = await send(actor, c.method, path, c.body);
        expect(res.status, `${actor} ${c.method} ${path}`).toBe(c.expected[actor]);
        expect(res.contentType).toContain('application/json');
      }
    });
  }

  it('DELETE /api/recordings/:id: only the athlete’s coach; another coach gets the answer of an unknown id', async () => {
    const id = await newSession({ date: '2026-04-14', context: 'lesson' });
    const rec = await uploadInto(id, 'matrix-delete.csv', golfFile(72, 1, '2026-04-14T09:00:00Z'));
    const expected: Record<Actor, number> = { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 };
    for (const actor of [...actors.filter((a) => a !== 'coach'), 'coach' as const]) {
      expect((await send(actor, 'DELETE', `/api/recordings/${rec}`)).status, actor).toBe(expected[actor]);
    }
    const unknown = await send('coach2', 'DELETE', '/api/recordings/999999');
    const existing = await send('coach2', 'DELETE', `/api/recordings/${rec}`);
    expect(existing).toEqual(unknown);
  });

  it('the student sees their own sessions but cannot create, edit or delete them', async () => {
    // athlete 1 is student@'s own (db/demo/scenario.ts); nothing here changes the demo
    expect((await send('student', 'GET', '/api/athletes/1/sessions')).status).toBe(200);
    expect((await send('student', 'POST', '/api/athletes/1/sessions', { date: '2026-04-15', context: 'practice' })).status).toBe(403);
    const first = ((await send('student', 'GET', '/api/athletes/1/sessions')).body as { sessions: { id: number }[] }).sessions[0].id;
    expect((await send('student', 'DELETE', `/api/sessions/${first}`)).status).toBe(403);
    expect((await send('student', 'PATCH', `/api/sessions/${first}`, { notes: 'mine' })).status).toBe(403);
  });
});
