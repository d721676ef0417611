import { spawn } from 'node:child_process';
import { once } from 'node:events';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { claimNextJob } from '@/lib/jobs/queue';
import { drainQueue } from '@/lib/jobs/worker';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { insertRecording, resetDemo, tempDir, testDb } from './support/recordings';

// Kill test: a worker process is killed (SIGKILL, no clean-up) while it processes a long recording. The job must not
// stay stuck: once its heartbeat is older than the lock timeout another worker claims it and the recording ends ready.

let db: Knex;
const storeDir = tempDir('kill-store');
const store = createLocalStore(storeDir);

beforeAll(async () => {
  db = testDb();
  await resetDemo(db);
});
afterAll(async () => {
  await resetDemo(db);
  await db.destroy();
});

async function until<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 30_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('a worker killed mid-job', () => {
  it('leaves a job that another worker finishes after the lock expires', { timeout: 120_000 }, async () => {
    // 10 minutes at 100 Hz with 12 swings (about 6 MB): with the child's slowed reads it takes ~2 s just to read
    const session = generateSession({ seed: 9, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 12, withMarker: false, durationS: 600 });
    const { recordingId } = await insertRecording(db, store, session.csv(), {}, 'long-lesson.csv');

    const child = spawn(process.execPath, ['--import', 'tsx', 'tests/lib/support/worker-child.ts'], {
      env: { ...process.env, DATABASE_URL: process.env.DATABASE_URL || (await import('vitest')).inject('databaseUrl'), STORE_DIR: storeDir, WORKER_ID: 'doomed-worker' },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    const exited = once(child, 'exit');
    try {
      await until('the child to claim the job', async () => {
        const job = await db('processing_jobs').where({ recording_id: recordingId }).first('state', 'locked_by');
        return job?.state === 'running' && job.locked_by === 'doomed-worker';
      });
    } finally {
      child.kill('SIGKILL');
      await exited;
    }

    expect(await db('processing_jobs').where({ recording_id: recordingId }).first()).toMatchObject({ state: 'running', attempts: 1, locked_by: 'doomed-worker' });
    expect((await db('recordings').where({ id: recordingId }).first()).status).toBe('processing');
    expect(await claimNextJob(db, { workerId: 'survivor', lockTimeoutS: 5 })).toBeNull(); // its lock is still fresh

    await until('the lock to expire and the job to be taken over', async () => (await drainQueue({ db, store, workerId: 'survivor', pollMs: 100, lockTimeoutS: 5 })) > 0);
    const job = await db('processing_jobs').where({ recording_id: recordingId }).first();
    expect(job).toMatchObject({ state: 'done', attempts: 2, locked_by: null });
    const recording = await db('recordings').where({ id: recordingId }).first();
    expect(recording.status).toBe('ready');
    expect(Number((await db('swings').where({ recording_id: recordingId }).count({ n: '*' }))[0].n)).toBe(12); // the generator's 12 swings
  });
});
