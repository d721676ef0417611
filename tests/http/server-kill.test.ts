import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { knexConfig } from '@/knexfile';
import { analyzeOptionsOf, profileOf, recordingOptionsSchema, resolveLayout } from '@/lib/recordings/options';
import { readStoredRecording } from '@/lib/recordings/stored-text';
import { analyzeRecording, roundAnalysis } from '@/lib/signal';
import { DISTRACTORS, generateSession } from '@/lib/signal/synthetic';
import { createS3Store } from '@/lib/storage/s3';
import type { RawFileStore } from '@/lib/storage/types';
import { startS3Fake } from '@/scripts/lib/fakes/s3';
import { findFreePort } from '@/scripts/lib/free-port';
import { processGroupMembers, startAppServer, type AppServer } from './support/app-server';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { signedIn, type HttpSession } from './support/http-session';
import { upload } from './support/recordings-http';

// Kill test: the app server process dies (SIGKILL to its whole process group: no clean-up, no graceful
// shutdown) while its in-app worker processes a long recording. The job must be neither lost nor stuck: once its
// heartbeat is older than JOB_LOCK_TIMEOUT_S, the worker of the restarted server claims it again and the recording
// ends ready, with the same swings a direct analysis of the file gives.
//
// Why a scratch database and not the harness's own: scripts/test.ts starts its server without WORKER_ENABLED, so
// that server runs a worker (the default is true) that polls the `stanceline` database every second, and the other
// HTTP tests rely on it. On that database its worker would claim our job before, or instead of, ours, and the kill
// would hit a server that was not processing. So this test starts BOTH servers (the one it kills and the one that
// restarts) itself, on a fresh database of the same MariaDB (stanceline_k<random>, migrated and seeded with the demo;
// the app user may create stanceline_* databases), with the same built app, the same secret and the same raw-file
// store (keys are random UUIDs, so nothing collides). The harness's server is left untouched and never sees the job.
//
// Storage is S3 here, always: the test starts its own S3 fake (s3rver) in a folder of its own, so it can check on the
// fake's disk that the raw file was complete in the bucket before the job row was written, and still there after
// the crash.

const env = e2eEnv();
const LOCK_TIMEOUT_S = 5; // the smallest lib/env.ts accepts; the restarted worker takes the job over after it

// 60 minutes at 100 Hz, 8 sensors a foot, 60 swings with walking, stepping, waggles, re-teeing and a lifted foot
// between them (about 36 MB): processing takes seconds, long enough to be killed in the middle of it.
const lesson = generateSession({
  seed: 404,
  sampleRateHz: 100,
  sensorsPerFoot: 8,
  units: 'N',
  handedness: 'right',
  stanceWidthMm: 400,
  swings: 60,
  withMarker: false,
  distractors: DISTRACTORS,
  durationS: 3600,
});
const lessonCsv = lesson.csv();

let admin: Knex;
let db: Knex;
let scratchName = '';
let scratchUrl = '';
const servers: AppServer[] = [];
let storageKey: string | null = null;
let s3: Awaited<ReturnType<typeof startS3Fake>> | null = null;
let s3Dir = '';
let store: RawFileStore;

/** The s3rver file holding an object's bytes (it keeps <bucket>/<key>._S3rver_object on disk). */
function objectFile(key: string): string | null {
  const walk = (dir: string): string | null => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) {
        const found = walk(path);
        if (found) return found;
      } else if (path.endsWith(`${key.split('/').pop()}._S3rver_object`)) return path;
    }
    return null;
  };
  return walk(s3Dir);
}

function appEnv(port: number): NodeJS.ProcessEnv {
  return {
    ...process.env, // NEXTAUTH_SECRET of the harness
    ...s3!.env, // this test's own S3 fake
    DATABASE_URL: scratchUrl,
    NEXTAUTH_URL: `http://127.0.0.1:${port}`,
    PORT: String(port),
    WORKER_ENABLED: 'true',
    WORKER_POLL_MS: '200',
    JOB_LOCK_TIMEOUT_S: String(LOCK_TIMEOUT_S),
  };
}

