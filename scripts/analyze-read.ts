// Reading a recording file for the analyze command as bytes: the file goes once through one reused buffer, whole
// lines handed to the reader's byte scanner (RecordingReader.pushBytes), its arrays sized from the file's size (the
// `bytes` hint). No text of the whole file is ever made, and the only memory that grows with the file is the arrays
// of the result. (countLines serves the two-thread reader, which needs exact row offsets.) Anything unusual (not a regular file, a line longer than the buffer, any
// error of the reader) returns null: the command then reads the file as text with the stream reader, so its
// messages stay exactly those of that reader.
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
// the reader module itself, not lib/signal's index: the two-thread reader's worker bundle takes only this
import { createRecordingReader, type RecordingReader } from '@/lib/signal/read/reader';
import type { ImportProfile, RawRecording } from '@/lib/signal/types';

/** Bytes read at once; a line longer than this is not a recording's (the reader refuses lines over 64 Ki). */
export const CHUNK_BYTES = 1 << 20;

/** Lines in bytes [start, end) of the file: its newlines, plus one when the last byte is not one. */
export function countLines(fd: number, start: number, end: number, buf: Buffer): number {
  let count = 0;
  let last = 10;
  for (let pos = start; pos < end; ) {
    const n = readSync(fd, buf, 0, Math.min(buf.length, end - pos), pos);
    if (n === 0) break;
    for (let i = buf.indexOf(10); i >= 0 && i < n; i = buf.indexOf(10, i + 1)) count++;
    last = buf[n - 1];
    pos += n;
  }
  return count + (last === 10 ? 0 : 1);
}

/** Bytes [start, end) of the file to reader.pushBytes, each piece ending just after a newline (the last: at `end`). */
export function pushFileBytes(reader: RecordingReader, fd: number, start: number, end: number, buf: Buffer): void {
  let carry = 0; // bytes of a partial line kept at the start of buf
  let pos = start;
  while (pos < end) {
    const n = readSync(fd, buf, carry, Math.min(buf.length - carry, end - pos), pos);
    if (n === 0) break;
    pos += n;
    const filled = carry + n;
    if (pos >= end) {
      carry = filled;
      break;
    }
    const nl = buf.lastIndexOf(10, filled - 1);
    if (nl < 0) throw new RangeError(`a line longer than ${buf.length} bytes`);
    reader.pushBytes(buf.subarray(0, nl + 1));
    carry = filled - nl - 1;
    buf.copyWithin(0, nl + 1, filled);
  }
  if (carry > 0) reader.pushBytes(buf.subarray(0, carry));
}

/** The whole file read as bytes on this thread, or null when the stream reader must do it (see the top). */
export function readFileBytes(path: string, profile: ImportProfile | undefined): RawRecording | null {
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch {
    return null;
  }
  try {
    const stat = fstatSync(fd);
    if (!stat.isFile()) return null;
    const buf = Buffer.allocUnsafeSlow(Math.max(1, Math.min(CHUNK_BYTES, stat.size)));
    // sized from the file's size, not counted: no pass over the file before the reading one
    const reader = createRecordingReader({ profile, bytes: stat.size });
    pushFileBytes(reader, fd, 0, stat.size, buf);
    return reader.end();
  } catch {
    return null;
  } finally {
    closeSync(fd);
  }
}
