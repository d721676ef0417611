import { mkdirSync, mkdtempSync, readdirSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { STALE_SPOOL_MS, sweepStaleSpools } from '@/lib/storage/spool';

describe('sweepStaleSpools', () => {
  it('removes .part files and kept .copy files untouched for the stale age, keeps fresh ones and other files', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'stanceline-spool-')), '.incoming');
    mkdirSync(dir);
    const old = (Date.now() - STALE_SPOOL_MS - 60_000) / 1000;
    for (const name of ['crashed-1.part', 'crashed-2.part', 'recording-7.copy', 'old-note.txt']) {
      writeFileSync(join(dir, name), 'x');
      utimesSync(join(dir, name), old, old);
    }
    writeFileSync(join(dir, 'arriving.part'), 'x'); // another instance is still writing it
    writeFileSync(join(dir, 'recording-8.copy'), 'x'); // kept for a job still in the queue
    expect(await sweepStaleSpools(dir)).toBe(3);
    expect(readdirSync(dir).sort()).toEqual(['arriving.part', 'old-note.txt', 'recording-8.copy']);
    expect(await sweepStaleSpools(join(dir, 'missing'))).toBe(0);
  });
});
