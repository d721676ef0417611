import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeRecording } from '@/lib/signal/analyze';
import { parseRecording } from '@/lib/signal/read';
import { DETECTION_DEFAULTS } from '@/lib/signal/finder/params';
import { LIVE_DEFAULTS } from '@/lib/live/finder';
import { DISTRACTORS, generateSession, PRE_SHOTS } from '@/lib/signal/synthetic';
import { EVENT_NAMES } from '@/lib/signal/types';
import { errorResponseSchema } from '@/lib/contracts/errors';
import { liveEndedSchema, liveSamplesAcceptedSchema, liveStartedSchema, liveSwingSchema, liveViewSchema, type LiveSwingEvent } from '@/lib/contracts/live';
import { replay, samplesUrl, splitRecording } from '@/scripts/lib/live-bridge';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { signedIn, type HttpSession } from './support/http-session';
import { serverDb, settled } from './support/recordings-http';
import { readSse, type SseEvent } from './support/sse';

// Live lessons over HTTP on the running app: a generated session (invented golfer; walking, waggles, stepping between
// swings) streamed by the bridge at 10x speed, with repeated and out-of-order chunks; the swings on the event stream
// against the offline analysis of the same file (issue 16's rule: events within one sample, values within 0.5
// points); a malformed chunk; Last-Event-ID; the end into a normal recording and the labels' reconciliation; the
// role matrix of the event stream and the ingest token.

const env = e2eEnv();
/** a swing settles live once its finish hold and the filter's padding lie inside the stream (lib/live/finder.ts) */
const SETTLED_AFTER_S = DETECTION_DEFAULTS.settleHoldS + LIVE_DEFAULTS.padAfterS;
const ATHLETE = 1; // coach@'s student Ada Fenwick (db/demo/scenario.ts); student@ is her account
let coach: HttpSession;
let coach2: HttpSession;
let student: HttpSession;

const lesson = generateSession({
  seed: 1616,
  sampleRateHz: 100,
  sensorsPerFoot: 8,
  units: 'N',
  handedness: 'right',
  stanceWidthMm: 400,
  swings: 4,
  withMarker: false,
  distractors: DISTRACTORS,
  preShots: PRE_SHOTS,
});
const csv = lesson.csv();
const offline = analyzeRecording(parseRecording(csv), lesson.layout).result;
const firstS = Number(csv.split('\n').find((l) => /^\d/.test(l))!.split(',')[0]);

const json = (method: string, body: unknown): RequestInit => ({ method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

async function start(session: HttpSession): Promise<{ id: number; token: string }> {
  const res = await session.json('/api/live', json('POST', { athleteId: ATHLETE, context: 'lesson', drillFocus: 'Hold the finish' }));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return liveStartedSchema.parse(res.body);
}

async function post(id: number, token: string, seq: number | string, body: string) {
  const res = await fetch(`${env.E2E_BASE_URL}/api/live/${id}/samples`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'text/csv', 'x-chunk-seq': String(seq) },
    body,
  });
  return { status: res.status, body: (await res.json()) as unknown };
}

beforeAll(async () => {
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
  coach2 = await signedIn(env.E2E_BASE_URL, DEMO.coach2, DEMO_PASSWORD);
  student = await signedIn(env.E2E_BASE_URL, DEMO.student, DEMO_PASSWORD);
});

