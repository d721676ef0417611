// One processing attempt of one recording: stream the stored raw file through the signal core, prepare the rows
// (lib/jobs/prepare-results.ts) and write them in one transaction. Bad input (SignalInputError, or a parameter the
// core refuses with RangeError) is a verdict about the file: the recording fails with the message, line and column,
// and the job is finished. Anything else (storage or database trouble) propagates so the worker can retry.
// The app runs all of it in a job thread (task "process-job", lib/jobs/tasks/process-job.ts) with the thread's own
// connections, so neither the analysis nor the statements of a large result hold up the server's event loop;
// tests and scripts call it on their own thread.
import type { Knex } from 'knex';
import { createReadStream } from 'node:fs';
import { rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import { localCopyName } from '@/lib/storage/spool';
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
export async function analyzeSource(source: Readable, options: RecordingOptions, promote: readonly number[], byteSize?: number): Promise<AnalysisOutcome> {
  try {
    const raw = await readStoredRecording(source, profileOf(options), byteSize);
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

/** Where a job may find a kept local copy of its raw file (the upload's spool folder on this machine). */
export interface JobFiles {
  localCopyDir?: string;
}

/**
 * The stored file: the upload's kept local copy when this machine has one of the right size (lib/recordings/upload.ts
 * keeps it when an object store took a copy), else the store.
 */
async function openRaw(store: RawFileStore, recordingId: number, row: { storage_key: string; byte_size: unknown }, files: JobFiles): Promise<Readable> {
  if (files.localCopyDir) {
    const path = join(/*turbopackIgnore: true*/ files.localCopyDir, localCopyName(recordingId));
    const size = await stat(path).then((s) => s.size, () => -1);
    if (size === Number(row.byte_size)) return createReadStream(path, { highWaterMark: 1 << 20 });
  }
  return store.read(row.storage_key);
}

/** Reads the recording's options, the coach's promotions and the stored file, and analyses it. */
export async function analyzeStored(db: Knex, store: RawFileStore, recordingId: number, files: JobFiles = {}): Promise<AnalysisOutcome> {
  const row = await db('recordings').where({ id: recordingId }).first('storage_key', 'byte_size', 'options');
  if (!row) throw new Error(`recording ${recordingId} does not exist`);
  const options = recordingOptionsSchema.parse(jsonColumn(row.options));
  // a coach's promoted candidates are detected again on every analysis (lib/recordings/promote.ts)
  const promote: number[] = (await db('candidate_promotions').where({ recording_id: recordingId }).orderBy('id').pluck('time_s')).map(Number);
  return analyzeSource(await openRaw(store, recordingId, row, files), options, promote, Number(row.byte_size) || undefined);
}

export async function processClaimedJob(db: Knex, store: RawFileStore, job: ClaimedJob, workerId: string, files: JobFiles = {}): Promise<Verdict> {
  const outcome = await analyzeStored(db, store, job.recordingId, files);
  // the kept copy has served: later processing (a reprocess) reads the store
  if (files.localCopyDir) await rm(join(/*turbopackIgnore: true*/ files.localCopyDir, localCopyName(job.recordingId)), { force: true });
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
