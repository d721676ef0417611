import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { overlayOptionsResponseSchema, recordingOverviewResponseSchema, swingViewResponseSchema, type SwingView } from '@/lib/contracts/swings';
import { timeAxis } from '@/components/swings/swing-view-model';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, serverStore, settled, upload } from './support/recordings-http';
import { sweepBin } from '@/lib/sessions/bin';

// Writes on a swing against the running app: moving and resetting events (with their audit and the
// recomputed numbers), labels, "not a swing", notes and their visibility, and the role matrix of every route.
// The numbers at a moved event are compared with the per-sample series `npm run analyze --series` writes for the
// same bytes (the product's CLI, itself checked against scipy and the generator's truth in tests/signal).
// Demo ids (db/demo/scenario.ts): athlete 1 Ada Fenwick is student@'s own and on coach@'s roster; user 2 = coach@.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, HttpSession>();
let db: Knex;

const golfCsv = generateSession({ seed: 9, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 2, withMarker: true }).csv();
let swingIds: number[] = [];
let seriesCsv: { time: number; leadPct: number | null }[] = [];

const send = (actor: Actor, method: string, path: string, body?: unknown) =>
  sessions.get(actor)!.json(path, { method, headers: body === undefined ? {} : { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
const getSwing = async (actor: Actor, id: number): Promise<SwingView> => {
  const { status, body } = await send(actor, 'GET', `/api/swings/${id}`);
  expect(status).toBe(200);
  return swingViewResponseSchema.parse(body).swing;
};
const fieldErrors = (body: unknown) => (body as { error: { fieldErrors?: Record<string, string[]> } }).error.fieldErrors ?? {};
const ev = (s: SwingView, name: string) => s.events.find((e) => e.name === name)!;

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  sessions.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors.filter((a) => a !== 'none')) sessions.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor as Exclude<Actor, 'none'>], DEMO_PASSWORD));

  const dir = mkdtempSync(join(tmpdir(), 'stanceline-swing-edit-'));
  const file = join(dir, 'golf.csv');
  writeFileSync(file, golfCsv);
  const seriesFile = join(dir, 'series.csv');
  await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', file, '--handedness', 'right', '--stance-width-mm', '380', '--series', seriesFile], { maxBuffer: 64 << 20 });
  const [header, ...lines] = readFileSync(seriesFile, 'utf8').trim().split('\n');
  const cols = header.split(',');
  const ti = cols.indexOf('time_s');
  const li = cols.indexOf('lead_pct');
  seriesCsv = lines.map((line) => {
    const cells = line.split(',');
    return { time: Number(cells[ti]), leadPct: cells[li] === '' ? null : Number(cells[li]) };
  });

  const res = await upload(sessions.get('coach')!, { athleteId: 1, sessionId: 1, handedness: 'right', stanceWidthMm: 380 }, [{ name: 'bay-3-edit.csv', content: golfCsv }]);
  expect(res.status).toBe(202);
  const done = await settled(sessions.get('coach')!, res.body.recordings[0].id);
  expect(done.status).toBe('ready');
  swingIds = done.swings.map((s: { id: number }) => s.id);
  expect(swingIds.length).toBe(2);
});

afterAll(async () => {
  await seedDemo(db); // the next test files expect the plain demo scenario
  await db.destroy();
});

