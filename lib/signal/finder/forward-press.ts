// Forward press: a small shift toward the lead foot that ends right before the takeaway (within pressMaxGapS). Its
// start is where the lead-ward velocity began (vx > 0 backwards from its last fast sample), its size the lead-ward
// COP X travel from its start to its end. Smaller than pressMinMm (sway and noise) is no press.
import type { DerivedSeries } from '../types';
import type { DetectionParams } from './params';

export interface ForwardPress {
  /** sample where the press starts */
  index: number;
  /** lead-ward COP X travel, mm */
  sizeMm: number;
}

export function findForwardPress(s: DerivedSeries, takeaway: number, p: DetectionParams): ForwardPress | null {
  const vx = s.copVx;
  const x = s.copX;
  const fs = s.sampleRateHz;
  const lo = Math.max(0, takeaway - Math.round(p.preShotS * fs));
  let j = takeaway - 1;
  const gapLo = Math.max(lo, takeaway - Math.round(p.pressMaxGapS * fs));
  while (j >= gapLo && !(vx[j] > p.pressSpeedMmS)) j--;
  if (j < gapLo) return null;
  let end = j;
  while (end + 1 <= takeaway && vx[end + 1] > 0) end++;
  let start = j;
  while (start - 1 >= lo && vx[start - 1] > 0) start--;
  const sizeMm = x[end] - x[start];
  return sizeMm >= p.pressMinMm ? { index: start, sizeMm } : null;
}
