import { describe, expect, it } from 'vitest';
import reference from '../fixtures/scipy/reference.json';
import {
  butterworthSos,
  correctedCutoff,
  defaultPadlen,
  DEFAULT_CUTOFF_HZ,
  magnitudeAt,
  sosfilt,
  sosfiltfilt,
  sosfiltZi,
  sosToTf,
  zeroLagDesign,
  zeroLagLowpass,
  type Biquad,
} from '@/lib/signal/filter';

const x = Float64Array.from(reference.x);
const db = (g: number) => 20 * Math.log10(g);
const maxAbsDiff = (a: ArrayLike<number>, b: ArrayLike<number>) => {
  expect(a.length).toBe(b.length);
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
};

describe('butterworthSos(order, cutoffHz, fs)', () => {
  it('butter(2,10,fs=100) matches the published scipy coefficients', () => {
    const { b, a } = sosToTf(butterworthSos(2, 10, 100));
    // scipy.signal.butter(2, 10, fs=100)
    const bRef = [0.0674552739, 0.1349105478, 0.0674552739];
    const aRef = [1, -1.1429805025, 0.4128015981];
    b.forEach((v, i) => expect(v).toBeCloseTo(bRef[i], 9));
    a.forEach((v, i) => expect(v).toBeCloseTo(aRef[i], 9));
  });

  it('butter(4,10,fs=100) matches the published scipy coefficients', () => {
    const { b, a } = sosToTf(butterworthSos(4, 10, 100));
    // scipy.signal.butter(4, 10, fs=100)
    const bRef = [0.0048243434, 0.0192973734, 0.0289460601, 0.0192973734, 0.0048243434];
    const aRef = [1, -2.3695130072, 2.3139884144, -1.0546654059, 0.1873794924];
    b.forEach((v, i) => expect(Math.abs(v - bRef[i])).toBeLessThan(1e-9));
    a.forEach((v, i) => expect(Math.abs(v - aRef[i])).toBeLessThan(1e-9));
  });

  it.each(reference.butter.map((r) => [r.order, r.fc, r] as const))(
    'order %i, fc %f Hz: transfer function equals scipy.signal.butter to 1e-7',
    (order, fc, r) => {
      // reference: scipy.signal.butter(order, fc, fs=100) from Debian python3-scipy (tests/fixtures/scipy)
      const { b, a } = sosToTf(butterworthSos(order, fc, 100));
      expect(maxAbsDiff(b, r.b)).toBeLessThan(1e-7);
      expect(maxAbsDiff(a, r.a)).toBeLessThan(1e-7);
    },
  );

  it('is -3.01 dB at the cutoff for a single pass, any order', () => {
    for (const order of [2, 4, 6]) {
      // scipy.signal.butter docs: the gain drops to 1/sqrt(2) at the critical frequency [SEEN]
      expect(magnitudeAt(butterworthSos(order, 10, 100), 10, 100)).toBeCloseTo(Math.SQRT1_2, 10);
    }
    expect(db(magnitudeAt(butterworthSos(2, 10, 100), 10, 100))).toBeCloseTo(-3.0103, 4);
  });

  it('uncorrected dual pass is -6.02 dB at the cutoff', () => {
    // computed with scipy.signal: filtfilt squares the gain, |H(fc)|^2 = 0.5
    const g = magnitudeAt(butterworthSos(2, 10, 100), 10, 100) ** 2;
    expect(g).toBeCloseTo(0.5, 10);
    expect(db(g)).toBeCloseTo(-6.0206, 4);
  });

  it('rolls off at -40 dB/decade for 2nd order', () => {
    // computed with scipy.signal (Debian python3-scipy): 2nd order fc 1 Hz fs 1000 -> -40.0 dB at 10 Hz; -20N dB/decade [MEM]
    expect(db(magnitudeAt(butterworthSos(2, 1, 1000), 10, 1000))).toBeCloseTo(-40.0, 1);
  });

  it('refuses odd orders and cutoffs outside (0, fs/2)', () => {
    expect(() => butterworthSos(3, 10, 100)).toThrow(RangeError);
    expect(() => butterworthSos(2, 50, 100)).toThrow(RangeError);
    expect(() => butterworthSos(2, 0, 100)).toThrow(RangeError);
    expect(() => butterworthSos(2, 10, -1)).toThrow(RangeError);
  });
});

