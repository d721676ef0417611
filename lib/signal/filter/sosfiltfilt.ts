// Second-order-section filtering as scipy.signal does it: sosfilt (direct form II transposed), sosfilt_zi and
// sosfiltfilt with odd extension padding. Typed-array loops, no allocation per sample.
import type { Biquad } from './butterworth';

function checkSos(sos: readonly Biquad[]): void {
  if (sos.length === 0) throw new RangeError('sos needs at least one section');
  for (const s of sos) {
    if (s.length !== 6 || s[3] !== 1 || !s.every(Number.isFinite)) {
      throw new RangeError('each sos section must be [b0, b1, b2, 1, a1, a2] with finite numbers');
    }
  }
}

/** Steady-state initial conditions for a unit step, one [z0, z1] per section (scipy.signal.sosfilt_zi). */
export function sosfiltZi(sos: readonly Biquad[]): Float64Array {
  checkSos(sos);
  const zi = new Float64Array(sos.length * 2);
  let scale = 1;
  sos.forEach(([b0, b1, b2, , a1, a2], i) => {
    // lfilter_zi for a biquad: solve (I - A^T) z = b[1:] - a[1:] b0 with the companion matrix A of a.
    const r0 = b1 - a1 * b0;
    const r1 = b2 - a2 * b0;
    const z0 = (r0 + r1) / (1 + a1 + a2);
    zi[2 * i] = scale * z0;
    zi[2 * i + 1] = scale * (r1 - a2 * z0);
    scale *= (b0 + b1 + b2) / (1 + a1 + a2); // this section's gain at 0 Hz
  });
  return zi;
}

/** One biquad over `y` in place, forward or backward, continuing from the state in z = [z0, z1] (updated). */
function biquadInPlace(s: Biquad, y: Float64Array, z: Float64Array, backward: boolean): void {
  const b0 = s[0];
  const b1 = s[1];
  const b2 = s[2];
  const a1 = s[4];
  const a2 = s[5];
  let z0 = z[0];
  let z1 = z[1];
  const n = y.length;
  if (!backward) {
    for (let i = 0; i < n; i++) {
      const x = y[i];
      const out = b0 * x + z0;
      z0 = b1 * x - a1 * out + z1;
      z1 = b2 * x - a2 * out;
      y[i] = out;
    }
  } else {
    for (let i = n - 1; i >= 0; i--) {
      const x = y[i];
      const out = b0 * x + z0;
      z0 = b1 * x - a1 * out + z1;
      z1 = b2 * x - a2 * out;
      y[i] = out;
    }
  }
  z[0] = z0;
  z[1] = z1;
}

/**
 * Filters the concatenation of `segments` in place through every section, each section started from zi x the
 * first input value (the first sample of the first segment, or the last of the last when backward). Section by
 * section over the whole sequence gives the same numbers as sample by sample.
 */
function runInPlace(sos: readonly Biquad[], segments: Float64Array[], zi: Float64Array, backward: boolean): void {
  const order = backward ? segments.slice().reverse() : segments;
  const firstSeg = order.find((s) => s.length > 0);
  if (!firstSeg) return;
  const x0 = backward ? firstSeg[firstSeg.length - 1] : firstSeg[0];
  const z = new Float64Array(2);
  for (let s = 0; s < sos.length; s++) {
    z[0] = zi[2 * s] * x0;
    z[1] = zi[2 * s + 1] * x0;
    for (const seg of order) biquadInPlace(sos[s], seg, z, backward);
  }
}

/** scipy.signal.sosfilt(sos, x) with zero initial state (or zi x x[0] when `steadyStart`). Returns a new array. */
export function sosfilt(sos: readonly Biquad[], x: Float64Array, steadyStart = false): Float64Array {
  checkSos(sos);
  const y = x.slice();
  runInPlace(sos, [y], steadyStart ? sosfiltZi(sos) : new Float64Array(sos.length * 2), false);
  return y;
}

/** scipy's default padlen for sosfiltfilt: 3 x (2 sections + 1 - sections whose b2 and a2 are both zero, counted as min). */
export function defaultPadlen(sos: readonly Biquad[]): number {
  const zb = sos.filter((s) => s[2] === 0).length;
  const za = sos.filter((s) => s[5] === 0).length;
  return 3 * (2 * sos.length + 1 - Math.min(zb, za));
}

/**
 * Zero-phase filtering, forward then backward, as scipy.signal.sosfiltfilt(sos, x, padtype='odd', padlen):
 * the signal is extended at each end by `padlen` samples of odd reflection (2 x[0] - x[k]), each pass starts from
 * sosfilt_zi scaled by its first value, and the padding is cut off again. Needs x.length > padlen.
 * The result goes into `out` when given (x.length values, may be x itself; a caller filtering many channels reuses
 * one buffer instead of allocating one per channel), else into a new array.
 */
export function sosfiltfilt(sos: readonly Biquad[], x: Float64Array, padlen?: number, out?: Float64Array): Float64Array {
  checkSos(sos);
  const edge = padlen ?? defaultPadlen(sos);
  if (!Number.isInteger(edge) || edge < 0) throw new RangeError(`padlen must be a non-negative integer, got ${padlen}`);
  const n = x.length;
  if (n <= edge) {
    throw new RangeError(`the signal has ${n} samples; this filter pads ${edge} at each end and needs at least ${edge + 1}`);
  }
  // Odd extension kept in two small buffers around the output, so the only n-sized allocation is the result.
  const left = new Float64Array(edge);
  const right = new Float64Array(edge);
  const first = x[0];
  const last = x[n - 1];
  for (let i = 0; i < edge; i++) {
    left[i] = 2 * first - x[edge - i];
    right[i] = 2 * last - x[n - 2 - i];
  }
  if (out && out.length !== n) throw new RangeError(`out has ${out.length} values, x ${n}`);
  let y: Float64Array;
  if (!out) y = x.slice();
  else {
    if (out !== x) out.set(x);
    y = out;
  }
  const zi = sosfiltZi(sos);
  runInPlace(sos, [left, y, right], zi, false);
  runInPlace(sos, [left, y, right], zi, true);
  return y;
}