describe('GET /api/swings/:id for the viewer', () => {
  it('gives the full-rate window, overview, neighbours, layout, sensor forces at events and empty coach work', async () => {
    const s = await getSwing('coach', swingIds[0]);
    const time = timeAxis(s.series.time); // columnar: first time + step + count (lib/contracts/swings.ts)
    expect(s.series.time.step).toBeCloseTo(0.01, 12); // 100 Hz
    expect(time[0]).toBeCloseTo(s.startS, 3);
    expect(time.at(-1)).toBeCloseTo(s.endS, 3);
    expect(time.length).toBe(Math.round((s.endS - s.startS) * 100) + 1); // 100 Hz, both ends included
    for (const key of ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copX', 'copY', 'copSpeed'] as const) expect(s.series[key]).toHaveLength(time.length);
    // the traces at the CLI's per-sample series (lead % to 0.1 here, 2 decimals in the CSV)
    const i = Math.floor(time.length / 2);
    const row = seriesCsv.find((r) => Math.abs(r.time - time[i]) < 0.004)!;
    expect(Math.abs(s.series.leadPct[i]! - row.leadPct!)).toBeLessThanOrEqual(0.051);
    // the whole recording is the recording's own request (the same for every swing of it), with an ETag and 304
    const overviewRes = await sessions.get('coach')!.fetch(`/api/recordings/${s.recording.id}/overview`);
    expect(overviewRes.status).toBe(200);
    const overview = recordingOverviewResponseSchema.parse(await overviewRes.json()).overview;
    expect(overview.time.length).toBeGreaterThan(time.length / 10);
    const again = await sessions.get('coach')!.fetch(`/api/recordings/${s.recording.id}/overview`, { headers: { 'if-none-match': overviewRes.headers.get('etag')! } });
    expect(again.status).toBe(304);
    expect((await sessions.get('coach2')!.fetch(`/api/recordings/${s.recording.id}/overview`)).status).toBe(404);
    expect(s.siblings).toMatchObject({ previousId: null, nextId: swingIds[1] });
    const overlay = overlayOptionsResponseSchema.parse((await send('coach', 'GET', `/api/swings/${swingIds[0]}/overlay-options`)).body).options;
    expect(overlay.map((x) => x.id)).toContain(swingIds[1]);
    expect(overlay.map((x) => x.id)).not.toContain(swingIds[0]);
    // the student whose swing it is reads the same list; another coach gets the same 404 as an unknown id
    expect((await send('student', 'GET', `/api/swings/${swingIds[0]}/overlay-options`)).status).toBe(200);
    expect((await send('coach2', 'GET', `/api/swings/${swingIds[0]}/overlay-options`)).status).toBe(404);
    expect(s.layout.sensors).toHaveLength(16);
    expect(s).toMatchObject({ handedness: 'right', stanceWidthMm: 380, canEdit: true, corrections: [], annotations: [] });
    expect(s.labels).toEqual({ club: null, strike: null, flight: null, tags: [], rating: null, notASwing: false });
    expect(s.sensorFrames.map((f) => f.event)).toEqual(['address', 'top', 'transition', 'impact', 'finish']);
    for (const f of s.sensorFrames) expect(Object.keys(f.forcesN).sort()).toEqual(s.layout.sensors.map((x) => x.id).sort());
    // lead % at impact = lead-foot force / total x 100 (README definition), from the per-sensor forces (0.1 N each)
    const impact = s.sensorFrames.find((f) => f.event === 'impact')!.forcesN;
    const left = Object.entries(impact).filter(([id]) => id.startsWith('L')).reduce((a, [, v]) => a + v!, 0);
    const total = Object.values(impact).reduce((a: number, v) => a + v!, 0);
    expect((left / total) * 100).toBeCloseTo(ev(s, 'impact').leadPct!, 0);
    const student = await getSwing('student', swingIds[0]);
    expect(student.canEdit).toBe(false);
  });
});

describe('PATCH /api/swings/:id events', () => {
  it('refuses disordered and out-of-window events with 422 naming the field, and changes nothing', async () => {
    const before = await getSwing('coach', swingIds[0]);
    const cases: [unknown, string][] = [
      [{ events: { top: ev(before, 'transition').timeS + 0.02 } }, 'events.top'],
      [{ events: { transition: ev(before, 'top').timeS - 0.02 } }, 'events.transition'],
      [{ events: { address: before.startS - 1 } }, 'events.address'],
      [{ events: { finish: before.endS + 0.5 } }, 'events.finish'],
      [{ events: { apex: 1 } }, 'events'],
      [{ events: { top: 'soon' } }, 'events.top'],
      [{ events: { top: ev(before, 'top').timeS + 0.01 }, resetEvents: ['top'] }, 'events.top'],
    ];
    for (const [body, field] of cases) {
      const { status, body: answer } = await send('coach', 'PATCH', `/api/swings/${swingIds[0]}`, body);
      expect(status, JSON.stringify(body)).toBe(422);
      expect(Object.keys(fieldErrors(answer)), JSON.stringify(body)).toContain(field);
    }
    const after = await getSwing('coach', swingIds[0]);
    expect(after.events).toEqual(before.events);
    expect(await db('swing_event_corrections').where({ swing_id: swingIds[0] })).toHaveLength(0);
  });

  it('moves top by 30 ms: kept as manual with the automatic time, values and phases recomputed, audited', async () => {
    const before = await getSwing('coach', swingIds[0]);
    const top = ev(before, 'top');
    const { status, body } = await send('coach', 'PATCH', `/api/swings/${swingIds[0]}`, { events: { top: top.timeS + 0.03 } });
    expect(status).toBe(200);
    const s = swingViewResponseSchema.parse(body).swing;
    const moved = ev(s, 'top');
    expect(moved).toMatchObject({ source: 'manual', autoTimeS: top.timeS, misfit: false });
    expect(moved.timeS).toBeCloseTo(top.timeS + 0.03, 6);
    // lead % at the new top = the CLI's per-sample series at that time (CSV 2 decimals, API 1 decimal)
    const row = seriesCsv.find((r) => Math.abs(r.time - moved.timeS) < 0.004)!;
    expect(Math.abs(moved.leadPct! - row.leadPct!)).toBeLessThanOrEqual(0.051);
    // backswing grows by 30 ms, the transition phase shrinks by 30 ms (the top is ~50 ms before the transition), the other phases stay
    const phase = (x: SwingView, name: string) => x.phases.find((p) => p.name === name)!;
    expect(phase(s, 'backswing').durationS! - phase(before, 'backswing').durationS!).toBeCloseTo(0.03, 3);
    expect(phase(before, 'transition').durationS! - phase(s, 'transition').durationS!).toBeCloseTo(0.03, 3);
    expect(phase(s, 'downswing')).toEqual(phase(before, 'downswing'));
    expect(phase(s, 'follow-through')).toEqual(phase(before, 'follow-through'));
    for (const name of ['address', 'transition', 'impact', 'finish']) expect(ev(s, name)).toEqual(ev(before, name));
    expect(s.tempoRatio).not.toBe(before.tempoRatio);
    expect(s.sensorFrames.find((f) => f.event === 'top')!.timeS).toBe(moved.timeS);
    // the audit: who, which event, from, to, when
    expect(s.corrections).toHaveLength(1);
    expect(s.corrections[0]).toMatchObject({ event: 'top', fromS: top.timeS, byName: 'Maren Solberg' });
    expect(s.corrections[0].toS).toBeCloseTo(moved.timeS, 6);
    expect(Math.abs(Date.parse(s.corrections[0].at) - Date.now())).toBeLessThan(10 * 60_000);
    const rows = await db('swing_event_corrections').where({ swing_id: swingIds[0] });
    expect(rows).toMatchObject([{ event: 'top', kind: 'move', user_id: 2 }]);
    // the reload sees the same, and the session's swing list reports the manual source
    expect(await getSwing('coach', swingIds[0])).toEqual(s);
    const list = await send('coach', 'GET', '/api/sessions/1/recordings');
    const listed = (list.body as { swings: { id: number; eventSources: Record<string, { source: string }> }[] }).swings.find((x) => x.id === swingIds[0])!;
    expect(listed.eventSources.top.source).toBe('manual');
  });

  it('resets top: exactly the automatic numbers again, with the reset audited; the student sees no audit', async () => {
    const fresh = await getSwing('coach', swingIds[1]); // never moved: the automatic numbers of a swing
    const auto = await db('swing_event_values').where({ swing_id: swingIds[0] }).orderBy('event');
    expect(auto).toHaveLength(5);
    const { status, body } = await send('coach', 'PATCH', `/api/swings/${swingIds[0]}`, { resetEvents: ['top'] });
    expect(status).toBe(200);
    const s = swingViewResponseSchema.parse(body).swing;
    expect(ev(s, 'top')).toMatchObject({ source: 'auto', timeS: ev(s, 'top').autoTimeS! });
    expect(s.corrections.map((c) => c.event)).toEqual(['top', 'top']);
    expect((await db('swing_event_corrections').where({ swing_id: swingIds[0] }).orderBy('id')).map((r) => r.kind)).toEqual(['move', 'reset']);
    // equal to what the processing wrote: compare with a second processing of the same bytes (swings.test.ts
    // checks those against `npm run analyze`), through a swing that was never touched
    expect(fresh.events.every((e) => e.source === 'auto')).toBe(true);
    const again = await send('coach', 'PATCH', `/api/swings/${swingIds[0]}`, { resetEvents: 'all' });
    expect(again.status).toBe(200);
    expect((await db('swing_event_corrections').where({ swing_id: swingIds[0] })).length).toBe(2); // nothing to reset: no row
    expect((await getSwing('student', swingIds[0])).corrections).toEqual([]);
  });

  it('a move then a reset leaves the stored values and phases exactly as the processing wrote them', async () => {
    const values = () => db('swing_event_values').where({ swing_id: swingIds[1] }).orderBy('event').select('event', 'lead_pct', 'lead_heel_pct', 'trail_heel_pct', 'cop_x_mm', 'cop_y_mm');
    const phases = () => db('swing_phase_metrics').where({ swing_id: swingIds[1] }).orderBy('phase').select('phase', 'duration_s', 'cop_path_mm', 'peak_cop_speed_mm_s', 'mean_lead_pct');
    const tempo = async () => (await db('swings').where({ id: swingIds[1] }).first('tempo_ratio')).tempo_ratio;
    const [v0, p0, t0] = [await values(), await phases(), await tempo()];
    const s = await getSwing('coach', swingIds[1]);
    const move = await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { events: { impact: ev(s, 'impact').timeS - 0.03, transition: ev(s, 'transition').timeS + 0.01 } });
    expect(move.status).toBe(200);
    expect(await values()).not.toEqual(v0);
    const reset = await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { resetEvents: ['impact', 'transition'] });
    expect(reset.status).toBe(200);
    expect(await values()).toEqual(v0);
    expect(await phases()).toEqual(p0);
    expect(await tempo()).toBe(t0);
  });
});

