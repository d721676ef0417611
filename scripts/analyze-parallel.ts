// Reading a large recording on two threads for the analyze command: the file is cut at a line boundary near its
// middle; this thread reads the first half while a worker thread reads the second half behind a copy of the file's
// preamble (metadata and header) and of the first half's last data row, so the worker's reader checks the field
// count and the rising time across the cut exactly as one reader would. The halves are then joined (the copied row
// dropped, the worker's line numbers shifted to the file's). Anything unusual (an error in either half, a cut
// that does not fall between two data rows, an import profile) returns null and the caller reads the file the usual
// way, on one thread, so its output and its error messages stay exactly those of the one-thread reader.
import { closeSync, openSync, readSync, statSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { Worker, workerData, parentPort } from 'node:worker_threads';
import { createRecordingReader, type RawRecording } from '@/lib/signal';

/** Below this size one thread is as fast (a worker costs ~0.1-0.2 s to start and load the command). */
export const PARALLEL_MIN_BYTES = Number(process.env.STANCELINE_PARALLEL_PARSE_MIN_BYTES ?? 16 * 1024 * 1024);

/**
 * A second thread only pays when a core is idle: on a busy machine it adds CPU (~0.4 s for the 60-minute file) and
 * saves no wall time (npm run bench:signal prints both). Idle here = the 1-minute load average below the cores
 * minus one (a rule of thumb, common practice); the size threshold set to 0 (tests) skips this check.
 */
function coreIsFree(): boolean {
  if (process.env.STANCELINE_PARALLEL_PARSE_MIN_BYTES === '0') return true;
  const cores = availableParallelism();
  return cores >= 2 && loadavg()[0] < cores - 1;
}

type Half = { path: string; start: number; end: number; prefix: string };
type HalfResult = { ok: true; raw: RawRecording } | { ok: false };

function readRange(path: string, start: number, end: number): Buffer {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.allocUnsafe(end - start);
    let at = 0;
    while (at < buf.length) {
      const n = readSync(fd, buf, at, buf.length - at, start + at);
      if (n === 0) break;
      at += n;
    }
    return buf.subarray(0, at);
  } finally {
    closeSync(fd);
  }
}

function readHalf(text: string, prefix = ''): RawRecording {
  const reader = createRecordingReader();
  if (prefix) reader.push(prefix);
  for (let at = 0; at < text.length; at += 1 << 20) reader.push(text.slice(at, at + (1 << 20)));
  return reader.end();
}

/** The worker thread's side: read the second half behind its prefix; any problem is just "not ok". */
export function runParseWorker(): void {
  const half = workerData as Half;
  let result: HalfResult;
  try {
    result = { ok: true, raw: readHalf(readRange(half.path, half.start, half.end).toString('utf8'), half.prefix) };
  } catch {
    result = { ok: false };
  }
  const transfer = result.ok ? [result.raw.time.buffer, result.raw.lines.buffer, ...result.raw.channels.map((c) => c.buffer), ...(result.raw.impact ? [result.raw.impact.buffer] : [])] : [];
  parentPort!.postMessage(result, transfer as ArrayBuffer[]);
}

function concat<T extends Float64Array | Uint32Array | Uint8Array>(a: T, b: T, skip: number, map?: (v: number) => number): T {
  const out = new (a.constructor as { new (n: number): T })(a.length + b.length - skip);
  out.set(a, 0);
  if (map) for (let i = skip; i < b.length; i++) out[a.length + i - skip] = map(b[i]);
  else out.set(b.subarray(skip), a.length);
  return out;
}

const countNewlines = (s: string) => {
  let n = 0;
  for (let i = s.indexOf('\n'); i >= 0; i = s.indexOf('\n', i + 1)) n++;
  return n;
};

/** The file read on two threads, or null when the one-thread reader must do it (see the top of this file). */
export async function readParallel(path: string, workerUrl: URL): Promise<RawRecording | null> {
  // the source version under tsx: node 20 does not hand tsx's loader to worker threads, so one thread reads
  if (workerUrl.pathname.endsWith('.ts')) return null;
  const size = statSync(path).size;
  if (size < PARALLEL_MIN_BYTES || !coreIsFree()) return null;
  // the cut: just after the first newline at or after the middle (a newline byte never sits inside a UTF-8 character)
  const probe = readRange(path, size >> 1, Math.min(size, (size >> 1) + (1 << 16)));
  const nl = probe.indexOf(10);
  if (nl < 0) return null;
  const cut = (size >> 1) + nl + 1;
  if (cut >= size) return null;

  let text = readRange(path, 0, cut).toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  // preamble: blank and '#' lines, then the header row
  let at = 0;
  for (;;) {
    const end = text.indexOf('\n', at);
    if (end < 0) return null;
    const trimmed = text.slice(at, end).trim();
    at = end + 1;
    if (trimmed !== '' && !trimmed.startsWith('#')) break;
  }
  const preamble = text.slice(0, at);
  // the first half's last non-blank line, to be read again by the worker before its own rows
  let lineEnd = text.length - 1; // text ends with '\n'
  let lineStart = text.lastIndexOf('\n', lineEnd - 1) + 1;
  while (text.slice(lineStart, lineEnd).trim() === '') {
    if (lineStart <= at) return null;
    lineEnd = lineStart - 1;
    lineStart = text.lastIndexOf('\n', lineEnd - 1) + 1;
  }
  const prefix = preamble + text.slice(lineStart, lineEnd + 1);
  const shift = countNewlines(text) - countNewlines(prefix); // worker line -> file line

  const worker = new Worker(workerUrl, { workerData: { path, start: cut, end: size, prefix } satisfies Half });
  const second = new Promise<HalfResult>((resolve) => {
    worker.once('message', (m: HalfResult) => resolve(m));
    worker.once('error', () => resolve({ ok: false }));
    worker.once('exit', () => resolve({ ok: false }));
  });
  let a: RawRecording;
  try {
    a = readHalf(text);
  } catch {
    await worker.terminate();
    return null;
  }
  text = '';
  const b = await second;
  await worker.terminate();
  if (!b.ok) return null;
  const r = b.raw;
  const last = a.time.length - 1;
  if (r.time.length < 2 || r.time[0] !== a.time[last] || r.channels.length !== a.channels.length || !!r.impact !== !!a.impact) return null;
  // a developer's check that the two-thread path ran (never set by the command itself)
  if (process.env.STANCELINE_PARALLEL_PARSE_TRACE) process.stderr.write(`analyze: read on two threads, cut at byte ${cut}\n`);
  return {
    ...a,
    time: concat(a.time, r.time, 1),
    channels: a.channels.map((c, k) => concat(c, r.channels[k], 1)),
    impact: a.impact ? concat(a.impact, r.impact!, 1) : null,
    lines: concat(a.lines, r.lines, 1, (v) => v + shift),
  };
}
