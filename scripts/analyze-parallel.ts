// Reading a large recording on two threads for the analyze command. The file is cut at a line boundary near its
// middle; this thread reads the first half while a worker thread (its own small bundle, .build/analyze-worker.mjs)
// reads the second half behind a copy of the file's preamble (metadata and header) and of the first half's last
// data row, so the worker's reader checks the field count and the rising time across the cut exactly as one reader
// would. Both read bytes (scripts/analyze-read.ts) straight into arrays shared between the threads
// (SharedArrayBuffer), sized from the line counts: the first half's rows at the start, the worker's from the copied
// row on (that row is written by both threads, with the same bytes), so the halves need no joining copy; only the
// worker's line numbers are shifted to the file's.
//
// The worker plans the cut and makes the shared arrays itself, then tells this thread (a 'plan' message) before it
// reads its half; so it can be started before the command's bundle is loaded (scripts/analyze.mjs does that for a
// large FILE without --profile), and its start-up overlaps the loading. Anything unusual (an error in either half, a
// blank or comment line among the data that makes the counts differ from the rows, a cut that does not fall
// between two data rows, an import profile) returns null and the caller reads the file on one thread, so its output
// and its error messages stay exactly those of the one-thread reader.
import { closeSync, fstatSync, openSync, readSync, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { Worker, workerData, parentPort } from 'node:worker_threads';
import { createRecordingReader } from '@/lib/signal/read/reader';
import type { RawRecording } from '@/lib/signal/types';
import { CHUNK_BYTES, countLines, pushFileBytes } from './analyze-read';

/**
 * Below this size one thread is as fast (a worker costs ~0.1 s to start). scripts/analyze.mjs, which may start the
 * worker early, reads the same variable with the same default.
 */
export const PARALLEL_MIN_BYTES = Number(process.env.STANCELINE_PARALLEL_PARSE_MIN_BYTES ?? 16 * 1024 * 1024);

/** Where scripts/analyze.mjs leaves a worker it started before the bundle loaded (see ReadWorker). */
export const EARLY_WORKER = Symbol.for('stanceline.analyze.readWorker');

/** Bytes searched for the preamble at the start and for the last row before the cut. */
const WINDOW = 1 << 16;

type Column = 'time' | 'impact' | { sensor: number };
type Shared = { time: SharedArrayBuffer | null; impact: SharedArrayBuffer | null; sensors: SharedArrayBuffer[] };

/** How the file is cut; all counts from the file's lines, as if every line after the header were a data row. */
interface Plan {
  cut: number;
  size: number;
  preambleLines: number;
  /** preamble (BOM dropped) + the first half's last line */
  prefix: string;
  /** lines of the first half [0, cut) */
  linesA: number;
  linesB: number;
  rowsA: number;
  /** the worker's rows: the copied row, then the second half's lines */
  rowsB: number;
  total: number;
}

type Message =
  | { kind: 'none' }
  | { kind: 'plan'; path: string; plan: Plan; shared: Shared }
  | { kind: 'done'; ok: true; rows: number; inPlace: boolean; lines: Uint32Array }
  | { kind: 'done'; ok: false };

/** A worker and the messages it sent so far (kept from its start, so none is lost while the bundle loads). */
export interface ReadWorker {
  path: string;
  worker: Worker;
  messages: Message[];
  failed: boolean;
  wake: (() => void) | null;
}

const utf8 = new TextDecoder('utf-8', { ignoreBOM: true });

function readRange(fd: number, start: number, end: number): Buffer {
  const buf = Buffer.allocUnsafe(end - start);
  let at = 0;
  while (at < buf.length) {
    const n = readSync(fd, buf, at, buf.length - at, start + at);
    if (n === 0) break;
    at += n;
  }
  return buf.subarray(0, at);
}

/** The cut, the prefix and the line counts, or null when the file is not one to read in two halves. */
function planHalves(fd: number, buf: Buffer): Plan | null {
  const stat = fstatSync(fd);
  if (!stat.isFile()) return null;
  const size = stat.size;
  if (size < PARALLEL_MIN_BYTES) return null;

  // preamble: blank and '#' lines, then the header row, within the first WINDOW bytes
  const head = readRange(fd, 0, Math.min(size, WINDOW));
  const bodyStart = head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf ? 3 : 0;
  let from = bodyStart;
  let preambleLines = 0;
  for (;;) {
    const end = head.indexOf(10, from);
    if (end < 0) return null;
    const trimmed = utf8.decode(head.subarray(from, end)).trim();
    from = end + 1;
    preambleLines++;
    if (trimmed !== '' && !trimmed.startsWith('#')) break;
  }
  const preambleEnd = from;

  // the cut: just after the first newline at or after the middle (a newline byte never sits inside a UTF-8 character)
  const probe = readRange(fd, size >> 1, Math.min(size, (size >> 1) + WINDOW));
  const nl = probe.indexOf(10);
  if (nl < 0) return null;
  const cut = (size >> 1) + nl + 1;
  if (cut >= size || cut <= preambleEnd) return null;

  // the first half's last line, read again by the worker before its own rows; it must look like a data row
  const tailStart = Math.max(preambleEnd, cut - WINDOW);
  const tail = readRange(fd, tailStart, cut);
  const lineStart = tail.lastIndexOf(10, tail.length - 2) + 1;
  if (lineStart === 0 && tailStart !== preambleEnd) return null; // longer than the window
  const lastRow = utf8.decode(tail.subarray(lineStart, tail.length - 1));
  if (lastRow.trim() === '' || lastRow.trim().startsWith('#')) return null;

  const linesA = countLines(fd, 0, cut, buf);
  const linesB = countLines(fd, cut, size, buf);
  const rowsA = linesA - preambleLines;
  const rowsB = 1 + linesB;
  if (rowsA < 2) return null;
  const prefix = `${utf8.decode(head.subarray(bodyStart, preambleEnd))}${lastRow}\n`;
  return { cut, size, preambleLines, prefix, linesA, linesB, rowsA, rowsB, total: rowsA - 1 + rowsB };
}

function sharedView(shared: Shared, column: Column, offset: number, rows: number): Float64Array | Uint8Array {
  const buffer = column === 'time' ? shared.time : column === 'impact' ? shared.impact : shared.sensors[column.sensor];
  if (!buffer) throw new RangeError('no shared array for this column');
  return column === 'impact' ? new Uint8Array(buffer, offset, rows) : new Float64Array(buffer, offset * 8, rows);
}

/** True when every array of the recording is the shared view that was handed out (all rows went there, no copy). */
function filledInPlace(raw: RawRecording, shared: Shared, offset: number, rows: number): boolean {
  const at = (a: Float64Array | Uint8Array, buffer: SharedArrayBuffer | null, size: number) =>
    a.buffer === buffer && a.byteOffset === offset * size && a.length === rows;
  return (
    raw.time.length === rows &&
    at(raw.time, shared.time, 8) &&
    (raw.impact ? at(raw.impact, shared.impact, 1) : shared.impact === null) &&
    raw.channels.length === shared.sensors.length &&
    raw.channels.every((c, k) => at(c, shared.sensors[k], 8))
  );
}

/** The worker thread's side (workerData: { path }): plan, make the shared arrays, read the second half. */
export function runParseWorker(): void {
  const { path } = workerData as { path: string };
  const post = (m: Message, transfer: ArrayBuffer[] = []) => parentPort!.postMessage(m, transfer);
  let planned = false;
  let fd = -1;
  try {
    fd = openSync(path, 'r');
    const buf = Buffer.allocUnsafeSlow(CHUNK_BYTES);
    const plan = planHalves(fd, buf);
    if (!plan) return post({ kind: 'none' });
    const shared: Shared = { time: null, impact: null, sensors: [] };
    const offset = plan.rowsA - 1;
    const reader = createRecordingReader({
      lines: plan.preambleLines + plan.rowsB,
      arrays: (column, rows) => {
        if (column === 'lines') return new Uint32Array(rows);
        const buffer = new SharedArrayBuffer(column === 'impact' ? plan.total : plan.total * 8);
        if (column === 'time') shared.time = buffer;
        else if (column === 'impact') shared.impact = buffer;
        else shared.sensors[column.sensor] = buffer;
        return sharedView(shared, column, offset, rows);
      },
    });
    reader.push(plan.prefix); // the header: the shared arrays now exist
    if (!shared.time || shared.sensors.length === 0) return post({ kind: 'none' });
    post({ kind: 'plan', path, plan, shared });
    planned = true;
    pushFileBytes(reader, fd, plan.cut, plan.size, buf);
    const raw = reader.end();
    const inPlace = filledInPlace(raw, shared, offset, plan.rowsB);
    post({ kind: 'done', ok: true, rows: raw.time.length, inPlace, lines: raw.lines }, [raw.lines.buffer as ArrayBuffer]);
  } catch {
    post(planned ? { kind: 'done', ok: false } : { kind: 'none' });
  } finally {
    if (fd >= 0) closeSync(fd);
  }
}

/** Starts the worker for `path`, keeping its messages (scripts/analyze.mjs does the same before the bundle loads). */
export function startReadWorker(path: string, workerUrl: URL): ReadWorker {
  const worker = new Worker(workerUrl, { workerData: { path } });
  const rw: ReadWorker = { path, worker, messages: [], failed: false, wake: null };
  worker.on('message', (m: Message) => {
    rw.messages.push(m);
    rw.wake?.();
  });
  const fail = () => {
    rw.failed = true;
    rw.wake?.();
  };
  worker.on('error', fail);
  worker.on('exit', fail);
  return rw;
}

async function nextMessage(rw: ReadWorker): Promise<Message | null> {
  while (rw.messages.length === 0 && !rw.failed) await new Promise<void>((resolve) => (rw.wake = resolve));
  rw.wake = null;
  return rw.messages.shift() ?? null;
}

/** The worker that scripts/analyze.mjs started for this file, taken over (once), or null. */
function takeEarlyWorker(path: string): ReadWorker | null {
  const g = globalThis as { [EARLY_WORKER]?: ReadWorker };
  const rw = g[EARLY_WORKER] ?? null;
  delete g[EARLY_WORKER];
  if (rw && rw.path !== path) {
    void rw.worker.terminate();
    return null;
  }
  return rw;
}

/** Ends an early worker that the command does not use (an import profile, a usage error): nothing waits for it. */
export function dropEarlyWorker(): void {
  const g = globalThis as { [EARLY_WORKER]?: ReadWorker };
  const rw = g[EARLY_WORKER];
  delete g[EARLY_WORKER];
  if (rw) void rw.worker.terminate();
}

/** The file read on two threads, or null when the one-thread reader must do it (see the top of this file). */
export async function readParallel(path: string, bundleUrl: URL): Promise<RawRecording | null> {
  let rw = takeEarlyWorker(path);
  // the source version under tsx: node 20 does not hand tsx's loader to worker threads, so one thread reads
  if (bundleUrl.pathname.endsWith('.ts')) return null;
  if (!rw) {
    if (availableParallelism() < 2 || statSync(path).size < PARALLEL_MIN_BYTES) return null;
    rw = startReadWorker(path, new URL('./analyze-worker.mjs', bundleUrl));
  }
  rw.worker.ref(); // an early worker was unref'd so that an unused one keeps nobody waiting
  let fd = -1;
  try {
    const first = await nextMessage(rw);
    if (!first || first.kind !== 'plan' || first.path !== path) return null;
    const { plan, shared } = first;
    const reader = createRecordingReader({
      lines: plan.linesA,
      arrays: (column, rows) => (column === 'lines' ? new Uint32Array(rows) : sharedView(shared, column, 0, rows)),
    });
    let a: RawRecording;
    try {
      fd = openSync(path, 'r');
      pushFileBytes(reader, fd, 0, plan.cut, Buffer.allocUnsafeSlow(CHUNK_BYTES));
      a = reader.end();
    } catch {
      return null;
    }
    const b = await nextMessage(rw);
    if (!b || b.kind !== 'done' || !b.ok || !b.inPlace || b.rows !== plan.rowsB || !filledInPlace(a, shared, 0, plan.rowsA)) return null;
    // a developer's check that the two-thread path ran (never set by the command itself)
    if (process.env.STANCELINE_PARALLEL_PARSE_TRACE) process.stderr.write(`analyze: read on two threads, cut at byte ${plan.cut}\n`);
    const { rowsA, rowsB, total } = plan;
    const shift = plan.linesA - (plan.preambleLines + 1); // worker line -> file line
    const lines = new Uint32Array(total);
    lines.set(a.lines, 0);
    for (let i = 1; i < rowsB; i++) lines[rowsA - 1 + i] = b.lines[i] + shift;
    return {
      ...a,
      time: new Float64Array(shared.time!, 0, total),
      channels: shared.sensors.map((s) => new Float64Array(s, 0, total)),
      impact: shared.impact ? new Uint8Array(shared.impact, 0, total) : null,
      lines,
    };
  } finally {
    if (fd >= 0) closeSync(fd);
    await rw.worker.terminate();
  }
}