describe('labels and not-a-swing', () => {
  it('round-trips labels, keeps fields left out, and refuses bad values naming the field', async () => {
    const put = await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { labels: { club: 'iron-7', strike: 'solid', flight: 'draw', tags: ['tempo', ' lead heel ', 'tempo'], rating: 4 } });
    expect(put.status).toBe(200);
    expect((await getSwing('coach', swingIds[1])).labels).toEqual({ club: 'iron-7', strike: 'solid', flight: 'draw', tags: ['tempo', 'lead heel'], rating: 4, notASwing: false });
    expect((await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { labels: { rating: null } })).status).toBe(200);
    const s = await getSwing('student', swingIds[1]);
    expect(s.labels).toEqual({ club: 'iron-7', strike: 'solid', flight: 'draw', tags: ['tempo', 'lead heel'], rating: null, notASwing: false });
    for (const [labels, field] of [
      [{ club: 'putter' }, 'labels.club'],
      [{ rating: 6 }, 'labels.rating'],
      [{ rating: 2.5 }, 'labels.rating'],
      [{ flight: 'shank' }, 'labels.flight'],
      [{ tags: [''] }, 'labels.tags.0'],
      [{ notASwing: 'yes' }, 'labels.notASwing'],
    ] as const) {
      const { status, body } = await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { labels });
      expect(status, JSON.stringify(labels)).toBe(422);
      expect(Object.keys(fieldErrors(body))).toContain(field);
    }
  });

  it('notASwing hides the swing from the session list and the overlay pick-list, and is restorable', async () => {
    const hidden = (id: number) =>
      send('coach', 'GET', '/api/sessions/1/recordings').then((r) => (r.body as { swings: { id: number; hidden: boolean }[] }).swings.find((x) => x.id === id)!.hidden);
    expect(await hidden(swingIds[1])).toBe(false);
    expect((await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { labels: { notASwing: true } })).status).toBe(200);
    expect(await hidden(swingIds[1])).toBe(true);
    expect((await getSwing('coach', swingIds[1])).labels.notASwing).toBe(true);
    const overlay = overlayOptionsResponseSchema.parse((await send('coach', 'GET', `/api/swings/${swingIds[0]}/overlay-options`)).body).options;
    expect(overlay.map((x) => x.id)).not.toContain(swingIds[1]);
    expect((await getSwing('coach', swingIds[0])).siblings.nextId).toBe(swingIds[1]); // still reachable by previous/next
    expect((await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { labels: { notASwing: false } })).status).toBe(200);
    expect(await hidden(swingIds[1])).toBe(false);
    expect((await getSwing('coach', swingIds[1])).labels.club).toBe('iron-7'); // other labels untouched
  });
});

