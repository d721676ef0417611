// The processing worker: polls the queue, runs one job at a time, keeps its lock fresh with heartbeats and retries
// a job that broke for a reason outside the file. Several workers (one per app instance) share one queue.
import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import type { Knex } from 'knex';
import type { RawFileStore } from '@/lib/storage/types';
import type { TaskRunner } from './pool';
import { processClaimedJob, type Verdict } from './process-recording';
import { claimNextJob, heartbeat, retryOrFail, type ClaimedJob } from './queue';

export interface WorkerOptions {
  db: Knex;
  store: RawFileStore;
  pollMs: number;
  lockTimeoutS: number;
  workerId?: string;
  /**
   * Where each job runs: the app's thread pool (task "process-job", which opens its own connections from
   * `databaseUrl` and the store's config), or (default) this thread with `db` and `store`, for tests and scripts.
   */
  runner?: TaskRunner;
  /** the database the pool's threads connect to; required with `runner` */
  databaseUrl?: string;
  /** the upload spool folder of this machine, where a just-uploaded file's kept copy may wait (lib/storage/spool.ts) */
  localCopyDir?: string;
  log?: (message: string) => void;
}

export interface Worker {
  readonly id: string;
  /** Looks at the queue now instead of at the next poll (called after an upload). */
  wake(): void;
  /** Finishes the job in hand, then stops. */
  stop(): Promise<void>;
}

export function newWorkerId(): string {
  return `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;
}

function threadDatabaseUrl(options: WorkerOptions): string {
  if (!options.databaseUrl) throw new Error('a worker with a thread pool needs databaseUrl for its threads');
  return options.databaseUrl;
}

/** Claims and runs one job; null when the queue had nothing due. */
export async function runOneJob(options: WorkerOptions & { workerId: string }): Promise<{ job: ClaimedJob; verdict: Verdict | 'retry' | 'failed' | 'lost' } | null> {
  const { db, store, workerId, lockTimeoutS } = options;
  const job = await claimNextJob(db, { workerId, lockTimeoutS });
  if (!job) return null;
  // With the app's pool the whole job runs in a worker thread and heartbeats fire throughout. On this thread (tests,
  // scripts) the analysis is synchronous and heartbeats only fire between awaits, so the lock timeout must exceed the
  // longest analysis (60 s default vs ~2 s for an hour at 100 Hz).
  const timer = setInterval(() => void heartbeat(db, job.id, workerId).catch(() => undefined), Math.max(1000, (lockTimeoutS * 1000) / 3));
  try {
    const verdict = options.runner
      ? await options.runner.runTask('process-job', { job, workerId, databaseUrl: threadDatabaseUrl(options), store: store.config, localCopyDir: options.localCopyDir })
      : await processClaimedJob(db, store, job, workerId, { localCopyDir: options.localCopyDir });
    return { job, verdict };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    options.log?.(`job ${job.id} (recording ${job.recordingId}) attempt ${job.attempts} failed: ${message}`);
    return { job, verdict: await retryOrFail(db, job, workerId, message) };
  } finally {
    clearInterval(timer);
  }
}

/** Runs jobs until none is due (tests, scripts). */
export async function drainQueue(options: WorkerOptions & { workerId: string }): Promise<number> {
  let count = 0;
  while (await runOneJob(options)) count++;
  return count;
}

export function startWorker(options: WorkerOptions): Worker {
  const id = options.workerId ?? newWorkerId();
  let stopped = false;
  let wakeUp: (() => void) | null = null;
  const pause = () =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(done, options.pollMs);
      function done() {
        clearTimeout(timer);
        wakeUp = null;
        resolve();
      }
      wakeUp = done;
    });
  const loop = (async () => {
    while (!stopped) {
      try {
        const ran = await runOneJob({ ...options, workerId: id });
        if (!ran) await pause();
      } catch (error) {
        // the database itself is unreachable: wait and try again, the jobs stay in the queue
        options.log?.(`queue unavailable: ${error instanceof Error ? error.message : String(error)}`);
        await pause();
      }
    }
  })();
  return {
    id,
    wake: () => wakeUp?.(),
    async stop() {
      stopped = true;
      wakeUp?.();
      await loop;
    },
  };
}
