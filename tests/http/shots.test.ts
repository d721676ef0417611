import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { outcomeSessionsResponseSchema, outcomesResponseSchema, rankingResponseSchema, sessionShotsSchema, shotImportResultSchema, shotProfileCreatedSchema, shotProfileDeletedSchema, shotProfilesResponseSchema, shotUnitsResponseSchema } from '@/lib/contracts/shots';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, serverStore, settled, upload } from './support/recordings-http';

// Shot logs over HTTP on the running app: import with a constructed clock offset (truth = construction), pairing,
// bad files with line and column, the raw file kept, the outcomes statistics against scipy.stats run on the live
// points (Debian's /usr/bin/python3 with python3-scipy), the contracts, and the role matrix of the new routes.

type Actor = 'none' | 'admin' | 'coach' | 'coach2' | 'student' | 'researcher';
const actors: Actor[] = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'];
const sessions = new Map<Actor, HttpSession>();
const coach = () => sessions.get('coach')!;

const OFFSET_S = 83.25; // the shot log's clock runs this far ahead of the insoles' (construction)
const RECORDED_AT = '2026-03-01T09:00:00Z';
let athleteId = 0;
let sessionId = 0;
let impacts: { swingId: number; t: number }[] = [];
let carryYdBySwing = new Map<number, number>();
const ballMphBySwing = new Map<number, number>();

const MPH = 0.44704; // NIST SP 811, exact
const YD = 0.9144; // NIST SP 811, exact

function clock(epochS: number): string {
  const d = new Date(epochS * 1000);
  const ms = Math.round((epochS * 1000) % 1000);
  return `${String(d.getUTCHours()).padStart(2, '0')}:${String(d.getUTCMinutes()).padStart(2, '0')}:${String(d.getUTCSeconds()).padStart(2, '0')},${String(ms).padStart(3, '0')}`;
}

async function postShots(session: HttpSession, sid: number, text: string, fields: Record<string, string> = {}) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', new Blob([text], { type: 'text/csv' }), 'bay-log.csv');
  const res = await session.fetch(`/api/sessions/${sid}/shots`, { method: 'POST', body: form });
  return { status: res.status, body: (await res.json()) as any };
}

const PROFILE = { delimiter: ';', decimal: ',', columns: { time: 'Uhrzeit', club: 'Schläger', ball_speed: 'Ball (mph)', carry: 'Carry (yd)' }, units: { ball_speed: 'mph', carry: 'yd' } };

beforeAll(async () => {
  const { E2E_BASE_URL } = e2eEnv();
  sessions.set('none', new HttpSession(E2E_BASE_URL));
  for (const a of actors.filter((x): x is Exclude<Actor, 'none'> => x !== 'none')) sessions.set(a, await signedIn(E2E_BASE_URL, DEMO[a], DEMO_PASSWORD));
  const athlete = await coach().json('/api/athletes', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ displayName: `Shots Player ${Date.now().toString(36)}`, handedness: 'right', stanceWidthMm: 380, dateOfBirth: null, homeClub: null }),
  });
  athleteId = (athlete.body as { athlete: { id: number } }).athlete.id;
  const content = generateSession({ seed: 5151, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 8, withMarker: true, metadata: { recorded_at: RECORDED_AT } }).csv();
  const res = await upload(coach(), { athleteId, handedness: 'right', stanceWidthMm: 380 }, [{ name: 'range.csv', content }]);
  expect(res.status).toBe(202);
  const done = await settled(coach(), res.body.recordings[0].id, 120_000);
  expect(done.status).toBe('ready');
  sessionId = done.sessionId;
  const view = await coach().json(`/api/sessions/${sessionId}/recordings`);
  const swings = (view.body as { swings: { id: number; stale: boolean; hidden: boolean; events: { impact: number } }[] }).swings.filter((s) => !s.stale && !s.hidden);
  impacts = swings.map((s) => ({ swingId: s.id, t: Date.parse(RECORDED_AT) / 1000 + s.events.impact }));
  expect(impacts.length).toBeGreaterThanOrEqual(6);
}, 180_000);

afterAll(async () => {
  if (athleteId) await coach().json(`/api/sessions/${sessionId}`, { method: 'DELETE' });
});

function shotLog(): string {
  const rows: string[] = [];
  impacts.forEach((imp, k) => {
    if (k === 2) return; // this swing's shot was not read (constructed)
    const carryYd = 150 + 3 * k;
    carryYdBySwing.set(imp.swingId, carryYd);
    ballMphBySwing.set(imp.swingId, 110 + k);
    rows.push(`${clock(imp.t + OFFSET_S + (k % 2 ? 0.012 : -0.008))};7-Eisen;${(110 + k).toFixed(1).replace('.', ',')};${carryYd.toFixed(1).replace('.', ',')}`);
  });
  rows.push(`${clock(impacts[4].t + 11 + OFFSET_S)};7-Eisen;108,0;147,0`); // a shot without a swing (constructed)
  rows.sort();
  return `Uhrzeit;Schläger;Ball (mph);Carry (yd)\n${rows.join('\n')}\n`;
}

