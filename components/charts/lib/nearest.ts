// Nearest sample to a time on a strictly increasing time axis (lib/signal/nearest.ts: d3's bisector; ties go to
// the earlier sample).
import { nearestIndex as nearestOnAxis } from '@/lib/signal/nearest';
import type { NumArray } from './types';

export function nearestIndex(time: NumArray, t: number): number {
  return nearestOnAxis(time, t);
}

/** The value at the sample nearest to t (NaN stays NaN: a missing value is not filled for display). */
export function valueAt(time: NumArray, values: NumArray, t: number): number {
  return values[nearestIndex(time, t)];
}