describe('annotations', () => {
  it('keeps coach-only notes from the student, shows shared ones, and checks the pin and the body', async () => {
    const path = `/api/swings/${swingIds[0]}/annotations`;
    // a time pin lies inside the swing's window (issue 11): two moments of this swing, to the millisecond
    const window = await db('swings').where({ id: swingIds[0] }).first('start_s', 'end_s');
    const at = (f: number) => Math.round((Number(window.start_s) + f * (Number(window.end_s) - Number(window.start_s))) * 1000) / 1000;
    const [t1, t2] = [at(0.3), at(0.5)];
    const shared = await send('coach', 'POST', path, { body: 'Hold the trail heel a beat longer at the top.', timeS: t1, visibility: 'shared' });
    expect(shared.status).toBe(201);
    expect((shared.body as { annotation: unknown }).annotation).toMatchObject({ authorName: 'Maren Solberg', authorRole: 'coach', timeS: t1, phase: null, visibility: 'shared' });
    const coachOnly = await send('coach', 'POST', path, { body: 'Ask about the left knee next week.', phase: 'downswing', visibility: 'coach' });
    expect(coachOnly.status).toBe(201);
    const bodies = (s: SwingView) => s.annotations.map((a) => a.body);
    expect(bodies(await getSwing('coach', swingIds[0]))).toEqual(['Hold the trail heel a beat longer at the top.', 'Ask about the left knee next week.']);
    expect(bodies(await getSwing('student', swingIds[0]))).toEqual(['Hold the trail heel a beat longer at the top.']);
    const listed = await send('student', 'GET', path);
    expect((listed.body as { annotations: { visibility: string }[] }).annotations.map((a) => a.visibility)).toEqual(['shared']);

    for (const [body, field] of [
      [{ body: 'x', timeS: 1, phase: 'top-ish', visibility: 'shared' }, 'phase'],
      [{ body: 'x', timeS: 1, phase: 'backswing', visibility: 'shared' }, 'timeS'],
      [{ body: '   ', visibility: 'shared' }, 'body'],
      [{ body: 'x'.repeat(2001), visibility: 'shared' }, 'body'],
      [{ body: 'x', visibility: 'everyone' }, 'visibility'],
    ] as const) {
      const { status, body: answer } = await send('coach', 'POST', path, body);
      expect(status).toBe(422);
      expect(Object.keys(fieldErrors(answer))).toContain(field);
    }

    // sharing the coach-only note, re-pinning it to a time clears the phase
    const id = (coachOnly.body as { annotation: { id: number } }).annotation.id;
    const patched = await send('coach', 'PATCH', `${path}/${id}`, { visibility: 'shared', timeS: t2 });
    expect(patched.status).toBe(200);
    expect((patched.body as { annotation: unknown }).annotation).toMatchObject({ visibility: 'shared', timeS: t2, phase: null });
    expect(bodies(await getSwing('student', swingIds[0]))).toHaveLength(2);
    expect((await sessions.get('coach')!.fetch(`${path}/${id}`, { method: 'DELETE' })).status).toBe(204);
    expect((await sessions.get('coach')!.fetch(`${path}/${id}`, { method: 'DELETE' })).status).toBe(404);
    expect(bodies(await getSwing('student', swingIds[0]))).toHaveLength(1);

    // the removed note waits in the bin: undo brings back the same note, id and all
    expect((await send('student', 'POST', `${path}/${id}/restore`)).status).toBe(403);
    const restored = await send('coach', 'POST', `${path}/${id}/restore`);
    expect(restored.status).toBe(200);
    expect((restored.body as { annotation: unknown }).annotation).toMatchObject({ id, visibility: 'shared', timeS: t2 });
    expect(bodies(await getSwing('student', swingIds[0]))).toHaveLength(2);
    expect((await send('coach', 'POST', `${path}/${id}/restore`)).status).toBe(404); // not in the bin any more
    // past the bin's 30 days: 409, and the sweep removes it
    expect((await sessions.get('coach')!.fetch(`${path}/${id}`, { method: 'DELETE' })).status).toBe(204);
    await db('swing_annotations').where({ id }).update({ binned_at: db.raw('NOW(3) - INTERVAL 31 DAY') });
    expect((await send('coach', 'POST', `${path}/${id}/restore`)).status).toBe(409);
    expect((await sweepBin(db, serverStore()!)).notes).toBeGreaterThanOrEqual(1);
    expect(await db('swing_annotations').where({ id }).first('id')).toBeUndefined();
  });
});

