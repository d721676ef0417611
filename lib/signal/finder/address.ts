// Address: the start of the takeaway, i.e. the first sample of the sustained trail-ward COP X move that leads to the
// top. Back from the top: past a pause at the top (|vx| below half the quiet threshold, at most topPauseMaxS), through
// the move while vx is trail-ward faster than half the quiet threshold (bridging short noisy dips); the start is the
// straight-line onset of the move's velocity (onset-line.ts: the line through the 25 % and 50 % points of its peak
// speed, extended to zero), at most takeawayOnsetMaxS before the crossing and never before a lead-ward sample (a
// forward press ends where the takeaway starts).
// The still address: a still moment of at least quietMinS (quietFraction of its samples below the quiet threshold)
// ending within preShotS before the takeaway: waggles and presses in that last second belong to the set-up.
import type { DerivedSeries } from '../types';
import { moveOnset } from './onset-line';
import type { DetectionParams } from './params';

/** The takeaway sample, or -1 when no trail-ward move precedes the top within backswingMaxS. */
export function findTakeaway(s: DerivedSeries, top: number, quietMmS: number, p: DetectionParams): number {
  const vx = s.copVx;
  const fs = s.sampleRateHz;
  const lo = Math.max(0, top - Math.round(p.backswingMaxS * fs));
  const theta = quietMmS / 2;
  // past the pause: back to the latest sample that ends a run of >= 50 ms trail-ward faster than theta (single
  // noisy samples near the top are not the backswing)
  const runN = Math.max(2, Math.round(0.05 * fs));
  const pauseLo = Math.max(lo + runN, top - Math.round(p.topPauseMaxS * fs));
  let i = top;
  for (let run = 0; ; i--) {
    if (i < pauseLo - runN) return -1;
    run = vx[i] < -theta ? run + 1 : 0;
    if (run === runN) {
      i += runN - 1;
      break;
    }
  }
  // through the move; dips of up to takeawayGapS (noise on a slow part, even a noisy lead-ward sample) are bridged
  const gapN = Math.max(1, Math.round(p.takeawayGapS * fs));
  for (let j = i - 1, quiet = 0; j >= lo; j--) {
    if (vx[j] < -theta) {
      i = j;
      quiet = 0;
    } else if (++quiet > gapN) break;
  }
  if (i - 1 < lo) return -1; // still moving at the edge of the search: no start found
  // the start: the straight-line onset of the move's velocity (onset-line.ts), not before the last lead-ward
  // sample (a forward press ends where the takeaway starts) and at most takeawayOnsetMaxS before the crossing
  let peak = i;
  for (let j = i; j <= top; j++) if (vx[j] < vx[peak]) peak = j;
  const onsetLo = Math.max(lo, i - Math.round(p.takeawayOnsetMaxS * fs));
  let floorIdx = onsetLo;
  for (let j = i; j >= onsetLo; j--) {
    if (vx[j] > theta) {
      floorIdx = j + 1;
      break;
    }
  }
  const t0 = moveOnset(vx, peak, floorIdx);
  return Number.isFinite(t0) ? Math.min(i, Math.round(t0)) : i;
}

/** The latest still moment [from, to] ending within preShotS before the takeaway, or null. */
export function findStillAddress(s: DerivedSeries, takeaway: number, quietMmS: number, p: DetectionParams): { from: number; to: number } | null {
  const fs = s.sampleRateHz;
  const q = Math.max(2, Math.round(p.quietMinS * fs));
  const need = Math.ceil(p.quietFraction * q);
  const lastEnd = takeaway;
  const firstEnd = takeaway - Math.round(p.preShotS * fs);
  if (firstEnd - q + 1 < 0) return null;
  const speed = s.copSpeed;
  // sliding count of still samples in (end - q, end], moved from the latest end back
  let count = 0;
  for (let i = lastEnd - q + 1; i <= lastEnd; i++) if (speed[i] < quietMmS) count++;
  for (let end = lastEnd; end >= firstEnd; end--) {
    if (count >= need) return { from: end - q + 1, to: end };
    if (speed[end] < quietMmS) count--;
    const enter = end - q;
    if (enter < 0) break;
    if (speed[enter] < quietMmS) count++;
  }
  return null;
}