describe('POST /api/sessions/:id/shots', () => {
  it('imports a semicolon, decimal-comma log in mph and yd and finds the constructed offset within 50 ms', async () => {
    carryYdBySwing = new Map();
    const res = await postShots(coach(), sessionId, shotLog(), { profile: JSON.stringify(PROFILE), saveProfileAs: 'Bay log (test)' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(Object.keys(res.body).sort()).toEqual(['imported', 'matched', 'offsetS', 'unmatchedShots', 'unmatchedSwings']);
    expect(shotImportResultSchema.parse(res.body)).toEqual(res.body);
    // clock times are seconds since midnight of the session date; the recording's clock is epoch seconds
    const sessionMidnight = Date.parse(`${new Date().toISOString().slice(0, 10)}T00:00:00Z`) / 1000;
    const recordingMidnight = Date.parse(RECORDED_AT.slice(0, 10)) / 1000;
    expect(Math.abs(res.body.offsetS - (OFFSET_S + sessionMidnight - recordingMidnight))).toBeLessThan(0.05);
    expect(res.body).toMatchObject({ imported: impacts.length, matched: impacts.length - 1, unmatchedShots: 1, unmatchedSwings: 1 });
  });

  it('stores SI values (NIST SP 811 exact factors) and pairs each shot with its constructed swing', async () => {
    const view = sessionShotsSchema.parse((await coach().json(`/api/sessions/${sessionId}/shots`)).body);
    for (const shot of view.shots.filter((s) => s.swingId !== null)) {
      expect(shot.carry).toBeCloseTo(carryYdBySwing.get(shot.swingId!)! * YD, 9);
      expect(shot.ballSpeed).toBeCloseTo(ballMphBySwing.get(shot.swingId!)! * MPH, 9);
    }
    expect(view.shots.filter((s) => s.swingId === null)).toHaveLength(1);
  });

  it('refuses a bad file with line and column on the file field, and keeps the raw upload', async () => {
    const bad = 'Uhrzeit;Schläger;Ball (mph);Carry (yd)\n09:00:01,000;7-Eisen;110,0;150,0\n09:00:41,000;7-Eisen;schnell;150,0\n';
    const res = await postShots(coach(), sessionId, bad, { profile: JSON.stringify(PROFILE) });
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors.file[0]).toMatch(/^line 3, column 3: "schnell" is not a number/);
    const db = serverDb();
    try {
      const row = await db('shot_imports').where({ session_id: sessionId, status: 'failed' }).orderBy('id', 'desc').first();
      expect(row.error_message).toContain('line 3, column 3');
      const store = serverStore();
      if (store) expect(await store.exists(row.storage_key)).toBe(true);
    } finally {
      await db.destroy();
    }
    // the import in use is untouched
    expect(sessionShotsSchema.parse((await coach().json(`/api/sessions/${sessionId}/shots`)).body).shots.length).toBe(impacts.length);
    const missing = await postShots(coach(), sessionId, 'a;b\n1;2\n', { profile: JSON.stringify(PROFILE) });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fieldErrors.file[0]).toMatch(/^line 1: the header has no column "Uhrzeit"/);
    const badProfile = await postShots(coach(), sessionId, 'a\n1\n', { profile: '{"columns":{}}' });
    expect(badProfile.status).toBe(422);
    expect(badProfile.body.error.fieldErrors.profile).toBeDefined();
  });
});

