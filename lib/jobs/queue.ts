// The processing queue in MariaDB. A worker claims one job inside a short transaction with
// SELECT ... FOR UPDATE SKIP LOCKED, so several app instances never take the same row and never wait on each other.
// All times come from the database clock (NOW(3)), so instances with skewed clocks agree on lock expiry.
import type { Knex } from 'knex';

export interface ClaimedJob {
  id: number;
  recordingId: number;
  attempts: number;
  maxAttempts: number;
}

export interface QueueConfig {
  workerId: string;
  /** a running job whose heartbeat is older than this was left by a dead worker */
  lockTimeoutS: number;
}

type JobRow = { id: number; recording_id: number; state: string; attempts: number; max_attempts: number };

/** Queues processing of a recording (inside the caller's transaction when given one). */
export async function enqueueRecording(db: Knex | Knex.Transaction, recordingId: number, maxAttempts: number): Promise<number> {
  const [id] = await db('processing_jobs').insert({ recording_id: recordingId, state: 'queued', max_attempts: maxAttempts });
  return Number(id);
}

/** Why a job that died with its worker is given up on, shown on the recording. */
export function abandonedReason(attempts: number): string {
  return `processing stopped ${attempts} time(s) without finishing (the server stopped or ran out of memory while processing this file); reprocess it to try again`;
}

/**
 * Claims the next job: a queued one that is due, or a running one whose worker stopped sending heartbeats.
 * A stale job that already used all its attempts is failed (with its recording) and the search goes on.
 */
export async function claimNextJob(db: Knex, config: QueueConfig): Promise<ClaimedJob | null> {
  for (;;) {
    const outcome = await db.transaction(async (trx) => {
      const [rows] = (await trx.raw(
        `SELECT id, recording_id, state, attempts, max_attempts FROM processing_jobs
          WHERE (state = 'queued' AND run_after <= NOW(3))
             OR (state = 'running' AND heartbeat_at < NOW(3) - INTERVAL ? SECOND)
          ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED`,
        [config.lockTimeoutS],
      )) as [JobRow[]];
      const row = rows[0];
      if (!row) return { kind: 'none' as const };
      if (row.state === 'running' && row.attempts >= row.max_attempts) {
        const reason = abandonedReason(row.attempts);
        await trx('processing_jobs')
          .where({ id: row.id })
          .update({ state: 'failed', last_error: reason, locked_by: null, finished_at: trx.raw('NOW(3)') });
        await failRecordingRows(trx, row.recording_id, { message: reason, line: null, column: null });
        return { kind: 'abandoned' as const };
      }
      await trx('processing_jobs')
        .where({ id: row.id })
        .update({
          state: 'running',
          attempts: row.attempts + 1,
          locked_by: config.workerId,
          locked_at: trx.raw('NOW(3)'),
          heartbeat_at: trx.raw('NOW(3)'),
        });
      await trx('recordings').where({ id: row.recording_id }).update({ status: 'processing' });
      return {
        kind: 'claimed' as const,
        job: { id: Number(row.id), recordingId: Number(row.recording_id), attempts: row.attempts + 1, maxAttempts: row.max_attempts },
      };
    });
    if (outcome.kind === 'none') return null;
    if (outcome.kind === 'claimed') return outcome.job;
  }
}

/** Keeps the lock of a running job fresh; false when the job is no longer this worker's. */
export async function heartbeat(db: Knex, jobId: number, workerId: string): Promise<boolean> {
  const changed = await db('processing_jobs')
    .where({ id: jobId, locked_by: workerId, state: 'running' })
    .update({ heartbeat_at: db.raw('NOW(3)') });
  return changed === 1;
}

/** Locks the job row for the final write; false when another worker took it over meanwhile. */
export async function stillOwned(trx: Knex.Transaction, jobId: number, workerId: string): Promise<boolean> {
  const row = await trx('processing_jobs').where({ id: jobId }).forUpdate().first('state', 'locked_by');
  return row?.state === 'running' && row.locked_by === workerId;
}

export async function finishJob(trx: Knex.Transaction, jobId: number, state: 'done' | 'failed', lastError: string | null): Promise<void> {
  await trx('processing_jobs')
    .where({ id: jobId })
    .update({ state, last_error: lastError === null ? null : lastError.slice(0, 2000), locked_by: null, finished_at: trx.raw('NOW(3)') });
}

/** A recording that could not be processed: no results survive, the reason (and where) is kept. */
export async function failRecordingRows(
  trx: Knex.Transaction,
  recordingId: number,
  error: { message: string; line: number | null; column: number | null },
): Promise<void> {
  await trx('swings').where({ recording_id: recordingId }).delete(); // events, values and phases cascade
  await trx('recording_series').where({ recording_id: recordingId }).delete();
  await trx('recording_payloads').where({ recording_id: recordingId }).delete();
  await trx('recordings').where({ id: recordingId }).update({
    status: 'failed',
    error_message: error.message.slice(0, 2000),
    error_line: error.line,
    error_column: error.column,
    processed_at: trx.raw('NOW(3)'),
  });
}

/**
 * An attempt that broke for a reason outside the file (storage or database unreachable): queued again after a
 * back-off of 5 s x attempts, or failed with that reason once the attempts are used up.
 */
export async function retryOrFail(db: Knex, job: ClaimedJob, workerId: string, message: string): Promise<'retry' | 'failed' | 'lost'> {
  return db.transaction(async (trx) => {
    if (!(await stillOwned(trx, job.id, workerId))) return 'lost';
    if (job.attempts >= job.maxAttempts) {
      const reason = `could not process after ${job.attempts} attempt(s): ${message}`;
      await finishJob(trx, job.id, 'failed', reason);
      await failRecordingRows(trx, job.recordingId, { message: reason, line: null, column: null });
      return 'failed';
    }
    await trx('processing_jobs')
      .where({ id: job.id })
      .update({
        state: 'queued',
        last_error: message.slice(0, 2000),
        locked_by: null,
        run_after: trx.raw('NOW(3) + INTERVAL ? SECOND', [5 * job.attempts]),
      });
    await trx('recordings').where({ id: job.recordingId }).update({ status: 'received' });
    return 'retry';
  });
}