describe('correctedCutoff(fcRequested, fs, passes)', () => {
  it('gives the published design cutoffs', () => {
    // multi-pass correction (Winter, Biomechanics and Motor Control of Human Movement, 4th ed., p. 69), design cutoffs computed with scipy.signal: fc10/fs100 -> 12.2492; fc6 -> 7.4309; fc20 -> 23.4251
    expect(correctedCutoff(10, 100)).toBeCloseTo(12.2492, 4);
    expect(correctedCutoff(6, 100)).toBeCloseTo(7.4309, 4);
    expect(correctedCutoff(20, 100)).toBeCloseTo(23.4251, 4);
  });

  it('uses C = 0.80224 for two passes of a 2nd-order filter', () => {
    // Winter 4th ed. p. 69: C = (2^(1/n) - 1)^(1/4), n = 2 -> 0.80224 [SEEN]
    const fc = correctedCutoff(10, 100);
    expect(Math.tan(Math.PI * 10 / 100) / Math.tan(Math.PI * fc / 100)).toBeCloseTo(0.80224, 5);
  });

  it("reproduces Winter's coefficient formulas for the corrected fc10/fs100 filter", () => {
    // Winter / Robertson & Dowling 2003 [MEM citation]: wc = tan(pi fc/fs)/C, K1 = sqrt2 wc, K2 = wc^2,
    // a0 = K2/(1+K1+K2), b1 = 2 a0 (1/K2 - 1), b2 = 1 - (a0 + a1 + a2 + b1) (Robertson & Dowling 2003, J Electromyogr Kinesiol 13:569 [citation from memory]); values computed with scipy.signal
    const C = Math.pow(Math.SQRT2 - 1, 0.25);
    const wc = Math.tan((Math.PI * 10) / 100) / C;
    const K1 = Math.SQRT2 * wc;
    const K2 = wc * wc;
    const a0 = K2 / (1 + K1 + K2);
    const b1 = 2 * a0 * (1 / K2 - 1);
    const b2 = 1 - (a0 + 2 * a0 + a0 + b1);
    expect(a0).toBeCloseTo(0.09444674, 8);
    expect(b1).toBeCloseTo(0.96264131, 8);
    expect(b2).toBeCloseTo(-0.34042828, 8);
    // Our design, in Winter's sign convention y = a0 x + a1 x1 + a2 x2 + b1 y1 + b2 y2
    const [[c0, c1, c2, , d1, d2]] = butterworthSos(2, correctedCutoff(10, 100), 100);
    expect(c0).toBeCloseTo(a0, 12);
    expect(c1).toBeCloseTo(2 * a0, 12);
    expect(c2).toBeCloseTo(a0, 12);
    expect(-d1).toBeCloseTo(b1, 12);
    expect(-d2).toBeCloseTo(b2, 12);
  });

  it('makes the dual pass -3.01 dB at the requested cutoff', () => {
    // computed with scipy.signal (Debian python3-scipy): corrected dual-pass |H|^2 at 10 Hz = 0.70711
    for (const [fc, fs, order] of [[10, 100, 2], [6, 100, 2], [20, 200, 4]]) {
      const sos = butterworthSos(order, correctedCutoff(fc, fs, 2, order), fs);
      expect(magnitudeAt(sos, fc, fs) ** 2).toBeCloseTo(Math.SQRT1_2, 10);
    }
  });
});

