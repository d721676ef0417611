import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { serverDb, settled, upload } from './support/recordings-http';

// Issue "Every swing" through the running app: an upload with no form overrides gives what `npm run analyze` prints
// for the same file (the file's own metadata wins over the athlete's profile), GET /api/recordings/:id lists the
// rejected candidates, and POST /api/recordings/:id/candidates/promote counts one as a swing, kept over a reprocess.
// Demo ids (db/demo/scenario.ts): athlete 3 on coach@'s roster with session 6; coach2@ does not see it.

const env = e2eEnv();
let coach: HttpSession;
let coach2: HttpSession;
let student: HttpSession;
let db: Knex;
// two swings with walking before each (the walking gives rejected candidates); the file says right-handed, 400 mm
const golf = generateSession({ seed: 23, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 2, withMarker: false, distractors: ['walk'] });
const golfCsv = golf.csv();

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
  coach2 = await signedIn(env.E2E_BASE_URL, DEMO.coach2, DEMO_PASSWORD);
  student = await signedIn(env.E2E_BASE_URL, DEMO.student, DEMO_PASSWORD);
});
afterAll(async () => {
  await seedDemo(db);
  await db.destroy();
});

async function analyzeCli(content: string): Promise<any> {
  const dir = mkdtempSync(join(tmpdir(), 'stanceline-analyze-'));
  const file = join(dir, 'golf.csv');
  writeFileSync(file, content);
  const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', file], { maxBuffer: 64 << 20 });
  return JSON.parse(stdout);
}

const promote = (s: HttpSession, id: number, body: unknown) =>
  s.json(`/api/recordings/${id}/candidates/promote`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

describe('candidates and promotion through the API', () => {
  let id = 0;
  let candidate: { timeS: number; reason: string; reasonText: string };

  it('an upload with no form overrides uses the file over the profile and matches `npm run analyze`', async () => {
    const patched = await coach.json('/api/athletes/3', { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ stanceWidthMm: 380, handedness: 'left' }) });
    expect(patched.status).toBe(200);
    const res = await upload(coach, { athleteId: 3, sessionId: 6 }, [{ name: 'walk-and-swing.csv', content: golfCsv }]);
    expect(res.status).toBe(202);
    id = res.body.recordings[0].id;
    const done = await settled(coach, id);
    expect(done.status).toBe('ready');
    const cli = await analyzeCli(golfCsv);
    expect(cli.swings).toHaveLength(2); // the generator's two swings
    expect(done.parameters).toMatchObject({ handedness: 'right', stance_width_mm: 400 });
    expect(done.parameterSources.stanceWidthMm).toEqual({ used: 400, source: 'file', file: 400, fallback: 380 });
    expect(done.swings.map((s: any) => s.events)).toEqual(cli.swings.map((s: any) => s.events));
    expect(done.swings.map((s: any) => s.partial)).toEqual(cli.swings.map((s: any) => s.partial));
    expect(done.candidates.length).toBeGreaterThan(0);
    candidate = done.candidates[0];
    expect(Object.keys(candidate).sort()).toEqual(['reason', 'reasonText', 'timeS']);
  });

  it('refuses a student, another coach and a time with no candidate', async () => {
    expect((await promote(student, id, { timeS: candidate.timeS })).status).toBe(403);
    expect([403, 404]).toContain((await promote(coach2, id, { timeS: candidate.timeS })).status);
    const bad = await promote(coach, id, { timeS: 0.123 });
    expect(bad.status).toBe(422);
    expect(Object.keys((bad.body as any).error.fieldErrors)).toEqual(['timeS']);
    expect((await promote(coach, id, { time: 1 })).status).toBe(422);
  });

  it('counts a promoted candidate as a swing, audited, and keeps it over a reprocess', async () => {
    const res = await promote(coach, id, { timeS: candidate.timeS });
    expect(res.status).toBe(202);
    expect((res.body as any).promotion).toMatchObject({ timeS: candidate.timeS, reason: candidate.reason });
    let done = await settled(coach, id);
    expect(done.swings.filter((s: any) => s.promoted !== null)).toHaveLength(1);
    expect(done.promotions).toHaveLength(1);
    expect(done.promotions[0].userId).not.toBeNull();

    const again = await coach.json(`/api/recordings/${id}/reprocess`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ cutoffHz: 18 }) });
    expect(again.status).toBe(202);
    done = await settled(coach, id);
    expect(done.parameters.cutoff_hz).toBe(18);
    expect(done.swings.filter((s: any) => s.promoted !== null && !s.stale)).toHaveLength(1);
    expect(done.swings.filter((s: any) => !s.stale)).toHaveLength(3);
  });
});
