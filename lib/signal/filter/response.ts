// Frequency response and transfer-function form of a cascade, for checking designs against published values.
import type { Biquad } from './butterworth';

/** |H(e^{j 2 pi f / fs})| of the cascade (single pass). */
export function magnitudeAt(sos: readonly Biquad[], f: number, fs: number): number {
  const w = (2 * Math.PI * f) / fs;
  let mag = 1;
  for (const [b0, b1, b2, a0, a1, a2] of sos) {
    const num = Math.hypot(b0 + b1 * Math.cos(w) + b2 * Math.cos(2 * w), b1 * Math.sin(w) + b2 * Math.sin(2 * w));
    const den = Math.hypot(a0 + a1 * Math.cos(w) + a2 * Math.cos(2 * w), a1 * Math.sin(w) + a2 * Math.sin(2 * w));
    mag *= num / den;
  }
  return mag;
}

/** Expands the sections into one numerator b and denominator a in powers of z^-1 (scipy.signal.sos2tf). */
export function sosToTf(sos: readonly Biquad[]): { b: number[]; a: number[] } {
  let b = [1];
  let a = [1];
  for (const s of sos) {
    b = polyMul(b, s.slice(0, 3));
    a = polyMul(a, s.slice(3, 6));
  }
  return { b, a };
}

function polyMul(p: number[], q: number[]): number[] {
  const out = new Array<number>(p.length + q.length - 1).fill(0);
  p.forEach((pi, i) => q.forEach((qj, j) => (out[i + j] += pi * qj)));
  return out;
}
