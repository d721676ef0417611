import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { drainQueue } from '@/lib/jobs/worker';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { localCopyName } from '@/lib/storage/spool';
import { insertRecording, resetDemo, tempDir, testDb } from './support/recordings';

// The kept local copy of a just-uploaded file (lib/recordings/upload.ts keeps it when an object store took the
// upload): the first processing reads it instead of the store, only when its size is the stored size, and removes it.
// To tell which bytes were read, the copy differs from the stored file in one cell of the same width ("x7"), which
// the reader refuses with its line and column.

let db: Knex;
const store = createLocalStore(tempDir('copy-store'));
const copies = tempDir('copy-spool');
const golf = generateSession({ seed: 9, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 1, withMarker: true }).csv();

/** The same file with one data cell replaced by "x7" of the same width: same size, different bytes. */
function spoiled(): string {
  const lines = golf.split('\n');
  const row = lines.findIndex((l) => /^\d/.test(l)) + 20;
  const cells = lines[row].split(',');
  cells[3] = 'x7'.padEnd(cells[3].length, '0');
  lines[row] = cells.join(',');
  return lines.join('\n');
}

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

describe('the kept local copy of an upload', () => {
  it('is read instead of the store when its size matches, and removed afterwards', async () => {
    const { recordingId } = await insertRecording(db, store, golf, {}, 'copy.csv');
    const copy = join(copies, localCopyName(recordingId));
    const bad = spoiled();
    expect(bad.length).toBe(golf.length);
    writeFileSync(copy, bad);
    expect(await drainQueue({ db, store, workerId: 'copy', pollMs: 50, lockTimeoutS: 30, localCopyDir: copies })).toBe(1);
    const row = await db('recordings').where({ id: recordingId }).first('status', 'error_message');
    expect(row.status).toBe('failed'); // the copy's bytes were analysed, not the store's
    expect(row.error_message).toMatch(/^line \d+, column \d+/);
    expect(existsSync(copy)).toBe(false);
  });

  it('is ignored when its size differs from the stored file', async () => {
    const { recordingId } = await insertRecording(db, store, golf, {}, 'copy.csv');
    writeFileSync(join(copies, localCopyName(recordingId)), `${spoiled()}\n`);
    expect(await drainQueue({ db, store, workerId: 'copy', pollMs: 50, lockTimeoutS: 30, localCopyDir: copies })).toBe(1);
    expect((await db('recordings').where({ id: recordingId }).first('status')).status).toBe('ready');
  });
});
