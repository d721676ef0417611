import { describe, expect, it } from 'vitest';
import { cmc, rmsDifference } from '@/lib/signal/similarity';

// Kadaba et al. 1989 CMC (J Orthop Res 7:849 [citation from memory]) on a sine of 101 points; the values computed from
// its formula with scipy/numpy.
// The sine is sin(2 pi t) for t = 0, 0.01, ..., 1 (numpy.linspace(0, 1, 101)); checked with /usr/bin/python3 (Debian
// numpy): that definition reproduces all four listed values, a 101-point grid excluding t = 1 does not (0.88254).
const sine = Float64Array.from({ length: 101 }, (_, i) => Math.sin(2 * Math.PI * (i / 100)));
const map = (f: (v: number) => number) => sine.map(f);

describe('cmc(curves)', () => {
  it('identical curves -> 1', () => {
    expect(cmc([sine, Float64Array.from(sine)])).toBeCloseTo(1, 10); // identical curves: CMC 1 (Kadaba 1989)
  });
  it('+0.5 offset -> 0.88143', () => {
    expect(cmc([sine, map((v) => v + 0.5)])).toBeCloseTo(0.88143, 5); // Kadaba 1989 formula, computed with scipy/numpy
  });
  it('2x gain -> 0.89498', () => {
    expect(cmc([sine, map((v) => 2 * v)])).toBeCloseTo(0.89498, 5); // Kadaba 1989 formula, computed with scipy/numpy
  });
  it('+0.1 offset -> 0.99499', () => {
    expect(cmc([sine, map((v) => v + 0.1)])).toBeCloseTo(0.99499, 5); // Kadaba 1989 formula, computed with scipy/numpy
  });
  it('is NaN for constant curves and throws RangeError for fewer than two curves', () => {
    expect(Number.isNaN(cmc([Float64Array.of(1, 1), Float64Array.of(1, 1)]))).toBe(true);
    expect(() => cmc([sine])).toThrow(RangeError);
    expect(() => cmc([sine, Float64Array.of(1, 2)])).toThrow(RangeError);
  });
});

describe('rmsDifference(a, b)', () => {
  it('+0.5 offset -> 0.5', () => {
    expect(rmsDifference(sine, map((v) => v + 0.5))).toBeCloseTo(0.5, 12); // the RMS of a constant 0.5 offset is 0.5
  });
  it('is 0 for identical curves and symmetric', () => {
    expect(rmsDifference(sine, sine)).toBe(0);
    const g = map((v) => 2 * v);
    expect(rmsDifference(sine, g)).toBe(rmsDifference(g, sine));
  });
  it('throws RangeError on length mismatch or NaN', () => {
    expect(() => rmsDifference(Float64Array.of(1, 2), Float64Array.of(1))).toThrow(RangeError);
    expect(() => rmsDifference(Float64Array.of(1, NaN), Float64Array.of(1, 2))).toThrow(RangeError);
  });
});
