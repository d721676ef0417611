import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, settled, upload } from './support/recordings-http';

// Swing scoring, reference bands, compare, progress and the drill report against the running app, on two
// uploaded recordings of the project's synthetic generator (a lesson, session 1, and a practice, session 2, of
// athlete 1 Ada Fenwick = student@, coached by coach@). The numbers the API reports are checked against the
// analyzer's own stored values read straight from the database (swing_event_values, swing_events), the arithmetic
// (means) done here by hand; the statistics themselves are checked against scipy in tests/lib/compare-stats.test.ts.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, HttpSession>();
let db: Knex;
let lessonSwings: number[] = [];
let practiceSwings: number[] = [];

const send = (actor: Actor, method: string, path: string, body?: unknown) =>
  sessions.get(actor)!.json(path, { method, headers: body === undefined ? {} : { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });

async function matrix(method: string, path: string, body: (() => unknown) | undefined, expected: Record<Actor, number>) {
  const got = {} as Record<Actor, number>;
  // the owner last, so that a write it makes does not change the others' answers
  for (const actor of [...actors.filter((a) => a !== 'coach'), 'coach' as const]) got[actor] = (await send(actor, method, path, body?.())).status;
  expect(got).toEqual(expected);
}

const csv = (seed: number, swings: number) => generateSession({ seed, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings, withMarker: true }).csv();
const avg = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

async function uploadTo(sessionId: number, name: string, seed: number, swings: number): Promise<number[]> {
  const res = await upload(sessions.get('coach')!, { athleteId: 1, sessionId, handedness: 'right', stanceWidthMm: 380 }, [{ name, content: csv(seed, swings) }]);
  expect(res.status).toBe(202);
  const done = await settled(sessions.get('coach')!, res.body.recordings[0].id);
  expect(done.status).toBe('ready');
  return done.swings.map((s: { id: number }) => s.id);
}

/** The analyzer's stored value of one measure at one event for these swings (not hidden), from the database. */
async function stored(ids: number[], event: string, column: string): Promise<number[]> {
  const rows = await db('swing_event_values as v').join('swings as s', 's.id', 'v.swing_id').whereIn('v.swing_id', ids).where({ 'v.event': event, 's.hidden': false }).orderBy('v.swing_id').select(`v.${column} as value`);
  return rows.map((r) => Number(r.value));
}

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  sessions.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors.filter((a) => a !== 'none')) sessions.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor as Exclude<Actor, 'none'>], DEMO_PASSWORD));
  lessonSwings = await uploadTo(1, 'bay-2-band.csv', 31, 5);
  practiceSwings = await uploadTo(2, 'mat-6-band.csv', 32, 4);
  expect(lessonSwings.length).toBeGreaterThanOrEqual(4);
  expect(practiceSwings.length).toBeGreaterThanOrEqual(3);
});

afterAll(async () => {
  await seedDemo(db);
  await db.destroy();
});

describe('GET /api/swings/:id/score', () => {
  it('role matrix: the same rules as the swing', async () => {
    await matrix('GET', `/api/swings/${lessonSwings[0]}/score`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 });
    expect((await send('coach', 'GET', '/api/swings/999999/score')).status).toBe(404);
  });

  it('scores against the irons default without a label; each check is |actual - expected| <= tolerance on the stored value', async () => {
    const id = lessonSwings[0];
    const body = (await send('student', 'GET', `/api/swings/${id}/score`)).body as any;
    expect(body.clubGroup).toBe('irons');
    expect(body.target.id).toBe(3); // db/demo/targets.ts: defaults 1-4 in the order driver, woods-hybrids, irons, wedges
    expect(body.band).toBeNull();
    for (const c of body.target.checks) {
      const [value] = await stored([id], c.event, { leadPct: 'lead_pct', leadHeelPct: 'lead_heel_pct', trailHeelPct: 'trail_heel_pct' }[c.measure as string]!);
      expect(c.actual).toBeCloseTo(value, 9);
      expect(c.pass).toBe(Math.abs(value - c.expected) <= c.tolerance);
    }
    const passed = body.target.checks.filter((c: any) => c.pass).length + (body.target.tempo?.pass ? 1 : 0);
    expect(body.target.summary).toMatchObject({ passed, total: body.target.checks.length + 1 });
  });

  it('picks the target by the swing’s club label: driver default, and the athlete’s own wedges target', async () => {
    const id = lessonSwings[1];
    expect((await send('coach', 'PATCH', `/api/swings/${id}`, { labels: { club: 'driver' } })).status).toBe(200);
    expect(((await send('coach', 'GET', `/api/swings/${id}/score`)).body as any).target.id).toBe(1);
    expect((await send('coach', 'PATCH', `/api/swings/${id}`, { labels: { club: 'wedge' } })).status).toBe(200);
    expect(((await send('coach', 'GET', `/api/swings/${id}/score`)).body as any).target.id).toBe(5);
    expect((await send('coach', 'PATCH', `/api/swings/${id}`, { labels: { club: null } })).status).toBe(200);
  });
});

