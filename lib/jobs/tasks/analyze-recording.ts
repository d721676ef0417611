// Task "analyze-recording": one stored raw file's bytes and the recording's options in, the analysis outcome out.
// Pure: no database, no store, no clock. The pool runs it in a worker thread; tests and scripts may call it
// directly. Bad input (SignalInputError, or a parameter the core refuses with RangeError) becomes a problem value,
// because error classes do not survive a thread boundary.
import { Readable } from 'node:stream';
import { analyzeRecording, SignalInputError, type AnalysisOutput } from '@/lib/signal';
import { analyzeOptionsOf, profileOf, resolveLayout, type RecordingOptions } from '@/lib/recordings/options';
import { readStoredRecording } from '@/lib/recordings/stored-text';

export type InputProblem = { message: string; line: number | null; column: number | null };
export type AnalysisOutcome = { out: AnalysisOutput } | { problem: InputProblem };

export interface AnalyzeRecordingPayload {
  bytes: Uint8Array;
  options: RecordingOptions;
  /** times (s) of the candidates a coach promoted (lib/recordings/promote.ts) */
  promote: number[];
}

/** The piece size a file stream reads in (64 KiB), so the reader sees the bytes as it does from disk. */
const PIECE = 64 * 1024;

function* pieces(bytes: Uint8Array): Generator<Buffer> {
  for (let at = 0; at < bytes.length; at += PIECE) yield Buffer.from(bytes.buffer, bytes.byteOffset + at, Math.min(PIECE, bytes.length - at));
}

/** The analysis of a readable source; the one code path of the thread and of the in-process runner. */
export async function analyzeSource(source: Readable, options: RecordingOptions, promote: readonly number[]): Promise<AnalysisOutcome> {
  try {
    const raw = await readStoredRecording(source, profileOf(options));
    const layout = resolveLayout(options, raw.metadata);
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

export function analyzeRecordingTask(payload: AnalyzeRecordingPayload): Promise<AnalysisOutcome> {
  return analyzeSource(Readable.from(pieces(payload.bytes), { objectMode: false }), payload.options, payload.promote);
}
