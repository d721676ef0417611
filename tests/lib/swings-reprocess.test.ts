import type { Knex } from 'knex';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_RECORDINGS, seedDemoRecordings } from '@/db/demo/recordings';
import { DEMO_SWING_LABELS, DEMO_SWING_NOTES } from '@/db/demo/swing-notes';
import { drainQueue } from '@/lib/jobs/worker';
import { analyzeRecording, atEvent, parseRecording } from '@/lib/signal';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { applyEventChanges } from '@/lib/swings/corrections';
import { applyLabels } from '@/lib/swings/labels';
import { nearestSample } from '@/lib/swings/stored-series';
import { insertRecording, resetDemo, tempDir, testDb } from './support/recordings';

// What a reprocess does to the coach's work on swings (lib/jobs/write-results.ts): corrections, labels, notes,
// "not a swing" and the audit follow the swing that still covers them; a swing with such work that the new run no
// longer finds is kept as stale with its window. Re-valued numbers are checked against the signal core run directly.

let db: Knex;
const store = createLocalStore(tempDir('swing-work-store'));
const worker = () => ({ db, store, workerId: 'swing-work', pollMs: 50, lockTimeoutS: 30 });
const golf = generateSession({ seed: 7, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 3, withMarker: false });

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

async function reprocess(recordingId: number, cutoffHz: number | null) {
  await db('recordings').where({ id: recordingId }).update({ options: JSON.stringify({ layout: null, profile: null, handedness: 'right', stanceWidthMm: 400, cutoffHz }) });
  await db('processing_jobs').insert({ recording_id: recordingId, state: 'queued' });
  await drainQueue(worker());
  expect((await db('recordings').where({ id: recordingId }).first('status')).status).toBe('ready');
}
const swingsOf = (recordingId: number) => db('swings').where({ recording_id: recordingId }).orderBy('swing_index');
const eventOf = (swingId: number, name: string) => db('swing_events').where({ swing_id: swingId, name }).first();
const valueOf = (swingId: number, event: string) => db('swing_event_values').where({ swing_id: swingId, event }).first('lead_pct', 'lead_heel_pct', 'trail_heel_pct', 'cop_x_mm', 'cop_y_mm');

