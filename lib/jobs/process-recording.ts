// One processing attempt of one recording: stream the stored raw file through the signal core and write the
// outcome. Bad input (SignalInputError, or a parameter the core refuses with RangeError) is a verdict about the
// file: the recording fails with the message, line and column, and the job is finished. Anything else (storage
// or database trouble) propagates so the worker can retry.
import type { Knex } from 'knex';
import type { Readable } from 'node:stream';
import { recordingOptionsSchema } from '@/lib/recordings/options';
import type { RawFileStore } from '@/lib/storage/types';
import { failRecordingRows, finishJob, stillOwned, type ClaimedJob } from './queue';
import { writeResults } from './write-results';
import { jsonColumn } from '@/lib/db/values';
import { inlineRunner, type TaskRunner } from './pool';
import type { AnalysisOutcome } from './tasks/analyze-recording';

export type Verdict = { kind: 'ready'; swings: number } | { kind: 'failed'; message: string } | { kind: 'lost' };

async function readAll(source: Readable): Promise<Uint8Array> {
  const chunks: Buffer[] = [];
  let total = 0;
  try {
    for await (const chunk of source) {
      chunks.push(chunk as Buffer);
      total += (chunk as Buffer).length;
    }
  } finally {
    source.destroy();
  }
  // one fresh buffer of its own, so it can move to the thread instead of being copied
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.length;
  }
  return bytes;
}

/**
 * Runs the analysis; returns the output, or the input problem that stopped it. The stored file and the coach's
 * promotions are read here; the analysis itself is the pure task "analyze-recording", in a worker thread when
 * `runner` is the app's pool, on this thread with the inline runner (tests, scripts).
 */
export async function analyzeStored(db: Knex, store: RawFileStore, recordingId: number, runner: TaskRunner = inlineRunner): Promise<AnalysisOutcome> {
  const row = await db('recordings').where({ id: recordingId }).first('storage_key', 'options');
  if (!row) throw new Error(`recording ${recordingId} does not exist`);
  const options = recordingOptionsSchema.parse(jsonColumn(row.options));
  // a coach's promoted candidates are detected again on every analysis (lib/recordings/promote.ts)
  const promote: number[] = (await db('candidate_promotions').where({ recording_id: recordingId }).orderBy('id').pluck('time_s')).map(Number);
  const bytes = await readAll(await store.read(row.storage_key));
  return runner.runTask('analyze-recording', { bytes, options, promote }, { transfer: [bytes.buffer as ArrayBuffer] });
}

export async function processClaimedJob(db: Knex, store: RawFileStore, job: ClaimedJob, workerId: string, runner: TaskRunner = inlineRunner): Promise<Verdict> {
  const outcome = await analyzeStored(db, store, job.recordingId, runner);
  return db.transaction(async (trx) => {
    if (!(await stillOwned(trx, job.id, workerId))) return { kind: 'lost' as const };
    await trx('recordings').where({ id: job.recordingId }).forUpdate().first('id');
    if ('problem' in outcome) {
      await failRecordingRows(trx, job.recordingId, outcome.problem);
      await finishJob(trx, job.id, 'failed', outcome.problem.message);
      return { kind: 'failed' as const, message: outcome.problem.message };
    }
    await writeResults(trx, job.recordingId, outcome.out);
    await finishJob(trx, job.id, 'done', null);
    return { kind: 'ready' as const, swings: outcome.out.result.swings.length };
  });
}
