import { readFileSync } from 'node:fs';
import type { Knex } from 'knex';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { buildBundle } from '../../scripts/build-bundles.mjs';
import { createTaskPool, defaultThreads, type TaskRunner } from '@/lib/jobs/pool';
import { drainQueue } from '@/lib/jobs/worker';
import { closeDb } from '@/lib/db/client';
import { promoteCandidate } from '@/lib/recordings/promote';
import { getRecordingView } from '@/lib/recordings/views';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { databaseUrl, insertRecording, resetDemo, tempDir, testDb } from './support/recordings';

// The job pool's worker threads (lib/jobs/pool.ts, the esbuild bundle .build/job-thread.mjs) must store
// exactly what the same job stored when it ran on the main thread: every row of every result table, every byte of
// the JSON series, the failure message with its line and column. Compared on the real integration MariaDB.

let db: Knex;
let pool: TaskRunner;
const store = createLocalStore(tempDir('threads-store'));

beforeAll(async () => {
  db = testDb();
  await buildBundle('job-thread'); // fresh, so the threads run the code under test
  pool = createTaskPool({ threads: 1 });
}, 120_000);
beforeEach(async () => {
  await resetDemo(db);
});
afterAll(async () => {
  await pool?.close();
  await resetDemo(db);
  await db.destroy();
  await closeDb(); // promoteCandidate and getRecordingView use the app's client
});

const PER_ROW = new Set(['id', 'recording_id', 'swing_id', 'storage_key', 'created_at', 'updated_at', 'processed_at', 'filename', 'sha256', 'built_at']);
const strip = (row: Record<string, unknown>) => Object.fromEntries(Object.entries(row).filter(([k]) => !PER_ROW.has(k)));

/** Everything processing stored for one recording, without ids and timestamps. */
async function stored(recordingId: number) {
  const recording = strip(await db('recordings').where({ id: recordingId }).first());
  const job = await db('processing_jobs').where({ recording_id: recordingId }).first('state', 'attempts', 'last_error');
  const series = await db('recording_series').where({ recording_id: recordingId }).select();
  const swings = await db('swings').where({ recording_id: recordingId }).orderBy('swing_index');
  const perSwing = [];
  for (const s of swings) {
    const of = (table: string, order: string[]) => db(table).where({ swing_id: s.id }).orderBy(order).select();
    perSwing.push({
      swing: strip(s),
      events: (await of('swing_events', ['name'])).map(strip),
      values: (await of('swing_event_values', ['event'])).map(strip),
      phases: (await of('swing_phase_metrics', ['phase'])).map(strip),
      series: (await of('swing_series', ['swing_id'])).map(strip),
      payload: (await of('swing_payloads', ['swing_id'])).map(strip), // the viewer's stored part
    });
  }
  return { recording, job, series: series.map(strip), swings: perSwing };
}

async function both(content: string | Buffer, options = {}) {
  const onMain = await insertRecording(db, store, content, options, 'main.csv');
  expect(await drainQueue({ db, store, workerId: 'main', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
  // a session holds a file once (unique sha256); mark the first copy so the same bytes can be uploaded again
  await db('recordings').where({ id: onMain.recordingId }).update({ sha256: '0'.repeat(64) });
  const inThread = await insertRecording(db, store, content, options, 'thread.csv');
  expect(await drainQueue({ db, store, workerId: 'thread', pollMs: 50, lockTimeoutS: 30, runner: pool, databaseUrl: databaseUrl() })).toBe(1);
  return { main: await stored(onMain.recordingId), thread: await stored(inThread.recordingId) };
}

describe('analysis in worker threads', () => {
  it('defaults to the cores minus one, at least 1', () => {
    expect(defaultThreads(2)).toBe(1);
    expect(defaultThreads(1)).toBe(1);
    expect(defaultThreads(8)).toBe(7);
  });

  it('refuses an unknown task by name, in the thread as well', async () => {
    await expect(pool.runTask('no-such-task' as 'process-job', {} as never)).rejects.toThrow(/unknown task "no-such-task"/);
  });

  it('a generated golf session: the same stored rows as on the main thread', async () => {
    const golf = generateSession({ seed: 11, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 4, withMarker: false, distractors: ['walk', 'waggle'] });
    const { main, thread } = await both(golf.csv());
    expect(main.recording.status).toBe('ready');
    expect(main.swings).toHaveLength(4);
    expect(thread).toEqual(main);
  });

  it('a left-handed session with an impact marker and another cutoff: the same stored rows', async () => {
    const golf = generateSession({ seed: 5, sampleRateHz: 200, sensorsPerFoot: 8, units: 'N', handedness: 'left', stanceWidthMm: 450, swings: 2, withMarker: true });
    const { main, thread } = await both(golf.csv(), { handedness: 'left', stanceWidthMm: 450, cutoffHz: 15 });
    expect(main.recording.status).toBe('ready');
    expect(thread).toEqual(main);
  });

  it('open walking data (PhysioNet gaitpdb, tests/fixtures/gaitpdb): the same stored rows', async () => {
    const layout = JSON.parse(readFileSync('tests/fixtures/layouts/gaitpdb.json', 'utf8'));
    const profile = JSON.parse(readFileSync('tests/fixtures/profiles/gaitpdb.json', 'utf8'));
    const { main, thread } = await both(readFileSync('tests/fixtures/gaitpdb/GaCo01_01.txt'), { layout: { custom: layout }, profile });
    expect(main.recording.status).toBe('ready');
    expect(thread).toEqual(main);
  });

  it('a coach’s promoted candidate (read by the thread from the database): the same stored rows', async () => {
    // walking before each swing gives rejected candidates (tests/lib/candidate-promotion.test.ts)
    const golf = generateSession({ seed: 17, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 2, withMarker: false, distractors: ['walk'] }).csv();
    const run = async (name: string, runner?: TaskRunner) => {
      const { recordingId } = await insertRecording(db, store, golf, {}, `${name}.csv`);
      expect(await drainQueue({ db, store, workerId: name, pollMs: 50, lockTimeoutS: 30, runner, databaseUrl: databaseUrl() })).toBe(1);
      const candidate = (await getRecordingView(recordingId))!.candidates[0];
      await promoteCandidate(recordingId, 2, { timeS: candidate.timeS });
      expect(await drainQueue({ db, store, workerId: name, pollMs: 50, lockTimeoutS: 30, runner, databaseUrl: databaseUrl() })).toBe(1);
      await db('recordings').where({ id: recordingId }).update({ sha256: name === 'main' ? '0'.repeat(64) : '1'.repeat(64) });
      return stored(recordingId);
    };
    const main = await run('main');
    const thread = await run('thread', pool);
    expect(main.swings.filter((s) => s.swing.promoted !== null)).toHaveLength(1);
    expect(thread).toEqual(main);
  });

  it('a malformed file fails with the same message, line and column', async () => {
    const lines = generateSession({ seed: 3, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 1, withMarker: false }).csv().split('\n');
    const cells = lines[40].split(',');
    cells[5] = 'x7';
    lines[40] = cells.join(',');
    const { main, thread } = await both(lines.join('\n'));
    expect(main.recording.status).toBe('failed');
    expect(main.recording.error_message).toMatch(/line 41, column 6/);
    expect(thread).toEqual(main);
  });

  it('bytes that are not UTF-8 fail the same way', async () => {
    const bytes = Buffer.concat([Buffer.from('time_s,a\n0,1\n'), Buffer.from([0xff, 0xfe, 0x41])]);
    const { main, thread } = await both(bytes);
    expect(main.recording.status).toBe('failed');
    expect(thread).toEqual(main);
  });
});