describe('live lesson', () => {
  it('publishes every swing once, in order, equal to the offline analysis; repeats and out-of-order chunks change nothing', { timeout: 240_000 }, async () => {
    const live = await start(coach);
    const { chunks } = splitRecording(csv);
    // the swings that settle before the stream ends (finish hold + padding; lib/live/finder.ts)
    const lastS = Number(csv.trimEnd().split('\n').pop()!.split(',')[0]);
    const expected = offline.swings.filter((w) => w.events.finish + SETTLED_AFTER_S <= lastS);
    expect(expected.length).toBeGreaterThanOrEqual(3);

    const events = readSse(coach, `/api/live/${live.id}/events`, {
      timeoutMs: 200_000,
      stop: (ev) => ev.filter((e) => e.event === 'swing').length >= expected.length && ev.some((e) => e.event === 'gap'),
    });
    // chunks 0..9 in order, then 11 before 10 (a gap, then filled), every fifth chunk sent twice
    const order = chunks.map((_, k) => k);
    [order[10], order[11]] = [order[11], order[10]];
    for (const k of order) {
      const a = await post(live.id, live.token, k, chunks[k]);
      expect(a.status, JSON.stringify(a.body)).toBe(202);
      expect(liveSamplesAcceptedSchema.parse(a.body)).toEqual({ seq: k, duplicate: false });
      if (k % 5 === 0) {
        const again = await post(live.id, live.token, k, chunks[k]);
        expect(again.status).toBe(202);
        expect(liveSamplesAcceptedSchema.parse(again.body).duplicate).toBe(true);
      }
      if (k % 10 === 0) await new Promise((r) => setTimeout(r, 10)); // ~10x speed overall on this machine
    }
    const got = await events;
    const swings = got.filter((e) => e.event === 'swing').map((e) => liveSwingSchema.parse(JSON.parse(e.data)));
    expect(swings.map((s) => s.number)).toEqual(expected.map((_, k) => k + 1)); // once each, in order
    expected.forEach((off, k) => {
      const on = swings[k];
      for (const e of EVENT_NAMES) {
        expect(Math.abs(on.events[e] - (off.events[e] - firstS)), `swing ${k + 1} ${e}`).toBeLessThanOrEqual(0.01 + 1e-6);
        expect(Math.abs(on.values.atEvents[e].leadPct - off.at_events[e].lead_pct), `lead % at ${e}`).toBeLessThanOrEqual(0.5);
        expect(Math.abs(on.values.atEvents[e].leadHeelPct - off.at_events[e].lead_heel_pct)).toBeLessThanOrEqual(0.5);
        expect(Math.abs(on.values.atEvents[e].trailHeelPct - off.at_events[e].trail_heel_pct)).toBeLessThanOrEqual(0.5);
      }
    });
    const gap = got.find((e) => e.event === 'gap')!;
    expect(JSON.parse(gap.data).missing).toEqual([10]);
    expect(got.some((e) => e.event === 'level')).toBe(true);

    // Last-Event-ID: a client that saw the first swing gets the rest, not the first again
    const firstSwingId = got.find((e) => e.event === 'swing')!.id!;
    const resumed = await readSse(coach, `/api/live/${live.id}/events`, { lastEventId: firstSwingId, timeoutMs: 20_000, stop: (ev) => ev.filter((e: SseEvent) => e.event === 'swing').length >= expected.length - 1 });
    expect(resumed.filter((e) => e.event === 'swing').map((e) => JSON.parse(e.data).number)).toEqual(expected.slice(1).map((_, k) => k + 2));

    // a malformed chunk: 400 with line and column counted from the start of the stream; the session goes on
    const view0 = liveViewSchema.parse((await coach.json(`/api/live/${live.id}`)).body);
    expect(view0.swings.length).toBe(expected.length);
    const label = await coach.json(`/api/live/${live.id}/swings/1`, json('PATCH', { club: 'driver', strike: 'solid' }));
    expect(label.status, JSON.stringify(label.body)).toBe(200);
    const streamLines = csv.trimEnd().split('\n').length;
    const t = lastS + 0.01;
    const bad = await post(live.id, live.token, chunks.length, `${t.toFixed(2)},1,2,3,4,5,6,7,8,1,2,3,4,5,6,7,8\n${(t + 0.01).toFixed(2)},1,2,x,4,5,6,7,8,1,2,3,4,5,6,7,8\n`);
    expect(bad.status).toBe(400);
    const err = errorResponseSchema.parse(bad.body).error;
    expect([err.line, err.column]).toEqual([streamLines + 2, 4]);
    expect(err.message).toContain(`line ${streamLines + 2}, column 4`);
    const good = await post(live.id, live.token, chunks.length, `${t.toFixed(2)},1,2,3,4,5,6,7,8,1,2,3,4,5,6,7,8\n`);
    expect(good.status).toBe(202);

    // end: a normal recording, processed by the usual pipeline; the labelled live swing's labels reach its final swing
    const end = await coach.json(`/api/live/${live.id}/end`, { method: 'POST' });
    expect(end.status, JSON.stringify(end.body)).toBe(200);
    const { recordingId } = liveEndedSchema.parse(end.body);
    const rec = await settled(coach, recordingId, 120_000);
    expect(rec.status).toBe('ready');
    const db = serverDb();
    try {
      const deadline = Date.now() + 40_000; // the sweep reconciles every 15 s
      let labelled: { club: string; strike: string } | undefined;
      while (Date.now() < deadline && !labelled) {
        labelled = await db('swing_labels as l').join('swings as s', 's.id', 'l.swing_id').where('s.recording_id', recordingId).first('l.club', 'l.strike');
        if (!labelled) await new Promise((r) => setTimeout(r, 1000));
      }
      expect(labelled).toEqual({ club: 'driver', strike: 'solid' });
      const stored = await db('recordings').where({ id: recordingId }).first('byte_size');
      expect(Number(stored.byte_size)).toBe(Buffer.byteLength(csv) + Buffer.byteLength(`${t.toFixed(2)},1,2,3,4,5,6,7,8,1,2,3,4,5,6,7,8\n`));
    } finally {
      await db.destroy();
    }
    // the token expired with the session
    expect((await post(live.id, live.token, chunks.length + 1, `${(t + 1).toFixed(2)},1,2,3,4,5,6,7,8,1,2,3,4,5,6,7,8\n`)).status).toBe(401);
  });

  it('role matrix: only the student’s coach reads the event stream; the ingest token works for its samples only', { timeout: 60_000 }, async () => {
    const live = await start(coach);
    const other = await start(coach);
    expect((await student.json('/api/live', json('POST', { athleteId: ATHLETE }))).status).toBe(403);
    expect((await coach2.json('/api/live', json('POST', { athleteId: ATHLETE }))).status).toBe(404);
    expect((await student.fetch(`/api/live/${live.id}/events`)).status).toBe(403);
    expect((await coach2.fetch(`/api/live/${live.id}/events`)).status).toBe(404);
    expect((await coach2.json(`/api/live/${live.id}/end`, { method: 'POST' })).status).toBe(404);
    expect((await student.json(`/api/live/${live.id}`)).status).toBe(403);
    const bearer = { authorization: `Bearer ${live.token}` };
    for (const path of [`/api/live/${live.id}/events`, `/api/live/${live.id}`, '/api/athletes', `/api/athletes/${ATHLETE}`, '/api/me']) {
      const res = await fetch(`${env.E2E_BASE_URL}${path}`, { headers: bearer, redirect: 'manual' });
      expect([401, 403], path).toContain(res.status);
      if (path !== '/api/me') expect(res.status, path).toBe(401);
    }
    const end = await fetch(`${env.E2E_BASE_URL}/api/live/${live.id}/end`, { method: 'POST', headers: bearer });
    expect(end.status).toBe(401);
    // another live session's samples with this token
    const { chunks } = splitRecording(csv);
    expect((await post(other.id, live.token, 0, chunks[0])).status).toBe(401);
    expect((await post(live.id, 'x'.repeat(43), 0, chunks[0])).status).toBe(401);
    expect((await post(live.id, live.token, 0, chunks[0])).status).toBe(202);
    // the bridge script against the same URL (its seq continues from 0: repeats are ignored)
    const r = await replay(chunks.slice(0, 3).join(''), { url: `${env.E2E_BASE_URL}/api/live/${live.id}`, token: live.token, speed: 1000 });
    expect(r.refused).toEqual([]);
    expect(samplesUrl(`${env.E2E_BASE_URL}/api/live/${live.id}`)).toMatch(/\/samples$/);
  });
});
