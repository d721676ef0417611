// Reading a large recording on two threads for the analyze command. The file is cut at line boundaries into blocks
// of about 2 MB; a worker thread (its own small bundle, .build/analyze-worker.mjs) and this thread take turns at them
// (an atomic counter), so neither waits long for the other whatever the load. Every block but the first is read
// behind a copy of the file's preamble (metadata and header) and of the previous block's last line, so its reader
// checks the field count and the rising time across the cut exactly as one reader would. All read bytes
// (scripts/analyze-read.ts) straight into arrays shared between the threads (SharedArrayBuffer), sized from the line
// counts: each block's rows where the counts put them, its copied first row on the previous block's last (written by
// both, with the same bytes), so the blocks need no joining copy; line numbers are shifted to the file's.
//
// This thread plans the blocks, makes the shared arrays and starts reading at once; the worker joins when it is up
// (its start-up takes a good 0.1 s, which is why scripts/analyze.mjs starts it before the command's bundle loads,
// for a large FILE without --profile). Anything unusual (an error in any block, a blank or
// comment line among the data that makes the counts differ from the rows, a cut that does not fall between two data
// rows, an import profile) returns null and the caller reads the file on one thread, so its output and its error
// messages stay exactly those of the one-thread reader.
import { closeSync, fstatSync, openSync, readFileSync, readSync, statSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { Worker, workerData, parentPort } from 'node:worker_threads';
import { createRecordingReader } from '@/lib/signal/read/reader';
import type { RawRecording } from '@/lib/signal/types';
import { CHUNK_BYTES, countLines, pushFileBytes } from './analyze-read';

/**
 * Files from this size on are read on two threads; off unless STANCELINE_PARALLEL_PARSE_MIN_BYTES is set (tests set
 * 0). Measured on the 2-core development machine (DEVELOPERS.md "Figures"), the second thread cost 0.2-0.3 s of CPU
 * (its start-up, the JIT warming up in a second isolate, two threads faulting memory in at once) and saved no wall
 * time on the 38 MB file, so the command reads on one thread. scripts/analyze.mjs reads the same variable.
 */
export const PARALLEL_MIN_BYTES = Number(process.env.STANCELINE_PARALLEL_PARSE_MIN_BYTES ?? Infinity);

/**
 * A second thread pays only while a core is idle: on a busy machine it adds CPU time (its start-up, the planning, the
 * cost of two threads faulting memory in at once) and saves no wall time (npm run bench:signal prints both). Idle
 * here = no other task runnable right now (the 4th field of /proc/loadavg, running tasks, ourselves included),
 * else the 1-minute load average below cores - 1 (a rule of thumb, common practice). The size threshold set to 0
 * (tests) skips the check. scripts/analyze.mjs makes the same check before it starts the worker.
 */
export function coreIsFree(): boolean {
  if (process.env.STANCELINE_PARALLEL_PARSE_MIN_BYTES === '0') return true;
  const cores = availableParallelism();
  if (cores < 2) return false;
  try {
    const running = Number(readFileSync('/proc/loadavg', 'latin1').split(' ')[3].split('/')[0]);
    if (Number.isInteger(running) && running > 0) return running - 1 < cores - 1;
  } catch {
    // not Linux: the load average below
  }
  return loadavg()[0] < cores - 1;
}

/** Where scripts/analyze.mjs leaves a worker it started before the bundle loaded (see ReadWorker). */
export const EARLY_WORKER = Symbol.for('stanceline.analyze.readWorker');

/** Bytes searched for the preamble at the start and for the last row before the cut. */
const WINDOW = 1 << 16;

type Column = 'time' | 'impact' | { sensor: number };

/**
 * How the file is cut: into blocks of about BLOCK_BYTES at line boundaries, with every count taken from the file's
 * lines as if every line after the header were a data row. Block 0 starts at the file's start (the preamble
 * included); every later block is read behind `prefix` (the preamble and the previous block's last line), its first
 * row, that copied line, landing on the previous block's last row.
 */
interface Plan {
  size: number;
  preambleLines: number;
  blocks: Block[];
  /** rows of the whole file */
  total: number;
}

interface Block {
  start: number;
  end: number;
  /** the block's own lines */
  lines: number;
  /** preamble + the previous block's last line (null for block 0) */
  prefix: string | null;
  /** where the block's reader puts its first row, and how many rows it has (the copied one included) */
  offset: number;
  rows: number;
  /** block reader's line number -> the file's */
  lineShift: number;
}

/** Blocks the two threads take turns at (an atomic counter), so neither waits long for the other; tests set less. */
const BLOCK_BYTES = Number(process.env.STANCELINE_PARALLEL_PARSE_BLOCK_BYTES ?? 2 << 20);
const MAX_BLOCKS = 64;

type Shared = {
  time: SharedArrayBuffer | null;
  impact: SharedArrayBuffer | null;
  sensors: SharedArrayBuffer[];
  /** Uint32Array(total): the file's line numbers */
  lines: SharedArrayBuffer;
  /** Int32Array(1 + blocks): [0] the next block to take, then per block 0 = not read, 1 = read exactly, 2 = not */
  state: SharedArrayBuffer;
};

/** main -> worker: 'plan'; worker -> main: 'done' when it found no block left to take */
type Message = { kind: 'plan'; path: string; plan: Plan; shared: Shared } | { kind: 'done' };

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

/** The blocks, or null when the file is not one to read on two threads. */
function planBlocks(fd: number, buf: Buffer): Plan | null {
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
  const preamble = utf8.decode(head.subarray(bodyStart, preambleEnd));

  // cuts: just after the first newline at or after each multiple of the block size (a newline byte never sits
  // inside a UTF-8 character)
  const count = Math.min(MAX_BLOCKS, Math.max(2, Math.round(size / BLOCK_BYTES)));
  const cuts = [0];
  for (let k = 1; k < count; k++) {
    const at = Math.max(preambleEnd, Math.floor((size * k) / count), cuts[cuts.length - 1]);
    const probe = readRange(fd, at, Math.min(size, at + WINDOW));
    const nl = probe.indexOf(10);
    if (nl < 0) return null;
    const cut = at + nl + 1;
    if (cut >= size) break;
    if (cut > cuts[cuts.length - 1]) cuts.push(cut);
  }
  cuts.push(size);
  if (cuts.length < 3) return null;

  const blocks: Block[] = [];
  let linesBefore = 0;
  let rowsBefore = 0;
  for (let k = 0; k + 1 < cuts.length; k++) {
    const [start, end] = [cuts[k], cuts[k + 1]];
    const lines = countLines(fd, start, end, buf);
    let prefix: string | null = null;
    if (k > 0) {
      // the previous block's last line; it must look like a data row
      const tailStart = Math.max(preambleEnd, start - WINDOW);
      const tail = readRange(fd, tailStart, start);
      const lineStart = tail.lastIndexOf(10, tail.length - 2) + 1;
      if (lineStart === 0 && tailStart !== preambleEnd) return null; // longer than the window
      const last = utf8.decode(tail.subarray(lineStart, tail.length - 1));
      if (last.trim() === '' || last.trim().startsWith('#')) return null;
      prefix = `${preamble}${last}\n`;
    }
    const own = k === 0 ? lines - preambleLines : lines; // the block's own rows
    if (own < (k === 0 ? 2 : 1)) return null;
    blocks.push({
      start,
      end,
      lines,
      prefix,
      offset: k === 0 ? 0 : rowsBefore - 1,
      rows: k === 0 ? own : own + 1,
      lineShift: k === 0 ? 0 : linesBefore - (preambleLines + 1),
    });
    linesBefore += lines;
    rowsBefore += own;
  }
  return { size, preambleLines, blocks, total: rowsBefore };
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

/**
 * Reads block k into the shared arrays: true when every row went exactly where the plan put it. Block 0 returns its
 * recording (metadata, header) for the caller to assemble the result.
 */
function readBlock(fd: number, buf: Buffer, plan: Plan, shared: Shared, k: number): RawRecording | null {
  const block = plan.blocks[k];
  const reader = createRecordingReader({
    lines: k === 0 ? block.lines : plan.preambleLines + block.rows,
    arrays: (column, rows) => (column === 'lines' ? new Uint32Array(rows) : sharedView(shared, column, block.offset, rows)),
  });
  if (block.prefix) reader.push(block.prefix);
  pushFileBytes(reader, fd, block.start, block.end, buf);
  const raw = reader.end();
  if (!filledInPlace(raw, shared, block.offset, block.rows)) return null;
  const lines = new Uint32Array(shared.lines);
  for (let i = k === 0 ? 0 : 1; i < block.rows; i++) lines[block.offset + i] = raw.lines[i] + block.lineShift;
  return raw;
}

/** Takes blocks (from 1: block 0 is the main thread's) until none is left; each marked read (1) or not (2). */
function readBlocks(fd: number, buf: Buffer, plan: Plan, shared: Shared): void {
  const state = new Int32Array(shared.state);
  for (;;) {
    const k = Atomics.add(state, 0, 1) + 1;
    if (k >= plan.blocks.length) return;
    let ok = false;
    try {
      ok = readBlock(fd, buf, plan, shared, k) !== null;
    } catch {
      ok = false;
    }
    Atomics.store(state, 1 + k, ok ? 1 : 2);
  }
}

/** The blocks and the shared arrays for them (the header, read once here, says which arrays there are), or null. */
function prepare(fd: number, buf: Buffer): { plan: Plan; shared: Shared } | null {
  const plan = planBlocks(fd, buf);
  if (!plan) return null;
  const shared: Shared = {
    time: null,
    impact: null,
    sensors: [],
    lines: new SharedArrayBuffer(plan.total * 4),
    state: new SharedArrayBuffer(4 * (1 + plan.blocks.length)),
  };
  const header = createRecordingReader({
    lines: plan.preambleLines + 1,
    arrays: (column, rows) => {
      if (column === 'lines') return new Uint32Array(rows);
      const buffer = new SharedArrayBuffer(column === 'impact' ? plan.total : plan.total * 8);
      if (column === 'time') shared.time = buffer;
      else if (column === 'impact') shared.impact = buffer;
      else shared.sensors[column.sensor] = buffer;
      return column === 'impact' ? new Uint8Array(rows) : new Float64Array(rows);
    },
  });
  header.push(plan.blocks[1].prefix!);
  return shared.time && shared.sensors.length > 0 ? { plan, shared } : null;
}

/** The worker thread's side: waits for the main thread's plan, then takes blocks until none is left. */
export function runParseWorker(): void {
  parentPort!.once('message', (m: Message) => {
    if (m.kind !== 'plan') return;
    let fd = -1;
    try {
      fd = openSync(m.path, 'r');
      readBlocks(fd, Buffer.allocUnsafeSlow(CHUNK_BYTES), m.plan, m.shared);
    } catch {
      // a block taken and not read stays 0: the main thread sees it
    } finally {
      if (fd >= 0) closeSync(fd);
    }
    parentPort!.postMessage({ kind: 'done' } satisfies Message);
  });
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
    if (statSync(path).size < PARALLEL_MIN_BYTES || !coreIsFree()) return null;
    rw = startReadWorker(path, new URL('./analyze-worker.mjs', bundleUrl));
  }
  let fd = -1;
  try {
    fd = openSync(path, 'r');
    const buf = Buffer.allocUnsafeSlow(CHUNK_BYTES);
    const prepared = prepare(fd, buf);
    if (!prepared) return null;
    const { plan, shared } = prepared;
    // the worker joins whenever it is up; this thread starts at once with block 0
    rw.worker.postMessage({ kind: 'plan', path, plan, shared } satisfies Message);
    let a: RawRecording | null;
    try {
      a = readBlock(fd, buf, plan, shared, 0);
      if (a) readBlocks(fd, buf, plan, shared);
    } catch {
      return null;
    }
    if (!a) return null;
    const state = new Int32Array(shared.state);
    const read = () => plan.blocks.every((_, k) => k === 0 || Atomics.load(state, 1 + k) === 1);
    if (!read()) {
      // a block the worker took and has not finished: wait for it (an early worker was unref'd)
      rw.worker.ref();
      while (!read() && (await nextMessage(rw)) !== null);
      if (!read()) return null;
    }
    // a developer's check that the two-thread path ran (never set by the command itself)
    if (process.env.STANCELINE_PARALLEL_PARSE_TRACE) {
      const cuts = plan.blocks.slice(1).map((b) => b.start);
      process.stderr.write(`analyze: read on two threads, ${plan.blocks.length} blocks cut at bytes ${cuts.join(', ')}\n`);
    }
    const { total } = plan;
    return {
      ...a,
      time: new Float64Array(shared.time!, 0, total),
      channels: shared.sensors.map((s) => new Float64Array(s, 0, total)),
      impact: shared.impact ? new Uint8Array(shared.impact, 0, total) : null,
      lines: new Uint32Array(shared.lines, 0, total),
    };
  } finally {
    if (fd >= 0) closeSync(fd);
    await rw.worker.terminate();
  }
}
