// Starts the one worker of this server process (called from instrumentation.ts). It has its own small pool, so a
// long results transaction never holds up the connections that serve requests.
import { createKnex } from '@/lib/db/connection';
import { getEnv } from '@/lib/env';
import { getStore } from '@/lib/storage';
import { spoolDirOf } from '@/lib/storage/spool';
import { sweepBin } from '@/lib/sessions/bin';
import { defaultThreads, getTaskPool } from './pool';
import { sendDueTomorrowReminders } from '@/lib/accounts/drill-mail';
import { sweepSpentTokens } from '@/lib/accounts/token-sweep';
import { startWorker, type Worker } from './worker';
import { startVideoWorker } from '@/lib/videos/worker';

const BIN_SWEEP_EVERY_MS = 60 * 60 * 1000;

const globalForWorker = globalThis as typeof globalThis & { __stancelineWorker?: Worker };

export function startAppWorker(): Worker | null {
  const env = getEnv();
  if (env.WORKER_ENABLED !== 'true') return null;
  if (globalForWorker.__stancelineWorker) return globalForWorker.__stancelineWorker;
  const db = createKnex(env.DATABASE_URL, 2);
  const runner = getTaskPool(env.ANALYSIS_THREADS ?? defaultThreads());
  const worker = startWorker({
    db,
    store: getStore(),
    runner,
    databaseUrl: env.DATABASE_URL,
    localCopyDir: spoolDirOf(env.STORAGE_DIR),
    pollMs: env.WORKER_POLL_MS,
    lockTimeoutS: env.JOB_LOCK_TIMEOUT_S,
    log: (message) => console.error(`[stanceline worker] ${message}`),
  });
  globalForWorker.__stancelineWorker = worker;
  // Videos (ffmpeg child processes) have their own loop, so a long transcode never holds up a recording's analysis.
  startVideoWorker(db, getStore(), `${worker.id}:video`, env.WORKER_POLL_MS, (m) => console.error(`[stanceline video] ${m}`));
  // The bin's sweep (sessions, recordings, drills, bands and assignments deleted more than 30 days ago) runs beside the worker, once an hour.
  const sweep = () =>
    void sweepBin(db, getStore())
      .then((r) => r.sessions + r.recordings + r.library + r.shares + r.notes > 0 && console.log(`[stanceline bin] removed ${r.sessions} sessions, ${r.recordings} recordings, ${r.files} raw files, ${r.library} drills, bands and assignments, ${r.shares} shares, ${r.notes} notes`))
      .catch((error) => console.error('[stanceline bin] sweep failed', error))
      .then(() => sweepSpentTokens(db))
      .then((r) => r.resets + r.invitations > 0 && console.log(`[stanceline accounts] removed ${r.resets} spent password-reset links, ${r.invitations} old unaccepted invitations`))
      .catch((error) => console.error('[stanceline accounts] link sweep failed', error));
  sweep();
  setInterval(sweep, BIN_SWEEP_EVERY_MS).unref();
  // Drill reminders for drills due tomorrow: hourly, so a restart never skips a day; mail_log keeps it to one a day.
  const remind = () =>
    void sendDueTomorrowReminders(new Date(), db)
      .then((sent) => sent > 0 && console.log(`[stanceline mail] sent ${sent} drill reminders`))
      .catch((error) => console.error('[stanceline mail] drill reminders failed', error));
  remind();
  setInterval(remind, BIN_SWEEP_EVERY_MS).unref();
  console.log(`[stanceline worker] ${worker.id} polling every ${env.WORKER_POLL_MS} ms, ${runner.threads} job thread(s), raw files in ${getStore().description}`);
  return worker;
}

/** Nudges this process's worker (after an upload or a reprocess request), if it runs here. */
export function wakeAppWorker(): void {
  globalForWorker.__stancelineWorker?.wake();
}
