// Top: the turn of the weight from the trail side toward the lead side, i.e. the most trail-ward point of the
// filtered COP X. Just before the turn the COP is nearly at rest (the backswing slows down), just after it the
// lead-ward move accelerates hard; so the minimum itself lies on a flat stretch where noise decides the sample, and
// the smoothed derivative's zero crossing comes 10-40 ms early. The turn is found where the lead-ward move starts:
// the straight-line onset (onset-line.ts) of the velocity of the filtered COP X (symmetric differences over
// +/- 20 ms; the 20 Hz zero-lag filter keeps the flank sharp), near the smoothed derivative's last zero crossing before the transition.
import type { DerivedSeries } from '../types';
import { moveOnset } from './onset-line';
import type { DetectionParams } from './params';

const VELOCITY_SPAN_S = 0.02;

/** The top sample, or -1 when vx has no turn from <= 0 to > 0 between `lo` and the transition. */
export function findTop(s: DerivedSeries, transition: number, lo: number, p: DetectionParams): number {
  const vx = s.copVx;
  const x = s.copX;
  const fs = s.sampleRateHz;
  const n = x.length;
  let k = transition;
  while (k - 1 >= lo && vx[k - 1] > 0) k--;
  if (k - 1 < lo) return -1;
  const w = Math.max(2, Math.round(p.topSearchS * fs));
  // velocity of the filtered COP X from the crossing's neighbourhood up to past the transition
  // (a symmetric difference over +/- VELOCITY_SPAN_S: short enough to keep the flank's straight part, long
  // enough to average sensor noise at low body weight)
  const h = Math.max(1, Math.round(VELOCITY_SPAN_S * fs));
  const a = Math.max(h, k - 1 - w);
  const b = Math.min(n - 1 - h, transition + 2 * w);
  const v = new Float64Array(b - a + 1);
  for (let i = a; i <= b; i++) v[i - a] = ((x[i + h] - x[i - h]) * fs) / (2 * h);
  let peak = 0;
  for (let i = 1; i < v.length; i++) if (v[i] > v[peak]) peak = i;
  const onset = moveOnset(v, peak, 0);
  if (!Number.isFinite(onset)) {
    // no clean flank: the most trail-ward filtered COP X around the crossing
    let top = k - 1;
    for (let i = Math.max(lo, k - 1 - w); i <= Math.min(transition - 1, k + w); i++) if (x[i] < x[top]) top = i;
    return top;
  }
  return Math.max(lo, Math.min(transition - 1, Math.round(onset) + a));
}
