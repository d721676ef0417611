import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { minMaxDownsample, visibleRange } from '@/components/charts/lib/downsample';
import { nearestIndex, valueAt } from '@/components/charts/lib/nearest';

describe('minMaxDownsample(time, values, buckets)', () => {
  it('keeps the lowest and highest sample of each bucket in time order', () => {
    const t = [0, 1, 2, 3, 4, 5, 6, 7];
    const v = [1, 9, 2, 3, -4, 5, 5, 5];
    // 2 buckets of 4 samples: [1,9,2,3] -> min 1 @0, max 9 @1; [-4,5,5,5] -> min -4 @4, max 5 @5 (first of the ties)
    const d = minMaxDownsample(t, v, 2);
    expect(Array.from(d.time)).toEqual([0, 1, 4, 5]);
    expect(Array.from(d.values)).toEqual([1, 9, -4, 5]);
  });

  it('keeps a NaN where a bucket has a missing sample, so the gap survives', () => {
    const t = [0, 1, 2, 3, 4, 5, 6, 7];
    const v = [1, 2, 3, 4, 5, NaN, 7, 8];
    const d = minMaxDownsample(t, v, 2);
    expect(Array.from(d.time)).toEqual([0, 3, 4, 5, 7]);
    expect(Number.isNaN(d.values[3])).toBe(true);
  });

  it('returns a copy when there are at most two samples per bucket', () => {
    const d = minMaxDownsample([0, 1, 2], [3, 4, 5], 2);
    expect(Array.from(d.values)).toEqual([3, 4, 5]);
  });

  it('never loses the series extremes and never adds a value (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 1, maxLength: 400 }), fc.integer({ min: 1, max: 60 }), (vals, b) => {
        const t = vals.map((_, i) => i);
        const d = minMaxDownsample(t, vals, b);
        const out = Array.from(d.values);
        // by definition of min/max decimation: the global min and max are each some bucket's min or max
        expect(Math.min(...out)).toBe(Math.min(...vals));
        expect(Math.max(...out)).toBe(Math.max(...vals));
        for (let i = 0; i < d.time.length; i++) expect(d.values[i]).toBe(vals[d.time[i]]);
        for (let i = 1; i < d.time.length; i++) expect(d.time[i]).toBeGreaterThan(d.time[i - 1]);
      }),
    );
  });

  it('rejects a bad bucket count', () => {
    expect(() => minMaxDownsample([0], [0], 0)).toThrow(RangeError);
  });
});

describe('visibleRange(time, t0, t1)', () => {
  it('widens by one sample each side so lines reach the edges', () => {
    const t = [0, 0.1, 0.2, 0.3, 0.4, 0.5];
    expect(visibleRange(t, 0.15, 0.35)).toEqual([1, 4]);
    expect(visibleRange(t, -1, 9)).toEqual([0, 5]);
  });
});

describe('nearestIndex(time, t)', () => {
  const t = [0, 0.01, 0.02, 0.03];
  it('finds the nearest sample; ties go to the earlier one; clamps outside', () => {
    expect(nearestIndex(t, 0.0149)).toBe(1);
    expect(nearestIndex(t, 0.0151)).toBe(2);
    expect(nearestIndex([0, 1, 2], 0.5)).toBe(0); // exact tie, earlier sample
    expect(nearestIndex(t, -5)).toBe(0);
    expect(nearestIndex(t, 5)).toBe(3);
  });
  it('agrees with a linear scan on random axes (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.001, max: 1, noNaN: true }), { minLength: 1, maxLength: 200 }), fc.double({ min: -1, max: 250, noNaN: true }), (steps, q) => {
        const time: number[] = [];
        steps.reduce((acc, s) => (time.push(acc + s), acc + s), 0);
        let best = 0;
        for (let i = 1; i < time.length; i++) if (Math.abs(time[i] - q) < Math.abs(time[best] - q)) best = i;
        expect(Math.abs(time[nearestIndex(time, q)] - q)).toBe(Math.abs(time[best] - q));
      }),
    );
  });
  it('valueAt keeps a missing value missing; bad input throws', () => {
    expect(Number.isNaN(valueAt([0, 1], [NaN, 2], 0.2))).toBe(true);
    expect(() => nearestIndex([], 0)).toThrow(RangeError);
    expect(() => nearestIndex(t, NaN)).toThrow(/finite/);
  });
});
