import { readFileSync } from 'node:fs';
import type { Knex } from 'knex';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { claimNextJob, heartbeat } from '@/lib/jobs/queue';
import { drainQueue, runOneJob } from '@/lib/jobs/worker';
import { analyzeRecording, builtinLayout, parseLayout, parseProfile, parseRecording, roundAnalysis } from '@/lib/signal';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { insertRecording, resetDemo, resultCounts, tempDir, testDb } from './support/recordings';

// The processing pipeline on the real integration MariaDB with a local raw-file store. Expected results are the
// signal core's own output for the same file and parameters (analyzeRecording + roundAnalysis, what `npm run
// analyze` prints), so storage, streaming and the database must not change a single number.

let db: Knex;
const store = createLocalStore(tempDir('jobs-store'));
const worker = (workerId = 'test-worker') => ({ db, store, workerId, pollMs: 50, lockTimeoutS: 30 });

const golf = generateSession({ seed: 7, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 3, withMarker: false });
const gaitLayout = JSON.parse(readFileSync('tests/fixtures/layouts/gaitpdb.json', 'utf8'));
const gaitProfile = JSON.parse(readFileSync('tests/fixtures/profiles/gaitpdb.json', 'utf8'));

beforeAll(() => {
  db = testDb();
});
beforeEach(async () => {
  await resetDemo(db);
});
afterAll(async () => {
  await resetDemo(db);
  await db.destroy();
});

/** JSON columns come back parsed or as text, depending on how the server labels them. */
const json = (value: unknown) => (typeof value === 'string' ? JSON.parse(value) : value) as Record<string, unknown>;

async function recording(id: number) {
  return db('recordings').where({ id }).first();
}