describe('role matrix of every swing route', () => {
  // Writes leave the data as they found it where they succeed (rating set to its value, a note of its own).
  const write = { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } as const;
  const read = { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } as const;
  type Case = { name: string; method: string; path: () => Promise<string> | string; body?: unknown; expected: Record<Actor, number> };
  const note = async () => {
    const r = await send('coach', 'POST', `/api/swings/${swingIds[0]}/annotations`, { body: 'matrix note', visibility: 'shared' });
    return `/api/swings/${swingIds[0]}/annotations/${(r.body as { annotation: { id: number } }).annotation.id}`;
  };
  const cases: Case[] = [
    { name: 'GET the swing', method: 'GET', path: () => `/api/swings/${swingIds[0]}`, expected: read },
    { name: 'PATCH labels', method: 'PATCH', path: () => `/api/swings/${swingIds[0]}`, body: { labels: { rating: 3 } }, expected: write },
    { name: 'PATCH an event out of the window', method: 'PATCH', path: () => `/api/swings/${swingIds[0]}`, body: { events: { top: 0 } }, expected: { ...write, coach: 422 } },
    { name: 'PATCH an unknown swing', method: 'PATCH', path: () => `/api/swings/999999`, body: { labels: { rating: 3 } }, expected: { ...write, coach: 404, coach2: 404 } },
    { name: 'GET the notes', method: 'GET', path: () => `/api/swings/${swingIds[0]}/annotations`, expected: read },
    { name: 'POST a note', method: 'POST', path: () => `/api/swings/${swingIds[0]}/annotations`, body: { body: 'matrix', visibility: 'coach' }, expected: { ...write, coach: 201 } },
    { name: 'PATCH a note', method: 'PATCH', path: note, body: { body: 'matrix note, edited' }, expected: write },
    { name: 'DELETE a note', method: 'DELETE', path: note, expected: { ...write, coach: 204 } },
    {
      name: 'POST restore of a removed note',
      method: 'POST',
      path: async () => {
        const p = await note();
        await sessions.get('coach')!.fetch(p, { method: 'DELETE' });
        return `${p}/restore`;
      },
      expected: write,
    },
  ];
  for (const c of cases) {
    it(`${c.name}: ${Object.entries(c.expected).map(([a, n]) => `${a} ${n}`).join(', ')}`, async () => {
      for (const actor of actors) {
        const path = await c.path();
        const res = await sessions.get(actor)!.fetch(path, {
          method: c.method,
          headers: c.body === undefined ? {} : { 'content-type': 'application/json' },
          body: c.body === undefined ? undefined : JSON.stringify(c.body),
        });
        expect(res.status, `${c.method} ${path} as ${actor}`).toBe(c.expected[actor]);
        if (res.status >= 400) expect(await res.json()).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
        else await res.arrayBuffer();
      }
    });
  }
});

