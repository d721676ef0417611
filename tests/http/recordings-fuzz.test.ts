import fc from 'fast-check';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { signedIn, type HttpSession } from './support/http-session';
import { serverDb, serverStore, upload } from './support/recordings-http';

// 1,000 corrupted variants of one valid recording (fast-check, fixed seed: cut, duplicate, swap and garble lines and
// cells). Each must end as a 4xx answer or a recording that is `ready`, or `failed` with a reason naming its line and
// column; the server must stay up and the database consistent (no result rows for a failed recording, no job left
// queued or running), and every kept recording's raw file must still be in the store.

const env = e2eEnv();
let coach: HttpSession;
let db: Knex;

const base = generateSession({ seed: 5, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 1, withMarker: false }).csv();
const baseLines = base.split('\n');

type Mutation =
  | { op: 'cut'; at: number }
  | { op: 'duplicate'; line: number }
  | { op: 'swap'; a: number; b: number }
  | { op: 'drop'; line: number }
  | { op: 'garble-cell'; line: number; cell: number; text: string }
  | { op: 'garble-line'; line: number; text: string };

const lineIndex = fc.nat({ max: baseLines.length - 1 });
const junk = fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom('', 'NaN', '-1e309', '1,5', '#', '\t', '0x1F', '١٢٣', '"q"'));
const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ op: fc.constant('cut' as const), at: fc.nat({ max: base.length }) }),
  fc.record({ op: fc.constant('duplicate' as const), line: lineIndex }),
  fc.record({ op: fc.constant('swap' as const), a: lineIndex, b: lineIndex }),
  fc.record({ op: fc.constant('drop' as const), line: lineIndex }),
  fc.record({ op: fc.constant('garble-cell' as const), line: lineIndex, cell: fc.nat({ max: 17 }), text: junk }),
  fc.record({ op: fc.constant('garble-line' as const), line: lineIndex, text: junk }),
);

function apply(text: string, m: Mutation): string {
  if (m.op === 'cut') return text.slice(0, Math.min(m.at, text.length));
  const lines = text.split('\n');
  const at = (i: number) => Math.min(i, lines.length - 1);
  if (m.op === 'duplicate') lines.splice(at(m.line), 0, lines[at(m.line)]);
  else if (m.op === 'swap') [lines[at(m.a)], lines[at(m.b)]] = [lines[at(m.b)], lines[at(m.a)]];
  else if (m.op === 'drop') lines.splice(at(m.line), 1);
  else if (m.op === 'garble-line') lines[at(m.line)] = m.text;
  else {
    const cells = lines[at(m.line)].split(',');
    cells[Math.min(m.cell, cells.length - 1)] = m.text;
    lines[at(m.line)] = cells.join(',');
  }
  return lines.join('\n');
}

const VARIANTS = 1000;
const variants = fc.sample(fc.array(mutation, { minLength: 1, maxLength: 3 }), { seed: 20261202, numRuns: VARIANTS }).map((ms) => ms.reduce(apply, base));

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
});
afterAll(async () => {
  await seedDemo(db);
  await db.destroy();
});

describe('fuzz: corrupted recordings', () => {
  it(`${VARIANTS} variants each end as a 4xx or ready/failed with line and column; server up; database consistent; raw files kept`, { timeout: 900_000 }, async () => {
    const ids = new Set<number>();
    let sessionId: number | undefined;
    let refused = 0;
    for (let i = 0; i < variants.length; i += 20) {
      const files = variants.slice(i, i + 20).map((content, k) => ({ name: `variant-${i + k}.csv`, content }));
      const res = await upload(coach, { athleteId: 3, sessionId }, files);
      if (res.status >= 400 && res.status < 500) {
        refused++;
        expect(res.body.error.message).toEqual(expect.any(String));
        continue;
      }
      expect(res.status).toBe(202);
      for (const r of res.body.recordings) ids.add(r.id);
      sessionId = res.body.recordings[0].sessionId;
    }
    expect(ids.size + refused).toBeGreaterThan(VARIANTS * 0.8); // identical variants collapse into one recording (same SHA-256)

    let listed: any;
    const until = Date.now() + 780_000;
    for (;;) {
      listed = (await coach.json(`/api/sessions/${sessionId}/recordings`)).body;
      if (listed.recordings.every((r: any) => r.status === 'ready' || r.status === 'failed')) break;
      if (Date.now() > until) throw new Error('recordings still processing after 780 s');
      await new Promise((r) => setTimeout(r, 500));
    }
    expect(listed.recordings).toHaveLength(ids.size);
    for (const r of listed.recordings) {
      if (r.status === 'failed') {
        expect(r.error.message.length).toBeGreaterThan(5);
        expect(r.error.message.length).toBeLessThan(400);
        expect({ id: r.id, message: r.error.message, line: r.error.line >= 1, column: r.error.column >= 1 }).toEqual({ id: r.id, message: r.error.message, line: true, column: true });
        expect(r.error.message).toMatch(new RegExp(`^line ${r.error.line}, column ${r.error.column}: `));
        expect(r.swingCount).toBe(0);
      }
    }
    for (const s of listed.swings) {
      const t = ['address', 'top', 'transition', 'impact', 'finish'].map((e) => s.events[e]);
      expect(t.every((v: number, k: number) => Number.isFinite(v) && (k === 0 || v > t[k - 1]))).toBe(true);
    }

    const failedIds = listed.recordings.filter((r: any) => r.status === 'failed').map((r: any) => r.id);
    expect(await db('swings').whereIn('recording_id', failedIds).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await db('recording_series').whereIn('recording_id', failedIds).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await db('processing_jobs').whereIn('state', ['queued', 'running']).count({ n: '*' })).toEqual([{ n: 0 }]);
    const readyIds = listed.recordings.filter((r: any) => r.status === 'ready').map((r: any) => r.id);
    expect(await db('recording_series').whereIn('recording_id', readyIds).count({ n: '*' })).toEqual([{ n: readyIds.length }]);
    expect(failedIds.length).toBeGreaterThan(0);
    expect(readyIds.length).toBeGreaterThan(0);
    // nothing half-written: every failed job failed once with its reason, no recording without its job
    const jobs = await db('processing_jobs').whereIn('recording_id', [...ids]).select('recording_id', 'state', 'attempts');
    expect(jobs).toHaveLength(ids.size);
    for (const job of jobs) expect(job.state === 'done' || (job.state === 'failed' && job.attempts === 1), JSON.stringify(job)).toBe(true);
    // the raw file of every kept recording is still in the store, at its recorded size
    const store = serverStore();
    if (store) {
      const kept = await db('recordings').whereIn('id', [...ids]).select('storage_key');
      const missing: string[] = [];
      for (const { storage_key: key } of kept) if (!(await store.exists(key))) missing.push(key);
      expect(missing).toEqual([]);
    }
    expect((await coach.json('/api/me')).status).toBe(200);
  });
});
