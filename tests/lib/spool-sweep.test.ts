import { mkdirSync, mkdtempSync, readdirSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { STALE_SPOOL_MS, sweepStaleSpools } from '@/lib/storage/spool';

describe('sweepStaleSpools', () => {
  it('removes .part files untouched for the stale age, keeps fresh ones and other files', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'stanceline-spool-')), '.incoming');
    mkdirSync(dir);
    const old = (Date.now() - STALE_SPOOL_MS - 60_000) / 1000;
    for (const name of ['crashed-1.part', 'crashed-2.part', 'old-note.txt']) {
      writeFileSync(join(dir, name), 'x');
      utimesSync(join(dir, name), old, old);
    }
    writeFileSync(join(dir, 'arriving.part'), 'x'); // another instance is still writing it
    expect(await sweepStaleSpools(dir)).toBe(2);
    expect(readdirSync(dir).sort()).toEqual(['arriving.part', 'old-note.txt']);
    expect(await sweepStaleSpools(join(dir, 'missing'))).toBe(0);
  });
});
