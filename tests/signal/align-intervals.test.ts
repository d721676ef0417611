import { describe, expect, it } from 'vitest';
import { alignIntervals, pairNearest } from '@/lib/signal/align-intervals';
import { clockCase } from './clock-case';

// The truth in these cases is their construction: impacts at known times on one clock, shots at impact + a known
// offset (+ a small known jitter) on the other, with shots and swings removed or added on purpose. Nothing here is
// derived from the aligner's tolerance.

describe('alignIntervals(a, b, { toleranceS })', () => {
  it('recovers a constructed offset within 50 ms with 10 % missing and 10 % extra shots (20 seeds, offsets in ±120 s)', () => {
    for (let seed = 1; seed <= 20; seed++) {
      const c = clockCase(seed);
      const found = alignIntervals(c.shots, c.impacts, { toleranceS: 1.5 });
      expect(found.offsetS, `seed ${seed}`).not.toBeNull();
      expect(Math.abs(found.offsetS! - c.offsetS), `seed ${seed}`).toBeLessThan(0.05);
      expect(found.matched).toBeGreaterThanOrEqual(c.truth.size - 1);
    }
  });

  it('pairs exactly the constructed shot-swing pairs at the found offset', () => {
    const c = clockCase(7);
    const found = alignIntervals(c.shots, c.impacts, { toleranceS: 1.5 });
    const pairs = pairNearest(c.shots, c.impacts, found.offsetS!, 1.5);
    const wrong = pairs.filter((p) => c.truth.get(p.a) !== p.b);
    // an extra shot may land within 1.5 s of a swing whose own shot is missing; every true pair must be found
    expect(wrong.length).toBeLessThanOrEqual(1);
    for (const [shot, impact] of c.truth) expect(pairs).toContainEqual({ a: shot, b: impact });
  });

  it('finds offsets at both ends of ±120 s and a zero offset', () => {
    for (const offset of [-120, -0.4, 0, 119.97]) {
      const c = clockCase(3, 30, offset);
      expect(alignIntervals(c.shots, c.impacts, { toleranceS: 1.5 }).offsetS! - offset).toBeCloseTo(0, 1);
    }
  });

  it('works with an offset as large as a time zone (the clocks need not be close)', () => {
    const c = clockCase(11, 25, 3600 * 5 + 0.25);
    expect(Math.abs(alignIntervals(c.shots, c.impacts, { toleranceS: 1.5 }).offsetS! - c.offsetS)).toBeLessThan(0.05);
  });

  it('says it cannot align when nothing lines up, and reports nothing for empty input', () => {
    expect(alignIntervals([], [1, 2, 3], { toleranceS: 1 }).offsetS).toBeNull();
    expect(alignIntervals([10], [], { toleranceS: 1 })).toEqual({ offsetS: null, matched: 0, runnerUp: 0, rmsS: null });
    // one shot and one swing: any offset pairs them, so at least 2 matches are required by default
    expect(alignIntervals([100], [5], { toleranceS: 1 }).offsetS).toBeNull();
  });

  it('respects an offset range and refuses bad parameters with RangeError', () => {
    const c = clockCase(5, 30, 60);
    expect(alignIntervals(c.shots, c.impacts, { toleranceS: 1.5, minOffsetS: -10, maxOffsetS: 10 }).matched).toBeLessThan(c.truth.size);
    expect(() => alignIntervals([1], [1], { toleranceS: 0 })).toThrow(RangeError);
    expect(() => alignIntervals([2, 1], [1], { toleranceS: 1 })).toThrow(RangeError);
    expect(() => alignIntervals([NaN], [1], { toleranceS: 1 })).toThrow(RangeError);
    expect(() => pairNearest([1], [1], Infinity, 1)).toThrow(RangeError);
  });

  it('never mutates its inputs', () => {
    const c = clockCase(9, 20);
    const a = [...c.shots];
    const b = [...c.impacts];
    alignIntervals(a, b, { toleranceS: 1.5 });
    expect(a).toEqual(c.shots);
    expect(b).toEqual(c.impacts);
  });
});

describe('pairNearest(a, b, offset, tolerance)', () => {
  it('pairs one-to-one by increasing distance and leaves the far ones out', () => {
    // constructed: b + 10 = [11, 12.1, 30]; a = [11.2, 12, 20]
    expect(pairNearest([11.2, 12, 20], [1, 2.1, 20], 10, 0.5)).toEqual([
      { a: 0, b: 0 },
      { a: 1, b: 1 },
    ]);
    // two shots near one impact: only the nearer one gets it
    expect(pairNearest([9.8, 10.1], [0], 10, 0.5)).toEqual([{ a: 1, b: 0 }]);
  });
});
