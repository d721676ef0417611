import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_RECORDINGS, seedDemoRecordings } from '@/db/demo/recordings';
import { createLocalStore } from '@/lib/storage';
import { resetDemo, tempDir, testDb } from './support/recordings';

// The demo's recordings go through the real pipeline (store, queue, processing) and end ready with the swings the
// synthetic generator put in them (its truth; lib/signal/synthetic), so the demo coach sees sessions with swings.

let db: Knex;
beforeAll(async () => {
  db = testDb();
  await resetDemo(db);
});
afterAll(async () => {
  await resetDemo(db);
  await db.destroy();
});

describe('demo recordings', () => {
  it('are stored, processed and ready with the generated swings, the same on every run', async () => {
    const store = createLocalStore(tempDir('demo-store'));
    expect(await seedDemoRecordings(db, store)).toBe(DEMO_RECORDINGS.length);
    const first = await db('swings').orderBy(['recording_id', 'swing_index']).select('recording_id', 'swing_index', 'start_s', 'end_s');
    for (const demo of DEMO_RECORDINGS) {
      expect(first.filter((s) => s.recording_id === demo.id)).toHaveLength(demo.swings);
      expect(await store.exists(`demo/recording-${demo.id}.csv`)).toBe(true);
    }
    await resetDemo(db);
    await seedDemoRecordings(db, store);
    expect(await db('swings').orderBy(['recording_id', 'swing_index']).select('recording_id', 'swing_index', 'start_s', 'end_s')).toEqual(first);
  });
});
