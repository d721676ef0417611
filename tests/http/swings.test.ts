import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { swingResponseSchema, type SwingDetail } from '@/lib/contracts/swings';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, settled, upload } from './support/recordings-http';

// GET /api/swings/:id and the upload, session and swing pages by role, against the running app.
// The swing's numbers are compared with `npm run analyze` on the same bytes with the same parameters (the
// product's own CLI, itself checked against scipy and the generator's truth in tests/signal).
// Demo ids (db/demo/scenario.ts): athlete 1 Ada Fenwick is student@'s own and on coach@'s roster (sessions 1-3);
// session 8 belongs to athlete 4 on coach2@'s roster.

const env = e2eEnv();
const actors = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, HttpSession>();
let db: Knex;

const golfCsv = generateSession({ seed: 5, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 2, withMarker: true }).csv();
const PARAMS = ['--handedness', 'right', '--stance-width-mm', '380', '--cutoff-hz', '20'];

type AnalyzeJson = {
  processing: Record<string, unknown>;
  swings: {
    index: number;
    events: Record<string, number>;
    impact_source: string;
    tempo_ratio: number | null;
    at_events: Record<string, { lead_pct: number | null; lead_heel_pct: number | null; trail_heel_pct: number | null; cop_x_mm: number | null; cop_y_mm: number | null }>;
    phases: { name: string; duration_s: number | null; cop_path_mm: number | null; peak_cop_speed_mm_s: number | null; mean_lead_pct: number | null }[];
  }[];
};

let expected: AnalyzeJson;
let recordingId = 0;
let swingIds: number[] = [];

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  sessions.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of actors.filter((a) => a !== 'none')) sessions.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor as Exclude<Actor, 'none'>], DEMO_PASSWORD));

  const dir = mkdtempSync(join(tmpdir(), 'stanceline-swings-'));
  const file = join(dir, 'golf.csv');
  writeFileSync(file, golfCsv);
  const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', file, ...PARAMS], { maxBuffer: 64 << 20 });
  expected = JSON.parse(stdout) as AnalyzeJson;

  const coach = sessions.get('coach')!;
  const res = await upload(coach, { athleteId: 1, sessionId: 1, handedness: 'right', stanceWidthMm: 380, cutoffHz: 20 }, [{ name: 'studio-bay-2.csv', content: golfCsv }]);
  expect(res.status).toBe(202);
  recordingId = res.body.recordings[0].id;
  const done = await settled(coach, recordingId);
  expect(done.status).toBe('ready');
  swingIds = done.swings.map((s: { id: number }) => s.id);
});

afterAll(async () => {
  await seedDemo(db); // the next test files expect the plain demo scenario
  await db.destroy();
});

