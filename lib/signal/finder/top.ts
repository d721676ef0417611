// Top: the most trail-ward point of the filtered COP X, found near the last zero crossing of the smoothed velocity
// before the transition. The smoothed derivative's crossing is moved 10-40 ms early where the lead-ward
// acceleration after the turn is much larger than the trail-ward one before it; the filtered COP X itself is
// zero-lag, so its minimum is where the weight actually turns.
import type { DerivedSeries } from '../types';
import type { DetectionParams } from './params';

/** The top sample, or -1 when vx has no turn from <= 0 to > 0 between `lo` and the transition. */
export function findTop(s: DerivedSeries, transition: number, lo: number, p: DetectionParams): number {
  const vx = s.copVx;
  const x = s.copX;
  let k = transition;
  while (k - 1 >= lo && vx[k - 1] > 0) k--;
  if (k - 1 < lo) return -1;
  const w = Math.max(1, Math.round(p.topSearchS * s.sampleRateHz));
  let top = k - 1;
  for (let i = Math.max(0, k - 1 - w); i <= Math.min(transition - 1, k + w); i++) if (x[i] < x[top]) top = i;
  return top;
}
