// `npm run analyze`: runs the compiled command (.build/analyze.mjs, made by scripts/build-bundles.mjs in `npm ci`'s
// prepare step), rebuilding it first when it is missing or older than its sources. No tsx on this path.
import { readFileSync, statSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { Worker } from 'node:worker_threads';
import { bundlePath, isStale, buildBundle } from './build-bundles.mjs';

// the command and the worker thread of its two-thread reader
for (const name of ['analyze', 'analyze-worker']) if (isStale(name)) await buildBundle(name);

// When the two-thread reader is on (STANCELINE_PARALLEL_PARSE_MIN_BYTES; off by default) and FILE is large and has
// no --profile, its worker (scripts/analyze-parallel.ts) starts now, so its start-up overlaps the loading of the
// command's bundle. It is handed over as `ReadWorker` there (same fields, same message keeping); the command checks
// that it reads the command's FILE and ends it when unused. Options taking a value are those of scripts/analyze.ts;
// anything unexpected here just means no early worker.

// coreIsFree of scripts/analyze-parallel.ts: a second thread only while no other task is runnable
function coreIsFree() {
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

const VALUE_OPTIONS = new Set(['--layout', '--profile', '--handedness', '--stance-width-mm', '--cutoff-hz', '--series']);
const MIN_BYTES = Number(process.env.STANCELINE_PARALLEL_PARSE_MIN_BYTES ?? Infinity); // PARALLEL_MIN_BYTES there

function earlyWorkerFile(argv) {
  const files = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--') continue;
    if (!a.startsWith('--')) files.push(a);
    else {
      const eq = a.indexOf('=');
      const name = eq > 0 ? a.slice(0, eq) : a;
      if (!VALUE_OPTIONS.has(name) || name === '--profile') return null;
      if (eq < 0) i++;
    }
  }
  if (files.length !== 1 || !coreIsFree()) return null;
  try {
    const stat = statSync(files[0]);
    return stat.isFile() && stat.size >= MIN_BYTES ? files[0] : null;
  } catch {
    return null;
  }
}

const file = earlyWorkerFile(process.argv.slice(2));
if (file !== null) {
  const worker = new Worker(bundlePath('analyze-worker'), { workerData: { path: file } });
  worker.unref();
  const rw = { path: file, worker, messages: [], failed: false, wake: null };
  worker.on('message', (m) => {
    rw.messages.push(m);
    rw.wake?.();
  });
  const fail = () => {
    rw.failed = true;
    rw.wake?.();
  };
  worker.on('error', fail);
  worker.on('exit', fail);
  globalThis[Symbol.for('stanceline.analyze.readWorker')] = rw;
}

await import(bundlePath('analyze'));