describe('sosfiltfilt(sos, x, padlen)', () => {
  it.each(reference.sosfiltfilt.map((r) => [r.order, r.fc_requested, r.padlen, r] as const))(
    'order %i fc %f padlen %s equals scipy.signal.sosfiltfilt to 1e-9 (scipy sos)',
    (_order, _fc, padlen, r) => {
      // reference: scipy.signal.sosfiltfilt from Debian python3-scipy (tests/fixtures/scipy/reference.json)
      const y = sosfiltfilt(r.sos as Biquad[], x, padlen ?? undefined);
      expect(maxAbsDiff(y, r.y)).toBeLessThan(1e-9);
    },
  );

  it.each(reference.sosfiltfilt.filter((r) => r.padlen === null).map((r) => [r.order, r.fc_requested, r] as const))(
    'zeroLagLowpass order %i, %f Hz equals scipy butter + sosfiltfilt to 1e-9',
    (order, fc, r) => {
      // reference: scipy.signal.butter(order, corrected fc, output='sos') + sosfiltfilt (Debian python3-scipy)
      expect(zeroLagDesign(100, fc, order).designHz).toBeCloseTo(r.fc_design, 12);
      expect(maxAbsDiff(zeroLagLowpass(x, 100, fc, order), r.y)).toBeLessThan(1e-9);
    },
  );

  it('uses scipy default padlen 3 x (2 sections + 1)', () => {
    // scipy.signal.sosfiltfilt docs/source: padlen = 3 * (2 * len(sos) + 1 - min(zeros of b2, zeros of a2))
    expect(defaultPadlen(butterworthSos(2, 10, 100))).toBe(9);
    expect(defaultPadlen(butterworthSos(4, 10, 100))).toBe(15);
    expect(defaultPadlen([[1, 1, 0, 1, 0.5, 0]])).toBe(6);
  });

  it('starts each pass in steady state: a constant passes unchanged', () => {
    // scipy.signal.sosfilt_zi: the steady state of the step response, so a constant has no start-up transient
    const c = new Float64Array(50).fill(123.4);
    expect(maxAbsDiff(zeroLagLowpass(c, 100, 10), c)).toBeLessThan(1e-9);
    expect(maxAbsDiff(sosfiltfilt(butterworthSos(4, 10, 100), c), c)).toBeLessThan(1e-9);
    const sos = butterworthSos(2, 10, 100);
    expect(maxAbsDiff(sosfilt(sos, c, true), c)).toBeLessThan(1e-9);
    expect(sosfiltZi(sos).length).toBe(2);
  });

  it('does not mutate its input, and the same call twice gives the same result', () => {
    const copy = Float64Array.from(x);
    const sos = butterworthSos(2, 10, 100);
    const a = sosfiltfilt(sos, x);
    const b = sosfiltfilt(sos, x);
    expect(x).toEqual(copy);
    expect(a).toEqual(b);
  });

  it('refuses signals not longer than the padding, saying how many samples are needed', () => {
    const sos = butterworthSos(2, 10, 100);
    expect(() => sosfiltfilt(sos, new Float64Array(9))).toThrow(/at least 10/);
    expect(sosfiltfilt(sos, new Float64Array(10)).length).toBe(10);
    expect(() => zeroLagLowpass(new Float64Array(15), 100, 10, 4)).toThrow(/at least 16/);
  });

  it('refuses a cutoff whose corrected design reaches 0.45 fs', () => {
    expect(DEFAULT_CUTOFF_HZ).toBe(20); // 20 Hz is a usual cutoff for ground reaction forces: common practice
    expect(() => zeroLagLowpass(x, 50, 20)).not.toThrow(); // design 20.95 Hz < 22.5 Hz
    expect(() => zeroLagLowpass(x, 100, 40)).not.toThrow(); // design 41.9 Hz < 45 Hz
    expect(() => zeroLagLowpass(x, 100, 44)).toThrow(/0.45 x fs/); // design 45.2 Hz
    expect(() => zeroLagLowpass(x, 40, 20)).toThrow(RangeError);
  });
});