describe('reprocessing a recording with the coach’s work on its swings', () => {
  it('stores a full-rate window for every swing', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    await drainQueue(worker());
    const swings = await swingsOf(recordingId);
    expect(swings).toHaveLength(3);
    for (const s of swings) {
      const row = await db('swing_series').where({ swing_id: s.id }).first();
      expect(row.samples).toBe(Math.round((s.end_s - s.start_s) * 100) + 1);
      const data = JSON.parse(row.data);
      expect(data.sensorIds).toHaveLength(16);
      expect(data.sensorForces[0]).toHaveLength(row.samples);
    }
  });

  it('carries a moved event (re-valued on the new window), labels, notes, hidden and the audit to the same swing', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    await drainQueue(worker());
    const [first, second] = await swingsOf(recordingId);
    const top = await eventOf(first.id, 'top');
    await db.transaction((trx) => applyEventChanges(trx, first.id, 2, { moves: { top: top.time_s + 0.05 }, resets: [] }));
    await db.transaction((trx) => applyLabels(trx, first.id, 2, { club: 'wedge', tags: ['half swing'], rating: 5 }));
    await db.transaction((trx) => applyLabels(trx, second.id, 2, { notASwing: true }));
    const [noteId] = await db('swing_annotations').insert({ swing_id: first.id, author_user_id: 2, body: 'kept over a reprocess', visibility: 'shared' });
    const movedValues = await valueOf(first.id, 'top');

    // the same options again: the same window, so exactly the same re-valued numbers
    await reprocess(recordingId, null);
    let [again, secondAgain] = await swingsOf(recordingId);
    expect(again.id).not.toBe(first.id);
    const carried = await eventOf(again.id, 'top');
    expect(carried).toMatchObject({ source: 'manual', auto_time_s: top.time_s, misfit: false });
    expect(carried.time_s).toBeCloseTo(top.time_s + 0.05, 9); // snapped to the sample 50 ms later (100 Hz)
    expect(await valueOf(again.id, 'top')).toEqual(movedValues);
    expect(await db('swing_labels').where({ swing_id: again.id }).first('club', 'rating')).toEqual({ club: 'wedge', rating: 5 });
    expect(await db('swing_annotations').where({ swing_id: again.id }).pluck('id')).toEqual([Number(noteId)]);
    expect(await db('swing_event_corrections').where({ swing_id: again.id }).select('event', 'kind', 'user_id')).toEqual([{ event: 'top', kind: 'move', user_id: 2 }]);
    expect(Boolean(secondAgain.hidden)).toBe(true);

    // another cutoff: the manual top is re-valued on the new series, at its nearest sample (signal core run directly)
    await reprocess(recordingId, 8);
    [again, secondAgain] = await swingsOf(recordingId);
    const direct = analyzeRecording(parseRecording(golf.csv()), golf.layout, { handedness: 'right', stanceWidthMm: 400, cutoffHz: 8 });
    const at = atEvent(direct.series, nearestSample(direct.series.time, top.time_s + 0.05));
    const v = await valueOf(again.id, 'top');
    expect(v.lead_pct).toBe(at.lead_pct);
    expect(v.cop_x_mm).toBe(at.cop_x_mm);
    expect(Boolean(secondAgain.hidden)).toBe(true);
  });

  it('keeps a noted swing the new run no longer finds as stale, with its note and window', async () => {
    const { recordingId } = await insertRecording(db, store, golf.csv());
    await drainQueue(worker());
    const [first] = await swingsOf(recordingId);
    await db('swing_annotations').insert({ swing_id: first.id, author_user_id: 2, body: 'about a swing that will vanish', visibility: 'coach' });
    // pretend the swing was somewhere no swing is found (before the first sample)
    await db('swing_events').where({ swing_id: first.id, name: 'impact' }).update({ time_s: -10 });
    await reprocess(recordingId, null);
    const swings = await swingsOf(recordingId);
    expect(swings.filter((s) => !s.stale)).toHaveLength(3);
    const stale = swings.filter((s) => s.stale);
    expect(stale).toHaveLength(1);
    expect(await db('swing_annotations').where({ swing_id: stale[0].id }).pluck('body')).toEqual(['about a swing that will vanish']);
    expect(await db('swing_series').where({ swing_id: stale[0].id }).first('samples')).toBeTruthy();
    expect(await db('swing_event_values').where({ swing_id: stale[0].id })).toHaveLength(5);
  });
});

describe('demo swing notes', () => {
  it('puts labels and notes (shared and coach-only), and no corrections, on Ada Fenwick’s demo swings', async () => {
    const demoStore = createLocalStore(tempDir('demo-notes-store'));
    expect(await seedDemoRecordings(db, demoStore)).toBe(DEMO_RECORDINGS.length);
    const athleteOf = (swingId: number) => db('swings as s').join('recordings as r', 'r.id', 's.recording_id').where('s.id', swingId).first('r.athlete_id');
    const labels = await db('swing_labels').select('swing_id', 'club');
    expect(labels).toHaveLength(DEMO_SWING_LABELS.length);
    const notes = await db('swing_annotations').select('swing_id', 'visibility', 'time_s', 'phase');
    expect(notes).toHaveLength(DEMO_SWING_NOTES.length);
    expect(notes.filter((n) => n.visibility === 'shared')).toHaveLength(2);
    for (const row of [...labels, ...notes]) expect((await athleteOf(row.swing_id)).athlete_id).toBe(1);
    expect(await db('swing_event_corrections')).toHaveLength(0);
    const pinned = notes.find((n) => n.time_s !== null)!;
    expect(pinned.time_s).toBe((await eventOf(pinned.swing_id, 'top')).time_s);
  });
});
