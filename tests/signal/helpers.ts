// Shared helpers of the signal tests: generate a synthetic session, read it back and analyze it.
import { analyzeRecording, type AnalyzeOptions } from '@/lib/signal/analyze';
import { parseRecording } from '@/lib/signal/read';
import { generateSession, type Session, type SessionOptions } from '@/lib/signal/synthetic';
import type { RawRecording } from '@/lib/signal/types';

export const BASE: SessionOptions = {
  seed: 1,
  sampleRateHz: 100,
  sensorsPerFoot: 8,
  units: 'N',
  handedness: 'right',
  stanceWidthMm: 400,
  swings: 3,
  withMarker: false,
};

export function session(o: Partial<SessionOptions>): { s: Session; raw: RawRecording } {
  const s = generateSession({ ...BASE, ...o });
  return { s, raw: parseRecording(s.csv()) };
}

export function analyze(raw: RawRecording, s: Session, opts: AnalyzeOptions = {}) {
  return analyzeRecording(raw, s.layout, opts);
}

/** A copy of a recording with new channel data / time (inputs are never mutated). */
export function withRaw(raw: RawRecording, patch: Partial<RawRecording>): RawRecording {
  return { ...raw, metadata: { ...raw.metadata }, ...patch };
}
