// Writes an incoming upload stream to a spool file while counting bytes and hashing (SHA-256), so the hash is
// known before the file is stored and nothing is held in memory. The caller moves the file into the store.
import { createHash, randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, readdir, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

export interface SpooledFile {
  path: string;
  byteSize: number;
  sha256: string;
  /** the first bytes, to tell a text file from a binary one without reading it again */
  head: Buffer;
}

const HEAD_BYTES = 8192;

export async function spoolUpload(source: Readable, spoolDir: string): Promise<SpooledFile> {
  await mkdir(spoolDir, { recursive: true });
  const path = join(spoolDir, `${randomUUID()}.part`);
  const hash = createHash('sha256');
  let byteSize = 0;
  const headParts: Buffer[] = [];
  let headLength = 0;
  const meter = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      hash.update(chunk);
      byteSize += chunk.length;
      if (headLength < HEAD_BYTES) {
        const part = chunk.subarray(0, HEAD_BYTES - headLength);
        headParts.push(Buffer.from(part));
        headLength += part.length;
      }
      done(null, chunk);
    },
  });
  try {
    await pipeline(source, meter, createWriteStream(path));
  } catch (error) {
    await rm(path, { force: true });
    throw error;
  }
  return { path, byteSize, sha256: hash.digest('hex'), head: Buffer.concat(headParts) };
}

/** A spool file not written to for this long belongs to a request that ended without cleaning up (a crash). */
export const STALE_SPOOL_MS = 10 * 60 * 1000;

/** Where uploads are spooled while they arrive, under the storage folder (removed on every exit path of a request). */
export function spoolDirOf(storageDir: string): string {
  return join(storageDir, '.incoming');
}

/**
 * The name of the kept copy of a just-uploaded recording's raw file in the spool folder: the bytes the object store
 * also holds, kept on this machine so the first processing reads them from disk instead of downloading them again
 * (lib/jobs/process-recording.ts removes it after that processing; the sweep below, after STALE_SPOOL_MS).
 */
export function localCopyName(recordingId: number): string {
  return `recording-${recordingId}.copy`;
}

/**
 * Removes `*.part` spool files and `*.copy` kept copies in `spoolDir` untouched for `olderThanMs` (run at server
 * start and then every so often). The age keeps uploads that another app instance sharing the folder is still writing. Returns how many.
 */
export async function sweepStaleSpools(spoolDir: string, olderThanMs = STALE_SPOOL_MS, now = Date.now()): Promise<number> {
  let names: string[];
  try {
    names = await readdir(spoolDir);
  } catch {
    return 0; // no spool folder yet
  }
  let removed = 0;
  for (const name of names) {
    if (!name.endsWith('.part') && !name.endsWith('.copy')) continue;
    const path = join(spoolDir, name);
    try {
      if (now - (await stat(path)).mtimeMs < olderThanMs) continue;
      await rm(path, { force: true });
      removed++;
    } catch {
      // gone meanwhile
    }
  }
  return removed;
}