describe('GET /api/swings/:id: stored payload, ETag, 304, gzip', () => {
  const get = (actor: Actor, id: number, etag?: string) => sessions.get(actor)!.fetch(`/api/swings/${id}`, { headers: etag ? { 'if-none-match': etag } : {} });

  it('answers with an ETag and gzip, and 304 with no body for a matching If-None-Match (RFC 9110 13.1.2, 15.4.5)', async () => {
    const first = await get('coach', swingIds[1]);
    expect(first.status).toBe(200);
    const etag = first.headers.get('etag')!;
    expect(etag).toMatch(/^W\/"[^"]+"$/);
    expect(first.headers.get('content-encoding')).toBe('gzip'); // fetch sends Accept-Encoding: gzip and unpacks it
    expect(first.headers.get('cache-control')).toBe('private, no-cache');
    expect(swingViewResponseSchema.parse(await first.json()).swing.id).toBe(swingIds[1]);
    const again = await get('coach', swingIds[1], etag);
    expect(again.status).toBe(304);
    expect(again.headers.get('etag')).toBe(etag);
    expect(await again.text()).toBe('');
    expect((await get('coach', swingIds[1], `"other", ${etag}`)).status).toBe(304);
    const stale = await get('coach', swingIds[1], 'W/"not-this-one"');
    expect(stale.status).toBe(200);
    await stale.arrayBuffer();
  });

  it('gzip (Next compress) only when Accept-Encoding allows it (RFC 9110 12.5.3: q=0 means "not acceptable"), the same JSON either way', async () => {
    const as = (acceptEncoding: string) => sessions.get('coach')!.fetch(`/api/swings/${swingIds[1]}`, { headers: { 'accept-encoding': acceptEncoding } });
    const plain = await as('identity');
    expect(plain.headers.get('content-encoding')).toBeNull();
    const plainText = await plain.text();
    const refused = await as('gzip;q=0, identity');
    expect(refused.headers.get('content-encoding')).toBeNull();
    expect(await refused.text()).toBe(plainText);
    const zipped = await as('br;q=0.5, gzip');
    expect(zipped.headers.get('content-encoding')).toBe('gzip');
    expect(zipped.headers.get('vary')).toMatch(/accept-encoding/i);
    expect(await zipped.text()).toBe(plainText); // fetch unpacks it: gzip must carry exactly the identity bytes
    expect(zipped.headers.get('etag')).toBe(plain.headers.get('etag')); // weak: one validator for both encodings
  });

  it('a correction changes the ETag, and the new body carries the forces at the moved event', async () => {
    const before = await get('coach', swingIds[1]);
    const etag = before.headers.get('etag')!;
    const s = swingViewResponseSchema.parse(await before.json()).swing;
    const top = ev(s, 'top').timeS + 0.03;
    expect((await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { events: { top } })).status).toBe(200);
    const after = await get('coach', swingIds[1], etag);
    expect(after.status).toBe(200);
    expect(after.headers.get('etag')).not.toBe(etag);
    const moved = swingViewResponseSchema.parse(await after.json()).swing;
    expect(moved.sensorFrames.find((f) => f.event === 'top')!.timeS).toBeCloseTo(top, 3);
    const stored = await db('swing_payloads').where({ swing_id: swingIds[1] }).first('body');
    expect(JSON.parse(stored.body).sensorFrames.find((f: { event: string }) => f.event === 'top').timeS).toBeCloseTo(top, 3);
    expect((await send('coach', 'PATCH', `/api/swings/${swingIds[1]}`, { resetEvents: ['top'] })).status).toBe(200);
    const reset = await get('coach', swingIds[1], after.headers.get('etag')!);
    expect(reset.status).toBe(200); // the reset moved top back and added an audit row: a new body and validator
    expect(reset.headers.get('etag')).not.toBe(after.headers.get('etag'));
    expect(ev(swingViewResponseSchema.parse(await reset.json()).swing, 'top').timeS).toBe(ev(s, 'top').timeS);
  });

  it('a student never gets another reader’s or another athlete’s payload, not even as a 304', async () => {
    const coachOwn = await get('coach', swingIds[1]);
    const coachEtag = coachOwn.headers.get('etag')!;
    await coachOwn.arrayBuffer();
    // the student's own swing: their own body (no audit, read-only), so a different validator than the coach's
    const mine = await get('student', swingIds[1], coachEtag);
    expect(mine.status).toBe(200);
    expect(mine.headers.get('etag')).not.toBe(coachEtag);
    expect(swingViewResponseSchema.parse(await mine.json()).swing.canEdit).toBe(false);

    // a swing of another athlete (athlete 3 on coach@'s roster, not the student's), its stored payload already built
    const res = await upload(sessions.get('coach')!, { athleteId: 3, sessionId: 6, handedness: 'right', stanceWidthMm: 380 }, [{ name: 'other-athlete.csv', content: golfCsv }]);
    expect(res.status).toBe(202);
    const done = await settled(sessions.get('coach')!, res.body.recordings[0].id);
    const otherId = done.swings[0].id as number;
    expect(await db('swing_payloads').where({ swing_id: otherId }).first('swing_id')).toBeTruthy();
    const other = await get('coach', otherId);
    const otherEtag = other.headers.get('etag')!;
    await other.arrayBuffer();
    for (const actor of ['student', 'coach2'] as const) {
      const r = await get(actor, otherId, otherEtag);
      expect(r.status, actor).toBe(404); // the same answer as an unknown id (DEVELOPERS.md "Conventions")
      expect(r.headers.get('etag')).toBeNull();
      expect(JSON.stringify(await r.json())).not.toContain('series');
    }
    const anonymous = await get('none', otherId, otherEtag);
    expect(anonymous.status).toBe(401);
    expect(anonymous.headers.get('etag')).toBeNull();
    await anonymous.arrayBuffer();
  });
});