describe('the coach fixes the pairing', () => {
  it('unpairs, pairs by hand, shifts the offset and finds it again', async () => {
    let view = sessionShotsSchema.parse((await coach().json(`/api/sessions/${sessionId}/shots`)).body);
    const paired = view.shots.filter((s) => s.swingId !== null);
    const json = (method: string, body: unknown): RequestInit => ({ method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    let r = await coach().json(`/api/shots/${paired[0].id}`, json('PATCH', { swingId: null }));
    expect(r.status).toBe(200);
    view = sessionShotsSchema.parse(r.body);
    expect(view.shots.find((s) => s.id === paired[0].id)).toMatchObject({ swingId: null, pairing: 'unpaired' });
    r = await coach().json(`/api/shots/${paired[0].id}`, json('PATCH', { swingId: paired[0].swingId }));
    expect(sessionShotsSchema.parse(r.body).shots.find((s) => s.id === paired[0].id)).toMatchObject({ swingId: paired[0].swingId, pairing: 'manual' });
    r = await coach().json(`/api/shots/${paired[0].id}`, json('PATCH', { swingId: 999999 }));
    expect(r.status).toBe(422);
    const auto = view.import!.autoOffsetS!;
    r = await coach().json(`/api/sessions/${sessionId}/shots`, json('PATCH', { offsetS: auto + 5 }));
    expect(r.status).toBe(200);
    expect(shotImportResultSchema.parse(r.body)).toMatchObject({ offsetS: auto + 5, matched: 1 }); // only the manual pair
    r = await coach().json(`/api/sessions/${sessionId}/shots`, json('PATCH', { refind: true }));
    expect(Math.abs((r.body as { offsetS: number }).offsetS - auto)).toBeLessThan(1e-6);
    expect((r.body as { matched: number }).matched).toBe(impacts.length - 1);
  });
});

describe('GET /api/athletes/:id/outcomes', () => {
  it('answers n, r and its interval, rho, slope and intercept equal to scipy.stats on the same points', async () => {
    const res = await coach().json(`/api/athletes/${athleteId}/outcomes?metric=lead_pct_at_impact&outcome=carry`);
    expect(res.status).toBe(200);
    const body = outcomesResponseSchema.parse(res.body);
    expect(body).toEqual(res.body);
    expect(body.n).toBe(impacts.length - 1);
    // Reference: scipy.stats.pearsonr (+ confidence_interval), spearmanr, linregress - Debian's python3-scipy
    const script = `import json,sys\nfrom scipy import stats\nd=json.load(sys.stdin)\np=stats.pearsonr(d['x'],d['y'])\nci=p.confidence_interval(0.95)\nl=stats.linregress(d['x'],d['y'])\nprint(json.dumps([p.statistic,ci.low,ci.high,stats.spearmanr(d['x'],d['y']).correlation,l.slope,l.intercept]))`;
    const py = spawnSync('/usr/bin/python3', ['-c', script], { input: JSON.stringify({ x: body.points.map((p) => p.x), y: body.points.map((p) => p.y) }), encoding: 'utf8' });
    expect(py.status, py.stderr).toBe(0);
    const [r, lo, hi, rho, slope, intercept] = JSON.parse(py.stdout) as number[];
    expect(Math.abs(body.r! - r)).toBeLessThan(1e-9);
    expect(Math.abs(body.rLow! - lo)).toBeLessThan(1e-9);
    expect(Math.abs(body.rHigh! - hi)).toBeLessThan(1e-9);
    expect(Math.abs(body.rho! - rho)).toBeLessThan(1e-9);
    expect(Math.abs(body.slope! - slope)).toBeLessThan(1e-9);
    expect(Math.abs(body.intercept! - intercept)).toBeLessThan(1e-9);
  });

  it('ranks every metric with Benjamini-Hochberg adjusted p values, and filters by club', async () => {
    const res = await coach().json(`/api/athletes/${athleteId}/outcomes/ranking?outcome=carry&club=7-eisen`);
    const body = rankingResponseSchema.parse(res.body);
    expect(body).toEqual(res.body);
    expect(body.clubs).toEqual(['7-Eisen']);
    expect(body.rows).toHaveLength(12);
    const rs = body.rows.filter((r) => r.r !== null).map((r) => Math.abs(r.r!));
    expect(rs).toEqual([...rs].sort((a, b) => b - a));
    for (const row of body.rows) if (row.p !== null) expect(row.pAdjusted!).toBeGreaterThanOrEqual(row.p - 1e-15);
    const none = rankingResponseSchema.parse((await coach().json(`/api/athletes/${athleteId}/outcomes/ranking?outcome=carry&club=driver`)).body);
    expect(none.rows.every((r) => r.n === 0)).toBe(true);
    expect((await coach().json(`/api/athletes/${athleteId}/outcomes?metric=nope&outcome=carry`)).status).toBe(422);
  });

  it('lists the mean results per session next to the pressure measures', async () => {
    const res = await coach().json(`/api/athletes/${athleteId}/outcomes/sessions`);
    const body = outcomeSessionsResponseSchema.parse(res.body);
    expect(body).toEqual(res.body);
    expect(body.sessions).toHaveLength(1);
    expect(body.sessions[0].shots).toBe(impacts.length - 1);
    // mean carry of the paired shots, from the constructed yards (NIST SP 811: 1 yd = 0.9144 m)
    const paired = [...carryYdBySwing.values()];
    expect(body.sessions[0].carry).toBeCloseTo((paired.reduce((a, b) => a + b, 0) / paired.length) * YD, 9);
  });
});

describe('contracts of the shot profile and unit routes', () => {
  const conforms = async (path: string, schema: z.ZodType, init: RequestInit = {}, status = 200) => {
    const res = await coach().json(path, init);
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    expect(schema.parse(res.body)).toEqual(res.body);
    return res.body as any;
  };
  it('lists, saves, deletes profiles and sets units', async () => {
    const list = await conforms('/api/shot-profiles', shotProfilesResponseSchema);
    expect(list.profiles.map((p: { name: string }) => p.name)).toContain('Bay log (test)');
    const created = await conforms('/api/shot-profiles', shotProfileCreatedSchema, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Temp', profile: PROFILE }) }, 201);
    await conforms(`/api/shot-profiles/${created.profile.id}`, shotProfileDeletedSchema, { method: 'DELETE' });
    expect((await coach().json(`/api/shot-profiles/${created.profile.id}`, { method: 'DELETE' })).status).toBe(404);
    expect((await sessions.get('coach2')!.json(`/api/shot-profiles/${list.profiles[0].id}`, { method: 'DELETE' })).status).toBe(404);
    await conforms('/api/me/shot-units', shotUnitsResponseSchema, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ units: 'imperial' }) });
    expect((await conforms(`/api/sessions/${sessionId}/shots`, sessionShotsSchema)).units).toBe('imperial');
    await conforms('/api/me/shot-units', shotUnitsResponseSchema, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ units: 'metric' }) });
  });
});

