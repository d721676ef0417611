// Index lookups on a sorted time axis, built on d3's bisector (one binary search for the whole code base).
import { bisector } from 'd3-array';

const byValue = bisector((v: number) => v);

/** Nearest sample to t on a sorted time axis; ties go to the earlier sample; t outside the axis clamps to an end. */
export function nearestIndex(time: ArrayLike<number>, t: number): number {
  const n = time.length;
  if (n === 0) throw new RangeError('nearestIndex needs at least one sample');
  if (!Number.isFinite(t)) throw new RangeError(`time must be a finite number, got ${t}`);
  const hi = byValue.left(time, t); // first index with time[hi] >= t
  if (hi <= 0) return 0;
  if (hi >= n) return n - 1;
  const lo = hi - 1;
  return t - time[lo] <= time[hi] - t ? lo : hi;
}

/** The segment [lo, lo + 1] holding t (time[lo] <= t < time[lo + 1]), clamped to the first and last segments. */
export function segmentIndex(xs: ArrayLike<number>, x: number): number {
  const n = xs.length;
  if (n < 2) throw new RangeError('segmentIndex needs at least two points');
  return Math.min(n - 2, Math.max(0, byValue.right(xs, x) - 1));
}
