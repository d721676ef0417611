// Butterworth low-pass design (coefficients from fili) and the cutoff correction for multiple passes.
import Fili from 'fili';

/** One second-order section in scipy's `sos` row convention: [b0, b1, b2, a0 = 1, a1, a2]. */
export type Biquad = [number, number, number, number, number, number];

function checkRate(cutoffHz: number, fs: number): void {
  if (!(Number.isFinite(fs) && fs > 0)) throw new RangeError(`sample rate must be a positive number, got ${fs}`);
  if (!(Number.isFinite(cutoffHz) && cutoffHz > 0 && cutoffHz < fs / 2)) {
    throw new RangeError(`cutoff must be between 0 and fs/2 = ${fs / 2} Hz, got ${cutoffHz}`);
  }
}

/**
 * Digital Butterworth low-pass of `order` (even: 2, 4, 6, ...) as second-order sections, like
 * scipy.signal.butter(order, cutoffHz, fs=fs, output='sos') up to how the gain is spread over the sections
 * (here every section has unit gain at 0 Hz). Odd orders would need a first-order section, which fili's cascade
 * designer does not produce, so they are refused.
 */
export function butterworthSos(order: number, cutoffHz: number, fs: number): Biquad[] {
  if (!Number.isInteger(order) || order < 2 || order % 2 !== 0 || order > 16) {
    throw new RangeError(`filter order must be an even integer from 2 to 16 (odd orders are unsupported), got ${order}`);
  }
  checkRate(cutoffHz, fs);
  // fili's `order` counts biquad stages: filter order = 2 x stages.
  const stages = new Fili.CalcCascades().lowpass({ order: order / 2, characteristic: 'butterworth', Fs: fs, Fc: cutoffHz });
  return stages.map((s) => {
    const k = s.k ?? 1;
    return [s.b[0] * k, s.b[1] * k, s.b[2] * k, 1, s.a[0], s.a[1]];
  });
}

/**
 * Cutoff to design a Butterworth of `order` with, so that `passes` passes together are -3.01 dB at fcRequested.
 * C = (2^(1/passes) - 1)^(1/(2 order)) (for order 2, passes 2: C = 0.80224), applied to the warped frequency:
 * Un = tan(pi fc / fs) / C, design cutoff = fs / pi * atan(Un) (Winter, Biomechanics and Motor Control of Human
 * Movement 4th ed. p. 69; Robertson et al., Research Methods in Biomechanics 2nd ed. p. 288).
 */
export function correctedCutoff(fcRequested: number, fs: number, passes = 2, order = 2): number {
  checkRate(fcRequested, fs);
  if (!Number.isInteger(passes) || passes < 1) throw new RangeError(`passes must be a positive integer, got ${passes}`);
  if (!Number.isInteger(order) || order < 1) throw new RangeError(`order must be a positive integer, got ${order}`);
  const c = Math.pow(Math.pow(2, 1 / passes) - 1, 1 / (2 * order));
  const un = Math.tan((Math.PI * fcRequested) / fs) / c;
  return (fs / Math.PI) * Math.atan(un);
}
