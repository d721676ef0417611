import fc from 'fast-check';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { signedIn, type HttpSession } from './support/http-session';
import { serverDb, upload } from './support/recordings-http';

// 300 corrupted variants of one valid recording (fast-check, fixed seed: cut, duplicate, swap and garble lines and
// cells). Each must end as a 4xx answer or a recording that is `ready` or `failed` with a reason; the server must stay
// up and the database consistent (no result rows for a failed recording, no job left queued or running).

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

const variants = fc.sample(fc.array(mutation, { minLength: 1, maxLength: 3 }), { seed: 20261202, numRuns: 300 }).map((ms) => ms.reduce(apply, base));

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
  it('300 variants each end as a 4xx or ready/failed with a reason; server up; database consistent', async () => {
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
    expect(ids.size + refused).toBeGreaterThan(250); // identical variants collapse into one recording (same SHA-256)

    let listed: any;
    const until = Date.now() + 240_000;
    for (;;) {
      listed = (await coach.json(`/api/sessions/${sessionId}/recordings`)).body;
      if (listed.recordings.every((r: any) => r.status === 'ready' || r.status === 'failed')) break;
      if (Date.now() > until) throw new Error('recordings still processing after 240 s');
      await new Promise((r) => setTimeout(r, 500));
    }
    expect(listed.recordings).toHaveLength(ids.size);
    for (const r of listed.recordings) {
      if (r.status === 'failed') {
        expect(r.error.message.length).toBeGreaterThan(5);
        if (r.error.line !== null) expect(r.error.line).toBeGreaterThanOrEqual(1);
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
    expect((await coach.json('/api/me')).status).toBe(200);
  });
});