describe('GET /api/swings/:id', () => {
  it('gives the coach every swing with the events, values at events and phase table `npm run analyze` prints', async () => {
    expect(expected.swings.length).toBeGreaterThan(0);
    expect(swingIds).toHaveLength(expected.swings.length);
    for (const [k, want] of expected.swings.entries()) {
      const { status, body } = await sessions.get('coach')!.json(`/api/swings/${swingIds[k]}`);
      expect(status).toBe(200);
      const swing: SwingDetail = swingResponseSchema.parse(body).swing;
      expect(swing.index).toBe(want.index);
      expect(swing.impactSource).toBe(want.impact_source); // the file has an impact column (withMarker)
      expect(swing.tempoRatio).toBe(want.tempo_ratio);
      expect(Object.fromEntries(swing.events.map((e) => [e.name, e.timeS]))).toEqual(want.events);
      expect(
        Object.fromEntries(
          swing.events.map((e) => [e.name, { lead_pct: e.leadPct, lead_heel_pct: e.leadHeelPct, trail_heel_pct: e.trailHeelPct, cop_x_mm: e.copXMm, cop_y_mm: e.copYMm }]),
        ),
      ).toEqual(want.at_events);
      expect(
        swing.phases.map((p) => ({ name: p.name, duration_s: p.durationS, cop_path_mm: p.copPathMm, peak_cop_speed_mm_s: p.peakCopSpeedMmS, mean_lead_pct: p.meanLeadPct })),
      ).toEqual(want.phases.map(({ name, duration_s, cop_path_mm, peak_cop_speed_mm_s, mean_lead_pct }) => ({ name, duration_s, cop_path_mm, peak_cop_speed_mm_s, mean_lead_pct })));
      // The parameters that made the numbers, as the CLI reports them (the version is reported separately).
      const { algorithm_version: version, ...params } = expected.processing;
      expect(swing.recording.algorithmVersion).toBe(version);
      expect(swing.recording.parameters).toEqual(params);
      expect(swing.recording.id).toBe(recordingId);
      expect(swing.session.id).toBe(1);
      expect(swing.athlete.displayName).toBe('Ada Fenwick');
    }
  });

  const statusBy: Record<Actor, number> = { none: 401, admin: 403, coach: 200, coach2: 404, student: 200, researcher: 403 };
  for (const actor of actors) {
    it(`answers ${statusBy[actor]} to ${actor}`, async () => {
      const { status, body } = await sessions.get(actor)!.json(`/api/swings/${swingIds[0]}`);
      expect(status).toBe(statusBy[actor]);
      if (status !== 200) expect(body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
    });
  }

  it('answers 404 for an unknown or malformed id', async () => {
    expect((await sessions.get('coach')!.json('/api/swings/999999')).status).toBe(404);
    expect((await sessions.get('coach')!.json('/api/swings/abc')).status).toBe(404);
  });
});

describe('pages of recordings and swings by role', () => {
  type Expect = number | `-> ${string}`;
  const cases = (): { path: string; expected: Record<Actor, Expect> }[] => [
    { path: '/upload', expected: { none: '-> /sign-in?callbackUrl=%2Fupload', admin: '-> /', coach: 200, coach2: 200, student: '-> /', researcher: '-> /' } },
    { path: '/sessions/1', expected: { none: '-> /sign-in?callbackUrl=%2Fsessions%2F1', admin: '-> /', coach: 200, coach2: 404, student: 200, researcher: '-> /' } },
    { path: '/sessions/8', expected: { none: '-> /sign-in?callbackUrl=%2Fsessions%2F8', admin: '-> /', coach: 404, coach2: 200, student: 404, researcher: '-> /' } },
    { path: `/swings/${swingIds[0]}`, expected: { none: `-> /sign-in?callbackUrl=%2Fswings%2F${swingIds[0]}`, admin: '-> /', coach: 200, coach2: 404, student: 200, researcher: '-> /' } },
  ];

  it('sends each role where it belongs', async () => {
    for (const page of cases()) {
      for (const [actor, want] of Object.entries(page.expected) as [Actor, Expect][]) {
        const res = await sessions.get(actor)!.fetch(page.path);
        await res.arrayBuffer();
        if (typeof want === 'number') expect(res.status, `${page.path} as ${actor}`).toBe(want);
        else {
          expect([307, 308], `${page.path} as ${actor}`).toContain(res.status);
          expect(res.headers.get('location'), `${page.path} as ${actor}`).toBe(want.slice(3));
        }
      }
    }
  });

  it('shows the student their session read-only, without an upload link', async () => {
    const html = await (await sessions.get('student')!.fetch('/sessions/1')).text();
    expect(html).toContain('studio-bay-2.csv');
    expect(html).toContain('Read-only');
    expect(html).not.toContain('/upload?athlete=');
    expect(html).toContain('Coaching information, not a medical assessment');
    const coachHtml = await (await sessions.get('coach')!.fetch('/sessions/1')).text();
    expect(coachHtml).toContain('/upload?athlete=1&amp;session=1');
  });

  it('shows the phase table on the swing page', async () => {
    const html = await (await sessions.get('coach')!.fetch(`/swings/${swingIds[0]}`)).text();
    expect(html).toContain('data-testid="phase-table"');
    expect(html).toContain('Follow-through');
    expect(html).toContain(expected.processing.algorithm_version as string);
    expect(html).toContain('Coaching information, not a medical assessment');
  });
});
