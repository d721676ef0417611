import { describe, expect, it } from 'vitest';
import { meanSdBand } from '@/lib/signal/bands';

// A seeded normal sample (Box-Muller on a small LCG) for the coverage check
function normals(n: number, seed: number): number[] {
  let s = seed >>> 0;
  const u = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) + 1) / 4294967297;
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u()));
  return out;
}

describe('meanSdBand(curves, k)', () => {
  it('gives the mean and the sample SD (n - 1) per point', () => {
    const b = meanSdBand([Float64Array.from([1, 10]), Float64Array.from([2, 20]), Float64Array.from([3, 30])]);
    expect(Array.from(b.mean)).toEqual([2, 20]);
    expect(b.sd[0]).toBeCloseTo(1, 12); // sample SD of 1,2,3 = 1 (divisor n-1)
    expect(b.sd[1]).toBeCloseTo(10, 12);
    expect(b.lower[0]).toBeCloseTo(1, 12);
    expect(b.upper[1]).toBeCloseTo(30, 12);
    expect(Array.from(b.n)).toEqual([3, 3]);
  });
  it('scales the band with k', () => {
    const b = meanSdBand([Float64Array.from([1]), Float64Array.from([3])], 2);
    expect(b.sd[0]).toBeCloseTo(Math.SQRT2, 12);
    expect(b.upper[0]).toBeCloseTo(2 + 2 * Math.SQRT2, 12);
  });
  it('skips NaN points and reports n per point; one value has NaN SD', () => {
    const b = meanSdBand([Float64Array.from([1, NaN]), Float64Array.from([3, 5])]);
    expect(Array.from(b.n)).toEqual([2, 1]);
    expect(b.mean[1]).toBe(5);
    expect(Number.isNaN(b.sd[1])).toBe(true);
  });
  it('+-1 SD covers about 68.27 % of a large normal sample', () => {
    const values = normals(20000, 7);
    const b = meanSdBand(values.map((v) => Float64Array.of(v)), 1);
    const inside = values.filter((v) => v >= b.lower[0] && v <= b.upper[0]).length / values.length;
    expect(inside).toBeCloseTo(0.6827, 2); // math: P(|Z| <= 1) = 68.27 %; sampling error ~0.3 % at n = 20000
    const b2 = meanSdBand(values.map((v) => Float64Array.of(v)), 2);
    const inside2 = values.filter((v) => v >= b2.lower[0] && v <= b2.upper[0]).length / values.length;
    expect(inside2).toBeCloseTo(0.9545, 2); // math: P(|Z| <= 2) = 95.45 %
  });
  it('throws RangeError on bad input', () => {
    expect(() => meanSdBand([])).toThrow(RangeError);
    expect(() => meanSdBand([Float64Array.of(1)], -1)).toThrow(RangeError);
    expect(() => meanSdBand([Float64Array.of(1), Float64Array.of(1, 2)])).toThrow(RangeError);
  });
});
