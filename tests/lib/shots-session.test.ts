import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoRecordings } from '@/db/demo/recordings';
import { DEMO_SHOT_OFFSET_S } from '@/db/demo/shots';
import { binImport, pairShot, restoreImport, sessionImpacts, sessionShotsView, setOffset } from '@/lib/shots/session-shots';
import { createLocalStore } from '@/lib/storage';
import { resetDemo, tempDir, testDb } from './support/recordings';

// The demo's shot log goes through the same import code as an upload, on a real MariaDB. Its truth is its
// construction (db/demo/shots.ts): the log's clock runs DEMO_SHOT_OFFSET_S ahead of the insoles', one swing has no
// shot and one shot has no swing.

let db: Knex;
beforeAll(async () => {
  db = testDb();
  await resetDemo(db);
  await seedDemoRecordings(db, createLocalStore(tempDir('shots-store')));
});
afterAll(async () => {
  await resetDemo(db);
  await db.destroy();
});

describe('session shots (demo session 1)', () => {
  it('finds the constructed offset within 50 ms and pairs every shot that has a swing', async () => {
    const impacts = (await sessionImpacts(db, 1)).filter((i) => i.impactS !== null);
    const view = await sessionShotsView(db, 1, 'metric');
    expect(view.import).not.toBeNull();
    expect(Math.abs(view.import!.offsetS! - DEMO_SHOT_OFFSET_S)).toBeLessThan(0.05);
    expect(view.shots).toHaveLength(impacts.length); // one missed, one extra
    const paired = view.shots.filter((s) => s.swingId !== null);
    expect(paired).toHaveLength(impacts.length - 1);
    // each pair is the swing whose impact + offset is the shot's time (to the demo's 10 ms jitter)
    for (const s of paired) {
      const imp = impacts.find((i) => i.swingId === s.swingId)!;
      expect(Math.abs(s.deviceTimeS - imp.impactS! - DEMO_SHOT_OFFSET_S)).toBeLessThan(0.05);
    }
    expect(await db('shot_profiles').count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('lets the coach unpair, pair by hand, shift the offset and find it again; manual choices survive re-pairing', async () => {
    const before = await sessionShotsView(db, 1, 'metric');
    const [first, second] = before.shots.filter((s) => s.swingId !== null);
    await pairShot(db, first.id, null);
    await pairShot(db, second.id, first.swingId);
    let view = await sessionShotsView(db, 1, 'metric');
    expect(view.shots.find((s) => s.id === first.id)).toMatchObject({ swingId: null, pairing: 'unpaired' });
    expect(view.shots.find((s) => s.id === second.id)).toMatchObject({ swingId: first.swingId, pairing: 'manual' });

    // a shifted offset far from the truth pairs no automatic shot; the manual pair stays
    const shifted = await setOffset(db, 1, { offsetS: DEMO_SHOT_OFFSET_S + 600 });
    expect(shifted!.matched).toBe(1);
    const again = await setOffset(db, 1, { refind: true });
    expect(Math.abs(again!.offsetS! - DEMO_SHOT_OFFSET_S)).toBeLessThan(0.05);
    view = await sessionShotsView(db, 1, 'metric');
    expect(view.shots.find((s) => s.id === first.id)!.pairing).toBe('unpaired');
    expect(view.shots.find((s) => s.id === second.id)!.swingId).toBe(first.swingId);
    await expect(pairShot(db, first.id, 999999)).rejects.toThrow(/not a counted swing/);
  });

  it('sends the import to the bin and brings it back', async () => {
    expect(await binImport(db, 1)).toBe(true);
    expect((await sessionShotsView(db, 1, 'metric')).import).toBeNull();
    expect(await restoreImport(db, 1)).toBe(true);
    expect((await sessionShotsView(db, 1, 'metric')).shots.length).toBeGreaterThan(0);
  });
});
