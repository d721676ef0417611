// One processing attempt of one recording: stream the stored raw file through the signal core, prepare the rows
// (lib/jobs/prepare-results.ts) and write them in one transaction. Bad input (SignalInputError, or a parameter the
// core refuses with RangeError) is a verdict about the file: the recording fails with the message, line and column,
// and the job is finished. Anything else (storage or database trouble) propagates so the worker can retry.
// The app runs all of it in a job thread (task "process-job", lib/jobs/tasks/process-job.ts) with the thread's own
// connections, so neither the analysis nor the statements of a large result hold up the server's event loop;
// tests and scripts call it on their own thread.
import type { Knex } from 'knex';
import type { Readable } from 'node:stream';
import { analyzeRecording, SignalInputError } from '@/lib/signal';
import { analyzeOptionsOf, profileOf, recordingOptionsSchema, resolveLayout, type RecordingOptions } from '@/lib/recordings/options';
import { readStoredRecording } from '@/lib/recordings/stored-text';
import type { RawFileStore } from '@/lib/storage/types';
import { jsonColumn } from '@/lib/db/values';
import { failRecordingRows, finishJob, stillOwned, type ClaimedJob } from './queue';
import { prepareResults, type PreparedAnalysis } from './prepare-results';
import { writeResults } from './write-results';

export type Verdict = { kind: 'ready'; swings: number } | { kind: 'failed'; message: string } | { kind: 'lost' };

export type InputProblem = { message: string; line: number | null; column: number | null };
export type AnalysisOutcome = { prepared: PreparedAnalysis } | { problem: InputProblem };

/** The analysis of a readable source, prepared for storing; or the input problem that stopped it. */
export async function analyzeSource(source: Readable, options: RecordingOptions, promote: readonly number[]): Promise<AnalysisOutcome> {
  try {
    const raw = await readStoredRecording(source, profileOf(options));
    const layout = resolveLayout(options, raw.metadata);
    return { prepared: prepareResults(analyzeRecording(raw, layout, analyzeOptionsOf(options, promote))) };
  } catch (error) {
    if (error instanceof SignalInputError) {
      // the message already starts with "line L, column C: " when the problem has a place in the file
      return { problem: { message: error.message, line: error.line, column: error.column } };
    }
    if (error instanceof RangeError) return { problem: { message: `processing parameter refused: ${error.message}`, line: null, column: null } };
    throw error;
  }
}

/** Reads the recording's options, the coach's promotions and the stored file, and analyses it. */
export async function analyzeStored(db: Knex, store: RawFileStore, recordingId: number): Promise<AnalysisOutcome> {
  const row = await db('recordings').where({ id: recordingId }).first('storage_key', 'options');
  if (!row) throw new Error(`recording ${recordingId} does not exist`);
  const options = recordingOptionsSchema.parse(jsonColumn(row.options));
  // a coach's promoted candidates are detected again on every analysis (lib/recordings/promote.ts)
  const promote: number[] = (await db('candidate_promotions').where({ recording_id: recordingId }).orderBy('id').pluck('time_s')).map(Number);
  return analyzeSource(await store.read(row.storage_key), options, promote);
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
    await writeResults(trx, job.recordingId, outcome.prepared);
    await finishJob(trx, job.id, 'done', null);
    return { kind: 'ready' as const, swings: outcome.prepared.result.swings.length };
  });
}