describe('bands', () => {
  let bandId = 0;

  it('POST /api/bands role matrix: 201 { id, swingCount } for the coach', async () => {
    const body = () => ({ name: 'Ada lesson model', swingIds: lessonSwings.slice(0, 3) });
    await matrix('POST', '/api/bands', body, { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 });
    const res = await send('coach', 'POST', '/api/bands', body());
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(Number), swingCount: 3 });
    bandId = (res.body as { id: number }).id;
  });

  it('422 with fewer than 3 usable swings, naming swingIds', async () => {
    const two = await send('coach', 'POST', '/api/bands', { name: 'Too small', swingIds: lessonSwings.slice(0, 2) });
    expect(two.status).toBe(422);
    expect((two.body as any).error.fieldErrors.swingIds[0]).toMatch(/at least 3 usable/);
    const unknown = await send('coach', 'POST', '/api/bands', { name: 'Unknown', swingIds: [...lessonSwings.slice(0, 2), 999999] });
    expect(unknown.status).toBe(422);
    expect((unknown.body as any).error.fieldErrors.swingIds[0]).toMatch(/999999/);
  });

  it('GET /api/bands/:id: 101-point axis, landmarks and mean curve agree with the stored event values', async () => {
    const res = await send('coach', 'GET', `/api/bands/${bandId}`);
    expect(res.status).toBe(200);
    const band = (res.body as any).band;
    expect(band.swingIds).toEqual(lessonSwings.slice(0, 3));
    expect(band.axis).toHaveLength(101);
    expect(band.landmarks.address).toBe(0);
    expect(band.landmarks.finish).toBe(100);
    for (const c of ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copX']) expect(band.curves[c].mean).toHaveLength(101);
    // registered position 0 is each swing's address sample, 100 its finish: the band mean there is the mean of the stored values
    expect(band.curves.leadPct.mean[0]).toBeCloseTo(avg(await stored(band.swingIds, 'address', 'lead_pct')), 6);
    expect(band.curves.leadPct.mean[100]).toBeCloseTo(avg(await stored(band.swingIds, 'finish', 'lead_pct')), 6);
    // impact landmark = mean of (t_impact - t_address) / (t_finish - t_address) * 100 over the swings (Ramsay & Silverman registration)
    const ev = await db('swing_events').whereIn('swing_id', band.swingIds).select('swing_id', 'name', 'time_s');
    const rel = band.swingIds.map((id: number) => {
      const t = (n: string) => Number(ev.find((e) => Number(e.swing_id) === id && e.name === n)!.time_s);
      return ((t('impact') - t('address')) / (t('finish') - t('address'))) * 100;
    });
    expect(band.landmarks.impact).toBeCloseTo(avg(rel), 9);
    expect(band.parameters.points).toBe(101);
    expect(band.k).toBe(1);
  });

  it('GET role matrix; the list is the coaches’; a private band is the owner’s (and their students’ by id), a shared one the academy’s coaches’', async () => {
    await matrix('GET', '/api/bands', undefined, { none: 401, admin: 403, coach: 200, coach2: 200, student: 403, researcher: 403 });
    await matrix('GET', `/api/bands/${bandId}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 });
    const shared = await send('coach', 'POST', '/api/bands', { name: 'Shared model', swingIds: lessonSwings.slice(0, 3), shared: true, k: 2 });
    const sharedId = (shared.body as { id: number }).id;
    expect((await send('coach2', 'GET', `/api/bands/${sharedId}`)).status).toBe(200);
    const list = ((await send('coach2', 'GET', '/api/bands')).body as { bands: any[] }).bands;
    expect(list.map((b) => b.id)).toEqual([sharedId]);
    expect(list[0]).toMatchObject({ swingCount: 3, k: 2, shared: true, ownerName: 'Maren Solberg' });
  });

  it('scores a fourth swing against the band: inside %, RMS and CMC', async () => {
    const res = await send('student', 'GET', `/api/swings/${lessonSwings[3]}/score?band=${bandId}`);
    expect(res.status).toBe(200);
    const band = (res.body as any).band;
    expect(band.id).toBe(bandId);
    expect(band.insidePct).toBeGreaterThanOrEqual(0);
    expect(band.insidePct).toBeLessThanOrEqual(100);
    expect(band.rms).toBeGreaterThan(0);
    expect(band.cmc).toBeLessThanOrEqual(1);
    expect(band.byCurve.leadPct).toMatchObject({ insidePct: band.insidePct, rms: band.rms, cmc: band.cmc });
    // a member of the band is closer to its mean than the band's width says on average: RMS below the lead % spread
    expect((await send('coach2', 'GET', `/api/swings/${lessonSwings[3]}/score?band=${bandId}`)).status).toBe(404);
    expect((await send('coach', 'GET', `/api/swings/${lessonSwings[3]}/score?band=999999`)).status).toBe(404);
  });

  it('a swing marked "not a swing" does not count: 422 when that leaves fewer than 3', async () => {
    expect((await send('coach', 'PATCH', `/api/swings/${practiceSwings[0]}`, { labels: { notASwing: true } })).status).toBe(200);
    const res = await send('coach', 'POST', '/api/bands', { name: 'With a hidden one', swingIds: practiceSwings.slice(0, 3) });
    expect(res.status).toBe(422);
    expect((res.body as any).error.fieldErrors.swingIds[0]).toMatch(/not a swing/);
    expect((await send('coach', 'PATCH', `/api/swings/${practiceSwings[0]}`, { labels: { notASwing: false } })).status).toBe(200);
  });
});

describe('compare and progress', () => {
  const q = 'a=context:lesson&b=context:practice&metrics=impact.leadPct,tempoRatio';

  it('role matrix', async () => {
    await matrix('GET', `/api/athletes/1/compare?${q}`, undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 });
    await matrix('GET', '/api/athletes/1/progress?metrics=impact.leadPct', undefined, { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 });
    expect((await send('coach', 'GET', '/api/athletes/1/compare?a=context:range&b=context:practice')).status).toBe(422);
  });

  it('lesson vs practice: values, means and a Welch interval around the difference', async () => {
    const body = (await send('coach', 'GET', `/api/athletes/1/compare?${q}`)).body as any;
    const a = await stored(lessonSwings, 'impact', 'lead_pct');
    const b = await stored(practiceSwings, 'impact', 'lead_pct');
    expect(body.a.n).toBe(a.length);
    expect(body.b.n).toBe(b.length);
    expect(body.a.values['impact.leadPct'].length).toBe(a.length);
    const d = body.differences.find((x: any) => x.metric === 'impact.leadPct');
    expect(d.meanA).toBeCloseTo(avg(a), 9);
    expect(d.meanB).toBeCloseTo(avg(b), 9);
    expect(d.diff).toBeCloseTo(avg(b) - avg(a), 9);
    expect(d.method).toBe('welch');
    expect(d.note).toBeNull();
    expect(d.ci95[0]).toBeLessThan(d.diff);
    expect(d.ci95[1]).toBeGreaterThan(d.diff);
    expect(body.a.meanCurve.axis).toHaveLength(101);
  });

  it('an honest note instead of an interval when a set is too small', async () => {
    const body = (await send('coach', 'GET', '/api/athletes/1/compare?a=context:lesson&b=month:2026-03&metrics=impact.leadPct')).body as any;
    expect(body.b.n).toBe(0);
    expect(body.differences[0]).toMatchObject({ ci95: null, diff: null });
    expect(body.differences[0].note).toMatch(/too few swings to say anything/i);
  });

  it('progress: per session in date order, means and target score', async () => {
    const body = (await send('student', 'GET', '/api/athletes/1/progress?metrics=impact.leadPct')).body as any;
    expect(body.sessions.map((s: any) => s.id)).toEqual([1, 2, 3]); // demo sessions of Ada by date
    const s1 = body.sessions[0];
    const a = await stored(lessonSwings, 'impact', 'lead_pct');
    expect(s1.n).toBe(a.length);
    expect(s1.metrics['impact.leadPct'].mean).toBeCloseTo(avg(a), 9);
    expect(s1.targetScore.total).toBe(a.length * 7); // 6 checks + tempo per swing on the irons default
    expect(body.sessions[2]).toMatchObject({ n: 0, targetScore: null });
  });

  it('drill report of session 2: the checks drill 1 works on, before vs after its assignment', async () => {
    const r = (await send('coach', 'GET', '/api/sessions/2/drill-report')).body as any;
    const check = r.assignments.find((x: any) => x.id === 1).checks.find((c: any) => c.event === 'impact');
    const before = await stored(lessonSwings, 'impact', 'lead_pct');
    const after = await stored(practiceSwings, 'impact', 'lead_pct');
    expect(check.before.n).toBe(before.length);
    expect(check.before.mean).toBeCloseTo(avg(before), 9);
    expect(check.after.mean).toBeCloseTo(avg(after), 9);
    expect(check.moved).toBeCloseTo(avg(after) - avg(before), 9);
  });
});
