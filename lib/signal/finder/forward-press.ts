// Forward press: a small shift toward the lead foot that ends right before the takeaway (within pressMaxGapS). Its
// start is the straight-line onset of its lead-ward velocity (onset-line.ts), its size the lead-ward COP X travel
// from its start to its end (where vx stops being lead-ward). Smaller than pressMinMm (sway and noise) is no press.
import type { DerivedSeries } from '../types';
import { moveOnset } from './onset-line';
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
  let first = j;
  while (first - 1 >= lo && vx[first - 1] > 0) first--;
  // the start: the straight-line onset of the press's velocity (slow sway before it is not part of it)
  let peak = first;
  for (let i = first; i <= end; i++) if (vx[i] > vx[peak]) peak = i;
  const onset = moveOnset(vx, peak, first);
  const start = Number.isFinite(onset) ? Math.min(peak, Math.round(onset)) : first;
  const sizeMm = x[end] - x[start];
  return sizeMm >= p.pressMinMm ? { index: start, sizeMm } : null;
}