describe('processing a stored recording', () => {
  it('a generated golf file ends ready with exactly the swings and events of the signal core', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    expect(await drainQueue(worker())).toBe(1);

    const expected = roundAnalysis(analyzeRecording(parseRecording(golf.csv()), builtinLayout('pair-8')!, { handedness: 'right', stanceWidthMm: 400 }).result) as {
      swings: { index: number; events: Record<string, number>; impact_source: string; phases: { name: string; duration_s: number }[] }[];
      processing: Record<string, unknown>;
    };
    expect(expected.swings.length).toBe(3); // the generator's three swings (lib/signal/synthetic truth)
    const row = await recording(recordingId);
    expect(row.status).toBe('ready');
    expect(row.error_message).toBeNull();
    expect(row.algorithm_version).toBe(expected.processing.algorithm_version);
    const { algorithm_version: _v, ...params } = expected.processing;
    expect(json(row.parameters)).toEqual({ ...params, sample_rate_hz: json(row.parameters).sample_rate_hz });

    const swings = await db('swings').where({ recording_id: recordingId }).orderBy('swing_index');
    expect(swings.map((s) => s.swing_index)).toEqual(expected.swings.map((s) => s.index));
    for (const [k, s] of swings.entries()) {
      const events = await db('swing_events').where({ swing_id: s.id });
      const got = Object.fromEntries(events.map((e) => [e.name, Math.round(e.time_s * 1000) / 1000]));
      expect(got).toEqual(expected.swings[k].events);
      expect(events.every((e) => e.source === 'auto' && e.auto_time_s === e.time_s && !e.misfit)).toBe(true);
      expect(s.impact_source).toBe(expected.swings[k].impact_source);
      const phases = await db('swing_phase_metrics').where({ swing_id: s.id });
      expect(Object.fromEntries(phases.map((p) => [p.phase, Math.round(p.duration_s * 1000) / 1000]))).toEqual(
        Object.fromEntries(expected.swings[k].phases.map((p) => [p.name, p.duration_s])),
      );
    }
    expect(await resultCounts(db, recordingId)).toEqual({ swings: 3, events: 15, values: 15, phases: 12, series: 1 });

    const series = await db('recording_series').where({ recording_id: recordingId }).first();
    const data = JSON.parse(series.data);
    expect(series.method).toBe('minmax');
    expect(data.t).toHaveLength(series.buckets);
    expect(series.buckets).toBeLessThanOrEqual(2000);
    expect(data.traces.lead_pct.min).toHaveLength(series.buckets);
    const job = await db('processing_jobs').where({ recording_id: recordingId }).first();
    expect(job).toMatchObject({ state: 'done', attempts: 1, locked_by: null, last_error: null });
  });

  it('the shared walking file with its profile and layout ends ready with 0 swings', async () => {
    const walking = readFileSync('tests/fixtures/gaitpdb/JuCo01_01.txt');
    const { recordingId } = await insertRecording(db, store, walking, { profile: parseProfile(gaitProfile), layout: { custom: parseLayout(gaitLayout) } });
    await drainQueue(worker());
    const row = await recording(recordingId);
    expect(row.status).toBe('ready');
    expect(await resultCounts(db, recordingId)).toEqual({ swings: 0, events: 0, values: 0, phases: 0, series: 1 });
  });

  it('a bad file fails with its line and column, keeps its raw file and no results', async () => {
    const lines = golf.csv().split('\n');
    const headerAt = lines.findIndex((l) => l.startsWith('time_s'));
    lines[headerAt + 5] = lines[headerAt + 5].replace(/,([^,]*)$/, ',abc'); // non-numeric last cell
    const { recordingId, key } = await insertRecording(db, store, lines.join('\n'));
    await drainQueue(worker());
    const row = await recording(recordingId);
    expect(row.status).toBe('failed');
    expect(row.error_message).toMatch(/"abc" is not a number/);
    expect(row.error_line).toBe(headerAt + 6); // 1-based file line
    expect(row.error_column).toBe(lines[headerAt + 5].split(',').length);
    expect(await store.exists(key)).toBe(true);
    expect(await resultCounts(db, recordingId)).toEqual({ swings: 0, events: 0, values: 0, phases: 0, series: 0 });
    expect(await db('processing_jobs').where({ recording_id: recordingId }).first()).toMatchObject({ state: 'failed', attempts: 1 });
  });

  it('an image renamed .csv fails as "not text" at line 1', async () => {
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
    const { recordingId } = await insertRecording(db, store, png, {}, 'photo.csv');
    await drainQueue(worker());
    const row = await recording(recordingId);
    expect(row).toMatchObject({ status: 'failed', error_line: 1, error_column: 1 });
    expect(row.error_message).toMatch(/not text/);
  });

  it('a reprocess that fails leaves no swing, event or metric rows', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    await drainQueue(worker());
    expect((await resultCounts(db, recordingId)).swings).toBe(3);
    const badLayout = { ...parseLayout(gaitLayout), id: 'other' }; // its L1..L8/R1..R8 fit; use a 1-sensor layout instead
    badLayout.sensors = badLayout.sensors.filter((s: { id: string }) => s.id === 'L1' || s.id === 'R1');
    await db('recordings').where({ id: recordingId }).update({ options: JSON.stringify({ layout: { custom: badLayout }, profile: null, handedness: 'right', stanceWidthMm: 400, cutoffHz: null }) });
    await db('processing_jobs').insert({ recording_id: recordingId, state: 'queued' });
    await drainQueue(worker());
    const row = await recording(recordingId);
    expect(row.status).toBe('failed');
    expect(row.error_message).toMatch(/not a sensor of layout "other"/);
    expect(await resultCounts(db, recordingId)).toEqual({ swings: 0, events: 0, values: 0, phases: 0, series: 0 });
  });

  it('reprocessing keeps a manual correction on the swing that still covers it, flagged when it no longer fits', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    await drainQueue(worker());
    const first = await db('swings').where({ recording_id: recordingId, swing_index: 1 }).first();
    const top = await db('swing_events').where({ swing_id: first.id, name: 'top' }).first();
    const impact = await db('swing_events').where({ swing_id: first.id, name: 'impact' }).first();
    await db('swing_events').where({ id: top.id }).update({ source: 'manual', time_s: top.time_s + 0.02, auto_time_s: top.time_s });
    // a manual impact before the top breaks the event order: it must come back flagged
    await db('swing_events').where({ id: impact.id }).update({ source: 'manual', time_s: top.time_s - 0.05, auto_time_s: impact.time_s });

    await db('recordings').where({ id: recordingId }).update({ options: JSON.stringify({ layout: null, profile: null, handedness: 'right', stanceWidthMm: 400, cutoffHz: 8 }) });
    await db('processing_jobs').insert({ recording_id: recordingId, state: 'queued' });
    await drainQueue(worker());
    expect((await recording(recordingId)).status).toBe('ready');
    expect(json((await recording(recordingId)).parameters).cutoff_hz).toBe(8);
    const swings = await db('swings').where({ recording_id: recordingId }).orderBy('swing_index');
    const manual = await db('swing_events').whereIn('swing_id', swings.map((s) => s.id)).andWhere({ source: 'manual' });
    expect(manual.map((e) => e.name).sort()).toEqual(['impact', 'top']);
    expect(manual.find((e) => e.name === 'top')).toMatchObject({ time_s: top.time_s + 0.02, misfit: false });
    expect(manual.find((e) => e.name === 'impact')).toMatchObject({ time_s: top.time_s - 0.05, misfit: true });
  });
});

