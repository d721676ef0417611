import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BAND_CURVES, buildBand, meanLandmarks, registerSwingCurve, scoreCurve, scoreSwingAgainstBand, unusableReason, type SwingCurves } from '@/lib/bands/build';

// The band code: registration (landmark registration, Ramsay & Silverman, Functional Data Analysis, 2nd ed., ch. 8; the worked example below computed by
// piecewise-linear interpolation),
// coverage of mean +- k SD on seeded normal samples (math: P(|Z| <= 1) = 68.27 %, P(|Z| <= 2) = 95.45 %) and the
// similarity scores (Kadaba et al. 1989, J Orthop Res 7:849, CMC [citation from memory]; the worked values computed from its formula with scipy/numpy).

describe('registration through the band code', () => {
  it('landmark registration worked example (Ramsay & Silverman ch. 8): events [0, 0.80, 1.05, 1.90] s -> [0, 75, 100, 150]', () => {
    const time = Array.from({ length: 381 }, (_, i) => i * 0.005); // 0 .. 1.9 s
    const r = registerSwingCurve(time, time, [0, 0.8, 1.05, 1.9], [0, 75, 100, 150], 301); // axis step 0.5
    expect(r[75]).toBeCloseTo(0.4, 12); // 37.5 -> 0.4 s (Ramsay & Silverman ch. 8, computed)
    expect(r[175]).toBeCloseTo(0.925, 12); // 87.5 -> 0.925 s (Ramsay & Silverman ch. 8, computed)
  });

  it('landmarks are the mean relative event positions (by hand)', () => {
    const mk = (eventTimes: number[]): SwingCurves => ({ id: 1, time: [0, 3], curves: { leadPct: [0, 0], leadHeelPct: [0, 0], trailHeelPct: [0, 0], copX: [0, 0] }, eventTimes });
    const lm = meanLandmarks([mk([0, 1, 1.5, 2, 3]), mk([0, 0.6, 0.9, 1.2, 2])]);
    // [0, 33.33, 50, 66.67, 100] and [0, 30, 45, 60, 100] -> mean
    [0, 95 / 3, 47.5, 190 / 3, 100].forEach((v, i) => expect(lm[i]).toBeCloseTo(v, 10));
  });

  it('refuses swings with events out of order or outside the window', () => {
    const base = { id: 1, time: [0, 1, 2], curves: { leadPct: [0, 0, 0], leadHeelPct: [0, 0, 0], trailHeelPct: [0, 0, 0], copX: [0, 0, 0] } };
    expect(unusableReason({ ...base, eventTimes: [0, 0.5, 0.4, 1, 2] })).toMatch(/order/);
    expect(unusableReason({ ...base, eventTimes: [0, 0.5, 1, 1.5, 2.5] })).toMatch(/outside/);
    expect(unusableReason({ ...base, eventTimes: [0, 0.5, 1, 1.5, 2] })).toBeNull();
  });
});

// Standard normal draws from fast-check's seeded generator (Box-Muller on two uniform integers scaled to (0, 1)).
function normalSwings(n: number, seed: number): SwingCurves[] {
  // fc.noBias: plain uniform integers (fast-check otherwise favours small and edge values)
  const uniform = fc.noBias(fc.integer({ min: 1, max: 0x7fffffff }));
  const pairs = fc.sample(fc.tuple(uniform, uniform), { seed, numRuns: n * 101 * 4 });
  let k = 0;
  const z = () => {
    const [u, v] = pairs[k++];
    return Math.sqrt(-2 * Math.log(u / 0x80000000)) * Math.cos((2 * Math.PI * v) / 0x80000000);
  };
  const time = Array.from({ length: 101 }, (_, i) => i / 100);
  return Array.from({ length: n }, (_, id) => {
    const curves = {} as SwingCurves['curves'];
    for (const c of BAND_CURVES) curves[c] = time.map((t) => 50 + 30 * Math.sin(2 * Math.PI * t) + (5 + 10 * t) * z());
    return { id, time, curves, eventTimes: [0, 0.25, 0.5, 0.75, 1] };
  });
}

describe('band coverage on normal samples', () => {
  const swings = normalSwings(300, 424242);
  const coverage = (k: number) => {
    const band = buildBand(swings, k);
    let sum = 0;
    for (const s of swings) sum += scoreSwingAgainstBand(s, band).leadPct.insidePct!;
    return sum / swings.length;
  };
  it('+-1 SD covers about 68.27 %', () => {
    expect(Math.abs(coverage(1) - 68.27)).toBeLessThan(1.5); // math: 2 Phi(1) - 1; sampling tolerance for 30 300 points
  });
  it('+-2 SD covers about 95.45 %', () => {
    expect(Math.abs(coverage(2) - 95.45)).toBeLessThan(0.8); // math: 2 Phi(2) - 1
  });
  it('keeps the axis, the landmarks and one curve per trace', () => {
    const band = buildBand(swings.slice(0, 3), 1);
    expect(band.axis).toHaveLength(101);
    expect(band.axis[100]).toBe(100);
    expect(band.landmarks).toEqual({ address: 0, top: 25, transition: 50, impact: 75, finish: 100 });
    for (const c of BAND_CURVES) expect(band.curves[c].mean).toHaveLength(101);
  });
});

describe('similarity of a swing to the band mean', () => {
  // The sine is sin(2 pi t), t = 0, 0.01, ..., 1 (as in tests/signal/similarity.test.ts).
  const sine = Array.from({ length: 101 }, (_, i) => Math.sin(2 * Math.PI * (i / 100)));
  const band = { mean: sine, sd: sine.map(() => 1), lower: sine.map((v) => v - 1), upper: sine.map((v) => v + 1) };
  it('identical: CMC 1, RMS 0, all inside', () => {
    const s = scoreCurve(sine, band);
    expect(s.cmc).toBeCloseTo(1, 10); // Kadaba 1989 CMC [from memory]: identical curves give 1
    expect(s.rms).toBe(0);
    expect(s.insidePct).toBe(100);
  });
  it('+0.5 offset: CMC 0.88143, RMS 0.5', () => {
    const s = scoreCurve(sine.map((v) => v + 0.5), band);
    expect(s.cmc).toBeCloseTo(0.88143, 5); // Kadaba 1989 CMC [from memory], +0.5 offset, computed with scipy/numpy
    expect(s.rms).toBeCloseTo(0.5, 12); // RMS of a constant 0.5 offset is 0.5
  });
  it('2x gain: CMC 0.89498; +0.1 offset: CMC 0.99499', () => {
    expect(scoreCurve(sine.map((v) => 2 * v), band).cmc).toBeCloseTo(0.89498, 5); // Kadaba 1989 CMC, 2x gain, computed with scipy/numpy
    expect(scoreCurve(sine.map((v) => v + 0.1), band).cmc).toBeCloseTo(0.99499, 5); // Kadaba 1989 CMC, +0.1 offset, computed with scipy/numpy
  });
  it('counts only points with a value; inside share by hand', () => {
    const values = sine.map((v, i) => (i < 50 ? v : v + 2)); // points 50..100 (51 of 101) lie outside +-1
    expect(scoreCurve(values, band).insidePct).toBeCloseTo((100 * 50) / 101, 10); // by hand
    const gaps = sine.map((v, i) => (i % 2 ? NaN : v));
    expect(scoreCurve(gaps, band).points).toBe(51);
  });
});
