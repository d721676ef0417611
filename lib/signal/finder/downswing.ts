// Transition and impact: the half-peak points of the lead-ward COP X velocity around its peak, and the file's
// impact marker when it has one.
import type { DerivedSeries } from '../types';
import type { DetectionParams } from './params';

/** Rising half-peak: the earliest sample (not before `lo`) from which vx stays >= half the peak up to the peak. */
export function findTransition(vx: Float64Array, peak: number, lo: number, p: DetectionParams): number {
  const half = vx[peak] * p.halfPeakFraction;
  let i = peak;
  while (i - 1 >= lo && vx[i - 1] >= half) i--;
  return i;
}

/** Falling half-peak: the first sample after the peak where vx is below half the peak again (n when never). */
export function findDetectedImpact(vx: Float64Array, peak: number, p: DetectionParams): number {
  const half = vx[peak] * p.halfPeakFraction;
  let i = peak;
  while (i + 1 < vx.length && vx[i + 1] >= half) i++;
  return i + 1;
}

/** The first marker sample after the top, within maxDownswingS; -1 when there is none. */
export function findMarkedImpact(marker: Uint8Array, top: number, s: DerivedSeries, p: DetectionParams): number {
  const hi = Math.min(marker.length - 1, top + Math.round(p.maxDownswingS * s.sampleRateHz));
  for (let i = top + 1; i <= hi; i++) if (marker[i]) return i;
  return -1;
}
