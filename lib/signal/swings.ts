// Finding swings in a continuous recording. A candidate is every run of fast lead-ward COP X velocity
// (above downswingPeakSpeedMmS); each is checked for the shape of a real swing by detectSwingEvents:
// quiet, balanced, loaded address -> trail-ward backswing -> turn -> fast lead-ward move -> settled finish
// on the lead foot, with no foot lifted in between. Walking, stepping, re-teeing, waggles and a lifted foot
// fail one of those checks; every rejected candidate keeps its reason.
import { detectOnset } from './onset';
import { detectSwingEvents, detectionParams, type DetectionParams, type EventIndexes, type RejectReason } from './events';
import type { DerivedSeries } from './types';

export interface SwingCandidate {
  /** sample window (inclusive) of the candidate: the swing with context when accepted */
  start: number;
  end: number;
  /** sample of the peak lead-ward COP X velocity that made it a candidate */
  peak: number;
  accepted: boolean;
  reason: RejectReason | null;
}

export interface DetectedSwing {
  start: number;
  end: number;
  peak: number;
  events: EventIndexes;
  impactSource: 'marker' | 'detected';
}

export interface FindSwingsOptions {
  stanceWidthMm: number;
  /** impact marker on the series' grid (UniformRecording.impact), or null */
  impact?: Uint8Array | null;
  params?: Partial<DetectionParams>;
}

/** Median of the finite values, from at most ~20 000 evenly strided samples (plenty for a load threshold). */
function median(v: Float64Array): number {
  const stride = Math.max(1, Math.floor(v.length / 20_000));
  const picked = new Float64Array(Math.ceil(v.length / stride));
  let m = 0;
  for (let i = 0; i < v.length; i += stride) if (Number.isFinite(v[i])) picked[m++] = v[i];
  if (m === 0) return NaN;
  const sorted = picked.subarray(0, m).sort();
  return sorted[m >> 1];
}

export function findSwings(s: DerivedSeries, opts: FindSwingsOptions): { swings: DetectedSwing[]; candidates: SwingCandidate[] } {
  const params = detectionParams(opts.stanceWidthMm, opts.params);
  const n = s.time.length;
  const impact = opts.impact ?? null;
  if (impact && impact.length !== n) throw new RangeError(`impact has ${impact.length} samples, the series ${n}`);
  if (!(s.sampleRateHz > 0)) throw new RangeError(`sampleRateHz must be positive, got ${s.sampleRateHz}`);
  const loadedN = params.loadedFraction * median(s.totalN);
  const fs = s.sampleRateHz;
  // bridge dips of up to 30 ms so noise does not split one lead-ward move into two candidates
  const runs = detectOnset(s.copVx, params.downswingPeakSpeedMmS, { nAbove: 2, nBelow: Math.round(0.03 * fs) });

  const swings: DetectedSwing[] = [];
  const candidates: SwingCandidate[] = [];
  let lastFinish = -1;
  for (const [a, b] of runs) {
    let peak = a;
    for (let i = a + 1; i <= b; i++) if (s.copVx[i] > s.copVx[peak]) peak = i;
    if (peak <= lastFinish) {
      candidates.push({ start: a, end: b, peak, accepted: false, reason: 'inside-previous-swing' });
      continue;
    }
    const d = detectSwingEvents(s, peak, { params, impact, loadedN });
    if (d.ok && swings.length > 0 && d.events.address <= lastFinish) {
      candidates.push({ start: d.start, end: d.end, peak, accepted: false, reason: 'inside-previous-swing' });
      continue;
    }
    if (!d.ok) {
      candidates.push({ start: d.start, end: d.end, peak, accepted: false, reason: d.reason });
      continue;
    }
    candidates.push({ start: d.start, end: d.end, peak, accepted: true, reason: null });
    swings.push({ start: d.start, end: d.end, peak, events: d.events, impactSource: d.impactSource });
    lastFinish = d.events.finish;
  }
  return { swings, candidates };
}