// The role matrix of the new routes: no session 401; admin and researcher 403; the athlete's coach 200; another coach
// 404 (ids on other rosters are not confirmed); a student who is not this player 404, and the demo student on their
// own player (athlete 1, Ada) 200 for what they may read.
describe('role matrix', () => {
  type Case = { method: 'GET' | 'POST' | 'PATCH' | 'DELETE'; path: () => string; body?: () => unknown; multipart?: boolean; expected: Record<Actor, number> };
  const cases: Case[] = [
    { method: 'GET', path: () => `/api/sessions/${sessionId}/shots`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 404, researcher: 403 } },
    { method: 'GET', path: () => '/api/sessions/1/shots', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
    { method: 'POST', path: () => `/api/sessions/${sessionId}/shots`, multipart: true, expected: { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 } },
    { method: 'POST', path: () => '/api/sessions/1/shots', multipart: true, expected: { none: 401, admin: 403, coach: 201, coach2: 404, student: 403, researcher: 403 } },
    { method: 'PATCH', path: () => `/api/sessions/${sessionId}/shots`, body: () => ({ refind: true }), expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
    { method: 'PATCH', path: () => '/api/sessions/1/shots', body: () => ({ refind: true }), expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 403, researcher: 403 } },
    { method: 'GET', path: () => `/api/athletes/${athleteId}/outcomes?metric=tempo_ratio&outcome=carry`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 404, researcher: 403 } },
    { method: 'GET', path: () => '/api/athletes/1/outcomes?metric=tempo_ratio&outcome=carry', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
    { method: 'GET', path: () => `/api/athletes/${athleteId}/outcomes/sessions`, expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 404, researcher: 403 } },
    { method: 'GET', path: () => '/api/athletes/1/outcomes/ranking?outcome=ball_speed', expected: { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 } },
    { method: 'GET', path: () => '/api/shot-profiles', expected: { none: 401, admin: 403, coach: 200, coach2: 200, student: 403, researcher: 403 } },
    { method: 'POST', path: () => '/api/shot-profiles', body: () => ({ name: 'Matrix', profile: PROFILE }), expected: { none: 401, admin: 403, coach: 201, coach2: 201, student: 403, researcher: 403 } },
    { method: 'GET', path: () => '/api/me/shot-units', expected: { none: 401, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
    { method: 'DELETE', path: () => '/api/sessions/999999/shots', expected: { none: 401, admin: 403, coach: 404, coach2: 404, student: 403, researcher: 403 } },
  ];
  for (const c of cases) {
    for (const actor of actors) {
      it(`${c.method} ${c.path.toString().replace(/^\(\) => /, '')} as ${actor} -> ${c.expected[actor]}`, async () => {
        const session = sessions.get(actor)!;
        let res: { status: number; body: unknown; contentType: string };
        if (c.multipart) {
          const form = new FormData();
          form.append('file', new Blob(['shot_time,carry_m\n1,150\n20,151\n'], { type: 'text/csv' }), 'plain.csv');
          res = await session.json(c.path(), { method: 'POST', body: form });
        } else {
          res = await session.json(c.path(), c.body ? { method: c.method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(c.body()) } : { method: c.method });
        }
        expect(res.status, JSON.stringify(res.body)).toBe(c.expected[actor]);
        expect(res.contentType).toContain('application/json');
      });
    }
  }
});
