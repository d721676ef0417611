import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { knexConfig } from '@/knexfile';
import { analyzeRecording } from '@/lib/signal/analyze';
import { parseRecording } from '@/lib/signal/read';
import { DETECTION_DEFAULTS } from '@/lib/signal/finder/params';
import { LIVE_DEFAULTS } from '@/lib/live/finder';
import { DISTRACTORS, generateSession } from '@/lib/signal/synthetic';
import { replay, splitRecording } from '@/scripts/lib/live-bridge';
import { findFreePort } from '@/scripts/lib/free-port';
import { startAppServer, type AppServer } from './support/app-server';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { signedIn } from './support/http-session';

// Kill test of a live lesson: the app server dies (SIGKILL to its process group) in the middle of a live session
// while the bridge streams at 10x speed. A new server starts on the same address; the bridge's retries complete the
// stream; nothing the server acknowledged (202) is lost; the new server takes the buffer over once the dead one's
// lease has run out and publishes every swing once; the end makes a recording with the whole stream.
// Like server-kill.test.ts, both servers run on a scratch database of the harness's MariaDB, so the harness's own
// server never sees this live session.

const env = e2eEnv();
/** a swing settles live once its finish hold and the filter's padding lie inside the stream (lib/live/finder.ts) */
const SETTLED_AFTER_S = DETECTION_DEFAULTS.settleHoldS + LIVE_DEFAULTS.padAfterS;
const lesson = generateSession({ seed: 1818, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 4, withMarker: false, distractors: DISTRACTORS });
const csv = lesson.csv();
const offline = analyzeRecording(parseRecording(csv), lesson.layout).result.swings;
const { chunks, lastTimes } = splitRecording(csv);

let admin: Knex;
let db: Knex;
let scratchName = '';
let scratchUrl = '';
const servers: AppServer[] = [];

function appEnv(port: number): NodeJS.ProcessEnv {
  return { ...process.env, DATABASE_URL: scratchUrl, NEXTAUTH_URL: `http://127.0.0.1:${port}`, PORT: String(port), WORKER_ENABLED: 'true', WORKER_POLL_MS: '200' };
}

beforeAll(async () => {
  const base = new URL(env.DATABASE_URL);
  scratchName = `stanceline_l${randomBytes(4).toString('hex')}`;
  admin = knex(knexConfig(base.href));
  await admin.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [scratchName]);
  const url = new URL(base.href);
  url.pathname = `/${scratchName}`;
  scratchUrl = url.href;
  db = knex(knexConfig(scratchUrl));
  await db.migrate.latest();
  await seedDemo(db);
}, 120_000);

afterAll(async () => {
  for (const server of servers) await server.stop().catch(() => undefined);
  await db?.destroy();
  if (scratchName) await admin?.raw('DROP DATABASE IF EXISTS ??', [scratchName]);
  await admin?.destroy();
});

describe('the app server killed during a live lesson', () => {
  it('loses nothing acknowledged; the restarted server completes the stream and publishes every swing once', { timeout: 300_000 }, async () => {
    const port = await findFreePort();
    const first = await startAppServer({ port, env: appEnv(port) });
    servers.push(first);
    const coach = await signedIn(first.url, DEMO.coach, DEMO_PASSWORD);
    const start = await coach.json('/api/live', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ athleteId: 3 }) });
    expect(start.status).toBe(201);
    const { id, token } = start.body as { id: number; token: string };

    const acked = new Set<number>();
    let killed = false;
    let restarted: Promise<AppServer> | null = null;
    const bridge = replay(csv, {
      url: `${first.url}/api/live/${id}`,
      token,
      speed: 10,
      retryForMs: 180_000,
      onAck: (seq) => {
        acked.add(seq);
        if (!killed && acked.size === Math.floor(chunks.length * 0.4)) {
          killed = true;
          restarted = first.killGroup('SIGKILL').then(() => startAppServer({ port, env: appEnv(port) }));
        }
      },
    });
    const result = await bridge;
    expect(killed).toBe(true);
    const second = await restarted!;
    servers.push(second);
    expect(result.refused).toEqual([]);
    expect(result.retries).toBeGreaterThan(0); // the kill was felt
    expect(acked.size).toBe(chunks.length);

    // nothing acknowledged is lost: every chunk is stored, byte for byte
    const stored = await db('live_chunks').where({ live_session_id: id }).orderBy('seq').select('seq', 'body');
    expect(stored.map((c: { seq: number }) => Number(c.seq))).toEqual(chunks.map((_, k) => k));
    const preamble = (await db('live_sessions').where({ id }).first('preamble')).preamble as string;
    expect(preamble + stored.map((c: { body: string }) => c.body).join('')).toBe(csv);

    // the new instance takes the lease over (after it expires) and publishes every settled swing once, in order
    const expected = offline.filter((w) => w.events.finish + SETTLED_AFTER_S <= lastTimes[lastTimes.length - 1]);
    const deadline = Date.now() + 60_000;
    let rows: { number: number; impact_s: number }[] = [];
    while (Date.now() < deadline) {
      rows = await db('live_swings').where({ live_session_id: id }).orderBy('number').select('number', 'impact_s');
      if (rows.length >= expected.length) break;
      await new Promise((r) => setTimeout(r, 500));
    }
    expect(rows.map((r) => Number(r.number))).toEqual(expected.map((_, k) => k + 1));
    rows.forEach((r, k) => expect(Math.abs(Number(r.impact_s) - expected[k].events.impact)).toBeLessThanOrEqual(0.01 + 1e-6));

    const coach2 = await signedIn(second.url, DEMO.coach, DEMO_PASSWORD);
    const end = await coach2.json(`/api/live/${id}/end`, { method: 'POST' });
    expect(end.status, JSON.stringify(end.body)).toBe(200);
    const rec = await db('recordings').where({ id: (end.body as { recordingId: number }).recordingId }).first('byte_size');
    expect(Number(rec.byte_size)).toBe(Buffer.byteLength(csv));
  });
});