async function startServer(port: number): Promise<AppServer> {
  const server = await startAppServer({ port, env: appEnv(port) });
  servers.push(server);
  return server;
}

async function until<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs: number, server?: AppServer): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (server?.hasExited()) throw new Error(`the server exited while waiting for ${what}:\n${server.output()}`);
    if (Date.now() > end) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}${server ? `\nserver output:\n${server.output()}` : ''}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

async function recordingStatus(session: HttpSession, id: number): Promise<{ status: string; body: any }> {
  const { status, body } = await session.json(`/api/recordings/${id}`);
  expect(status).toBe(200);
  return { status: (body as { status: string }).status, body };
}

beforeAll(async () => {
  s3Dir = mkdtempSync(join(tmpdir(), 'stanceline-kill-s3-'));
  s3 = await startS3Fake(s3Dir);
  store = createS3Store({
    bucket: s3.env.STORAGE_S3_BUCKET,
    endpoint: s3.env.STORAGE_S3_ENDPOINT,
    region: s3.env.STORAGE_S3_REGION,
    accessKeyId: s3.env.STORAGE_S3_ACCESS_KEY_ID,
    secretAccessKey: s3.env.STORAGE_S3_SECRET_ACCESS_KEY,
  });
  const base = new URL(env.DATABASE_URL);
  scratchName = `stanceline_k${randomBytes(4).toString('hex')}`;
  admin = knex(knexConfig(base.href));
  await admin.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [scratchName]);
  const url = new URL(base.href);
  url.pathname = `/${scratchName}`;
  scratchUrl = url.href;
  db = knex(knexConfig(scratchUrl));
  await db.migrate.latest();
  await seedDemo(db);
});

afterAll(async () => {
  // Everything this file started, also when a test failed half-way: servers, the raw file, the scratch database.
  for (const server of servers) await server.stop().catch((error: unknown) => console.error('stopping a test server:', error));
  if (storageKey) await store?.remove(storageKey).catch(() => undefined);
  await s3?.stop().catch(() => undefined);
  if (s3Dir) rmSync(s3Dir, { recursive: true, force: true });
  await db?.destroy();
  if (scratchName) await admin?.raw('DROP DATABASE IF EXISTS ??', [scratchName]);
  await admin?.destroy();
});

