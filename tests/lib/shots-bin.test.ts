import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sweepBin } from '@/lib/sessions/bin';
import { createLocalStore } from '@/lib/storage';
import { resetDemo, tempDir, testDb } from './support/recordings';

// The bin's sweep takes shot logs along: one binned over 30 days ago goes (row and raw file), one binned a moment
// ago stays restorable. BIN_DAYS = 30 (lib/contracts/sessions.ts).

let db: Knex;
beforeAll(async () => {
  db = testDb();
  await resetDemo(db);
});
afterAll(async () => {
  await resetDemo(db);
  await db.destroy();
});

async function storedImport(store: ReturnType<typeof createLocalStore>, dir: string, name: string, binnedDaysAgo: number): Promise<{ id: number; key: string }> {
  const path = join(dir, name);
  writeFileSync(path, 'shot_time\n1\n');
  const key = `shots/1/${name}`;
  await store.putFile(key, path, 12);
  const [id] = await db('shot_imports').insert({
    session_id: 1,
    uploaded_by: 2,
    filename: name,
    byte_size: 12,
    sha256: '0'.repeat(64),
    storage_key: key,
    profile: JSON.stringify({ columns: { time: 'shot_time' }, units: {} }),
    status: 'ready',
    tolerance_s: 1.5,
    binned_at: db.raw(`NOW(3) - INTERVAL ${binnedDaysAgo} DAY`),
  });
  return { id: Number(id), key };
}

describe('sweepBin and shot logs', () => {
  it('removes a shot log binned more than 30 days ago with its raw file and keeps a recent one', async () => {
    const dir = tempDir('shots-bin');
    const store = createLocalStore(tempDir('shots-bin-store'));
    const old = await storedImport(store, dir, 'old.csv', 31);
    const recent = await storedImport(store, dir, 'recent.csv', 1);
    const swept = await sweepBin(db, store);
    expect(swept.files).toBeGreaterThanOrEqual(1);
    expect(await db('shot_imports').where({ id: old.id }).first('id')).toBeUndefined();
    expect(await store.exists(old.key)).toBe(false);
    expect(await db('shot_imports').where({ id: recent.id }).first('id')).toBeDefined();
    expect(await store.exists(recent.key)).toBe(true);
  });
});
