// One processing attempt of one recording: stream the stored raw file through the signal core and write the
// outcome. Bad input (SignalInputError, or a parameter the core refuses with RangeError) is a verdict about the
// file: the recording fails with the message, line and column, and the job is finished. Anything else (storage
// or database trouble) propagates so the worker can retry.
import type { Knex } from 'knex';
import { analyzeRecording, SignalInputError, type AnalysisOutput } from '@/lib/signal';
import { analyzeOptionsOf, profileOf, recordingOptionsSchema, resolveLayout } from '@/lib/recordings/options';
import { readStoredRecording } from '@/lib/recordings/stored-text';
import type { RawFileStore } from '@/lib/storage/types';
import { failRecordingRows, finishJob, stillOwned, type ClaimedJob } from './queue';
import { writeResults } from './write-results';
import { jsonColumn } from '@/lib/db/values';

export type Verdict = { kind: 'ready'; swings: number } | { kind: 'failed'; message: string } | { kind: 'lost' };

type InputProblem = { message: string; line: number | null; column: number | null };

/** Runs the analysis; returns the output, or the input problem that stopped it. */
export async function analyzeStored(
  db: Knex,
  store: RawFileStore,
  recordingId: number,
): Promise<{ out: AnalysisOutput } | { problem: InputProblem }> {
  const row = await db('recordings').where({ id: recordingId }).first('storage_key', 'options');
  if (!row) throw new Error(`recording ${recordingId} does not exist`);
  const options = recordingOptionsSchema.parse(jsonColumn(row.options));
  try {
    const raw = await readStoredRecording(await store.read(row.storage_key), profileOf(options));
    const layout = resolveLayout(options, raw.metadata);
    // a coach's promoted candidates are detected again on every analysis (lib/recordings/promote.ts)
    const promote: number[] = (await db('candidate_promotions').where({ recording_id: recordingId }).orderBy('id').pluck('time_s')).map(Number);
    return { out: analyzeRecording(raw, layout, analyzeOptionsOf(options, promote)) };
  } catch (error) {
    if (error instanceof SignalInputError) {
      // the message already starts with "line L, column C: " when the problem has a place in the file
      return { problem: { message: error.message, line: error.line, column: error.column } };
    }
    if (error instanceof RangeError) return { problem: { message: `processing parameter refused: ${error.message}`, line: null, column: null } };
    throw error;
  }
}

export async function processClaimedJob(db: Knex, store: RawFileStore, job: ClaimedJob, workerId: string): Promise<Verdict> {
  const outcome = await analyzeStored(db, store, job.recordingId);
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
