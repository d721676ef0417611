// The job pool: registered pure tasks (lib/jobs/tasks) run in worker threads (piscina), so long computations never
// block the server's event loop; requests and the queue worker's heartbeats go on while an hour-long recording is
// analysed. The threads load the esbuild bundle .build/job-thread.mjs (scripts/build-bundles.mjs; `npm run build`,
// `npm ci`'s prepare step, `npm start` and `npm test` make it), a plain ES module a built `next start` can load at
// run time. Without the pool (tests, scripts), `inlineRunner` runs the same task functions on the calling thread.
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { TransferListItem } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { runRegisteredTask, type TaskName, type TaskPayload, type TaskResult } from './tasks';

export interface RunOptions {
  /** buffers and ports that move to the thread instead of being copied; the caller must not use them afterwards */
  transfer?: TransferListItem[];
}

export interface TaskRunner {
  readonly threads: number;
  runTask<N extends TaskName>(name: N, payload: TaskPayload<N>, options?: RunOptions): Promise<TaskResult<N>>;
  close(): Promise<void>;
}

/** The default: the cores minus one (one stays with the event loop), at least 1. */
export function defaultThreads(cores = availableParallelism()): number {
  return Math.max(1, cores - 1);
}

export function jobThreadFile(root = process.cwd()): string {
  return join(/*turbopackIgnore: true*/ root, '.build', 'job-thread.mjs');
}

export function createTaskPool(options: { threads?: number; file?: string } = {}): TaskRunner {
  const file = options.file ?? jobThreadFile();
  // a run-time file, not part of the Next build: keep the build's file tracing out of it
  if (!existsSync(/*turbopackIgnore: true*/ file)) throw new Error(`${file} is missing; run \`node scripts/build-bundles.mjs\` (npm run build does)`);
  const threads = options.threads ?? defaultThreads();
  if (!(Number.isInteger(threads) && threads >= 1)) throw new RangeError(`job threads must be a whole number >= 1, got ${threads}`);
  const pool = new Piscina({
    filename: pathToFileURL(file).href,
    // One thread stays for the server's life: a fresh thread costs its start-up (~0.2 s) and, more, a first job
    // run before the JIT has compiled the analysis (an hour at 100 Hz took ~2.8 s longer on a cold thread than on a
    // warm one; scripts/bench-api.ts). Threads beyond the first give their memory back after a minute idle.
    minThreads: 1,
    maxThreads: threads,
    idleTimeout: 60_000,
  });
  return {
    threads,
    runTask: (name, payload, run = {}) => pool.run({ name, payload }, { transferList: run.transfer }),
    close: () => pool.close({ force: false }),
  };
}

/** The same tasks on the calling thread (tests, scripts, the demo seed). */
export const inlineRunner: TaskRunner = {
  threads: 0,
  runTask: (name, payload) => runRegisteredTask({ name, payload }) as Promise<never>,
  close: async () => undefined,
};

const globalForPool = globalThis as typeof globalThis & { __stancelineTaskPool?: TaskRunner };

/** This process's one pool (created on first use; ANALYSIS_THREADS threads). */
export function getTaskPool(threads?: number): TaskRunner {
  globalForPool.__stancelineTaskPool ??= createTaskPool({ threads });
  return globalForPool.__stancelineTaskPool;
}

/** Runs a registered task on this process's pool. */
export function runTask<N extends TaskName>(name: N, payload: TaskPayload<N>, options?: RunOptions): Promise<TaskResult<N>> {
  return getTaskPool().runTask(name, payload, options);
}
