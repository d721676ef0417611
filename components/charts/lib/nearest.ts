// Nearest sample to a time on a strictly increasing time axis (binary search; ties go to the earlier sample).
import type { NumArray } from './types';

export function nearestIndex(time: NumArray, t: number): number {
  const n = time.length;
  if (n === 0) throw new RangeError('nearestIndex needs at least one sample');
  if (!Number.isFinite(t)) throw new RangeError(`time must be a finite number, got ${t}`);
  if (t <= time[0]) return 0;
  if (t >= time[n - 1]) return n - 1;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (time[mid] <= t) lo = mid;
    else hi = mid;
  }
  return t - time[lo] <= time[hi] - t ? lo : hi;
}

/** The value at the sample nearest to t (NaN stays NaN: a missing value is not filled for display). */
export function valueAt(time: NumArray, values: NumArray, t: number): number {
  return values[nearestIndex(time, t)];
}