describe('the app server killed while it processes a recording', () => {
  it('leaves a job that the restarted server finishes: ready, with the swings of a direct analysis', { timeout: 300_000 }, async () => {
    const port = await findFreePort();
    const first = await startServer(port);
    const coach = await signedIn(first.url, DEMO.coach, DEMO_PASSWORD);

    // Demo athlete 3 (coach@'s roster) and that athlete's session 6, db/demo/scenario.ts.
    const res = await upload(coach, { athleteId: 3, sessionId: 6, handedness: 'right', stanceWidthMm: 400 }, [{ name: 'long-lesson.csv', content: lessonCsv }]);
    expect(res.status).toBe(202);
    expect(res.body.recordings[0]).toMatchObject({ filename: 'long-lesson.csv', status: 'received', duplicate: false });
    const id: number = res.body.recordings[0].id;
    storageKey = (await db('recordings').where({ id }).first('storage_key')).storage_key;

    // The raw file is in the bucket, whole, and was complete there before the job was queued: the fake's object file
    // was last written before the job row's created_at (both clocks are this machine's; MariaDB keeps milliseconds).
    const key = storageKey!;
    expect(await store.exists(key)).toBe(true);
    const file = objectFile(key);
    expect(file, `no object file for ${key} under ${s3Dir}`).not.toBeNull();
    const queuedAt = new Date((await db('processing_jobs').where({ recording_id: id }).first('created_at')).created_at).getTime();
    expect(statSync(file!).mtimeMs).toBeLessThanOrEqual(queuedAt);
    const sha = async () => {
      const hash = createHash('sha256');
      for await (const chunk of await store.read(key)) hash.update(chunk as Buffer);
      return hash.digest('hex');
    };
    const expectedSha = createHash('sha256').update(lessonCsv).digest('hex');
    expect(await sha()).toBe(expectedSha);

    // The API must say `processing` (the worker claimed the job) before the kill.
    await until('GET /api/recordings/:id to say processing', async () => {
      const { status } = await recordingStatus(coach, id);
      if (status === 'ready' || status === 'failed') throw new Error(`recording ${id} was ${status} before the kill; the file is too short to kill the server mid-job`);
      return status === 'processing';
    }, 60_000, first);

    // Crash: SIGKILL to the whole group, then nothing of it may be left (no orphaned next-server child).
    await first.killGroup('SIGKILL');
    expect(first.hasExited()).toBe(true);
    expect(processGroupMembers(first.pid)).toEqual([]);

    // Not lost: the recording still waits for processing, its job is still the dead worker's running attempt 1,
    // and no result row was written (the results transaction, if it had begun, was rolled back by the server).
    const killedJob = await db('processing_jobs').where({ recording_id: id }).first('state', 'attempts', 'locked_by', 'finished_at');
    expect(killedJob).toMatchObject({ state: 'running', attempts: 1, finished_at: null });
    expect(String(killedJob.locked_by)).toContain(`:${first.pid}:`); // worker ids are host:pid:random (lib/jobs/worker.ts)
    const killedRecording = await db('recordings').where({ id }).first('status');
    expect(['processing', 'received']).toContain(killedRecording.status);
    expect(await db('swings').where({ recording_id: id }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await sha()).toBe(expectedSha); // the raw file survived the crash, unchanged

    // Restart on the same address; the session cookie (a JWT signed with the same secret) still works.
    const second = await startServer(port);
    const during = await recordingStatus(coach, id);
    expect(['received', 'processing', 'ready']).toContain(during.status); // never failed, never unknown

    // Never stuck: the new worker claims the job once the dead one's heartbeat is LOCK_TIMEOUT_S old.
    const done = await until('the recording to reach ready or failed after the restart', async () => {
      const { status, body } = await recordingStatus(coach, id);
      return status === 'ready' || status === 'failed' ? body : null;
    }, 180_000, second);
    expect(done.error).toBeNull();
    expect(done.status).toBe('ready');

    const job = await db('processing_jobs').where({ recording_id: id }).first('state', 'attempts', 'locked_by', 'last_error');
    expect(job).toMatchObject({ state: 'done', attempts: 2, locked_by: null, last_error: null }); // the killed attempt + the one that finished

    // The same file through the signal core directly, with the options the upload stored (the worker's own path:
    // lib/jobs/process-recording.ts), rounded as the API rounds event times (3 decimals, lib/recordings/views.ts).
    const row = await db('recordings').where({ id }).first('options');
    const options = recordingOptionsSchema.parse(typeof row.options === 'string' ? JSON.parse(row.options) : row.options);
    const raw = await readStoredRecording(Readable.from([Buffer.from(lessonCsv)]), profileOf(options));
    const direct = roundAnalysis(analyzeRecording(raw, resolveLayout(options, raw.metadata), analyzeOptionsOf(options)).result);
    expect(direct.swings).toHaveLength(lesson.truth.swings.length); // the generator's 60 swings, all found
    expect(done.swings.map((s: any) => ({ index: s.index, events: s.events, impactSource: s.impactSource }))).toEqual(
      direct.swings.map((s) => ({ index: s.index, events: s.events, impactSource: s.impact_source })),
    );
    expect(await db('swings').where({ recording_id: id }).count({ n: '*' })).toEqual([{ n: direct.swings.length }]);
  });
});