describe('the queue', () => {
  it('SKIP LOCKED: a job another worker holds is skipped, not waited for', async () => {
    await insertRecording(db, store, golf.csv());
    const trx = await db.transaction();
    try {
      const [rows] = await trx.raw("SELECT id FROM processing_jobs WHERE state = 'queued' FOR UPDATE");
      expect(rows).toHaveLength(1);
      expect(await claimNextJob(db, { workerId: 'other', lockTimeoutS: 30 })).toBeNull();
    } finally {
      await trx.rollback();
    }
    expect(await claimNextJob(db, { workerId: 'other', lockTimeoutS: 30 })).not.toBeNull();
  });

  it('two workers claiming at once get different jobs', async () => {
    await insertRecording(db, store, golf.csv(), {}, 'a.csv');
    await insertRecording(db, store, golf.csv() + '\n', {}, 'b.csv');
    const [a, b] = await Promise.all([claimNextJob(db, { workerId: 'w1', lockTimeoutS: 30 }), claimNextJob(db, { workerId: 'w2', lockTimeoutS: 30 })]);
    expect(a && b).toBeTruthy();
    expect(a!.id).not.toBe(b!.id);
    expect(await heartbeat(db, a!.id, 'w1')).toBe(true);
    expect(await heartbeat(db, a!.id, 'w2')).toBe(false);
  });

  it('a job left running by a dead worker is claimed again after its lock expires', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    const claimed = await claimNextJob(db, { workerId: 'dead', lockTimeoutS: 30 });
    expect((await recording(recordingId)).status).toBe('processing');
    expect(await claimNextJob(db, { workerId: 'alive', lockTimeoutS: 30 })).toBeNull(); // lock still fresh
    await db('processing_jobs').where({ id: claimed!.id }).update({ heartbeat_at: db.raw('NOW(3) - INTERVAL 31 SECOND') });
    const ran = await runOneJob(worker('alive'));
    expect(ran?.job.attempts).toBe(2);
    expect((await recording(recordingId)).status).toBe('ready');
    expect(await db('processing_jobs').where({ id: claimed!.id }).first()).toMatchObject({ state: 'done', attempts: 2 });
  });

  it('a job that died with its worker on every attempt is failed with the reason, never stuck', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    const claimed = await claimNextJob(db, { workerId: 'dead', lockTimeoutS: 30 });
    await db('processing_jobs').where({ id: claimed!.id }).update({ attempts: 3, heartbeat_at: db.raw('NOW(3) - INTERVAL 31 SECOND') });
    expect(await claimNextJob(db, { workerId: 'alive', lockTimeoutS: 30 })).toBeNull();
    const row = await recording(recordingId);
    expect(row.status).toBe('failed');
    expect(row.error_message).toMatch(/processing stopped 3 time\(s\) without finishing/);
    expect(await db('processing_jobs').where({ id: claimed!.id }).first()).toMatchObject({ state: 'failed' });
  });

  it('a result written by a worker that lost its lock is discarded', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    const claimed = await claimNextJob(db, { workerId: 'slow', lockTimeoutS: 30 });
    await db('processing_jobs').where({ id: claimed!.id }).update({ locked_by: 'someone-else' });
    const { processClaimedJob } = await import('@/lib/jobs/process-recording');
    expect(await processClaimedJob(db, store, claimed!, 'slow')).toEqual({ kind: 'lost' });
    expect((await resultCounts(db, recordingId)).swings).toBe(0);
  });

  it('a storage failure is retried later, then failed with its reason after the last attempt', async () => {
    const { recordingId, key } = await insertRecording(db, store, golf.csv());
    await store.remove(key);
    const first = await runOneJob(worker());
    expect(first?.verdict).toBe('retry');
    const job = await db('processing_jobs').where({ recording_id: recordingId }).first();
    expect(job).toMatchObject({ state: 'queued', attempts: 1 });
    expect(job.last_error).toMatch(/no stored file/);
    expect(await runOneJob(worker())).toBeNull(); // backed off: not due yet
    await db('processing_jobs').where({ id: job.id }).update({ run_after: db.raw('NOW(3)') });
    await runOneJob(worker());
    await db('processing_jobs').where({ id: job.id }).update({ run_after: db.raw('NOW(3)') });
    expect((await runOneJob(worker()))?.verdict).toBe('failed');
    const row = await recording(recordingId);
    expect(row.status).toBe('failed');
    expect(row.error_message).toMatch(/could not process after 3 attempt\(s\): no stored file/);
  });
});
