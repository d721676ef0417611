// Finding swings in a continuous recording. A candidate is every run of fast lead-ward COP X velocity
// (above downswingPeakSpeedMmS); each is checked for the shape of a real swing by detectSwingEvents:
// still, balanced, loaded address -> trail-ward backswing -> turn -> fast lead-ward move -> settled finish
// on the lead foot, with no foot lifted in between. Walking, stepping, re-teeing, waggles and a lifted foot
// fail one of those checks; every rejected candidate keeps its reason. The stillness thresholds come from the
// recording's own noise floor (finder/noise.ts). A swing whose lead-ward travel is clearly smaller than the
// golfer's own full swings in the file (or, without any, than a share of the stance width) is flagged partial.
import {
  detectionParams,
  detectSwingEvents,
  placeEvents,
  stillnessThresholds,
  type DetectionParams,
  type EventContext,
  type EventIndexes,
  type ForwardPress,
  type RejectReason,
} from './events';
import { detectOnset } from './onset';
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
  forwardPress: ForwardPress | null;
  /** lead-ward COP X travel from the top to its furthest point before the finish, mm */
  downswingTravelMm: number;
  partial: boolean;
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

function contextOf(s: DerivedSeries, opts: FindSwingsOptions): EventContext {
  const params = detectionParams(opts.stanceWidthMm, opts.params);
  const n = s.time.length;
  const impact = opts.impact ?? null;
  if (impact && impact.length !== n) throw new RangeError(`impact has ${impact.length} samples, the series ${n}`);
  if (!(s.sampleRateHz > 0)) throw new RangeError(`sampleRateHz must be positive, got ${s.sampleRateHz}`);
  const { quietMmS, settleMmS } = stillnessThresholds(s.copSpeed, s.sampleRateHz, params);
  return { params, impact, loadedN: params.loadedFraction * median(s.totalN), quietMmS, settleMmS };
}

/** Flags partial swings: lead-ward travel below partialTravelFraction of the file's full travel. */
function flagPartial(swings: DetectedSwing[], stanceWidthMm: number, p: DetectionParams): void {
  const fullMin = p.fullTravelOfStance * stanceWidthMm;
  const full = swings.map((w) => w.downswingTravelMm).filter((t) => t >= fullMin).sort((a, b) => a - b);
  const limit = full.length ? p.partialTravelFraction * full[full.length >> 1] : fullMin;
  for (const w of swings) w.partial = w.downswingTravelMm < limit;
}

export function findSwings(s: DerivedSeries, opts: FindSwingsOptions): { swings: DetectedSwing[]; candidates: SwingCandidate[] } {
  const ctx = contextOf(s, opts);
  const params = ctx.params;
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
    const d = detectSwingEvents(s, peak, ctx);
    if (d.ok && swings.length > 0 && d.events.address <= lastFinish) {
      candidates.push({ start: d.start, end: d.end, peak, accepted: false, reason: 'inside-previous-swing' });
      continue;
    }
    if (!d.ok) {
      candidates.push({ start: d.start, end: d.end, peak, accepted: false, reason: d.reason });
      continue;
    }
    candidates.push({ start: d.start, end: d.end, peak, accepted: true, reason: null });
    swings.push({
      start: d.start,
      end: d.end,
      peak,
      events: d.events,
      impactSource: d.impactSource,
      forwardPress: d.forwardPress,
      downswingTravelMm: d.downswingTravelMm,
      partial: false,
    });
    lastFinish = d.events.finish;
  }
  flagPartial(swings, opts.stanceWidthMm, params);
  return { swings, candidates };
}

/**
 * A swing a coach asked for at sample `at` (a rejected candidate): event detection with relaxed checks at the
 * fastest lead-ward sample within 0.5 s of `at`; failing that, events placed for the coach to adjust (`placed`).
 */
export function promoteSwing(s: DerivedSeries, at: number, opts: FindSwingsOptions): DetectedSwing & { placed: boolean } {
  const n = s.time.length;
  if (!(Number.isInteger(at) && at >= 0 && at < n)) throw new RangeError(`sample ${at} is outside the recording (0..${n - 1})`);
  const ctx = { ...contextOf(s, opts), relaxed: true };
  const p = ctx.params;
  const w = Math.round(0.5 * s.sampleRateHz);
  let peak = at;
  for (let i = Math.max(0, at - w); i <= Math.min(n - 1, at + w); i++) if (s.copVx[i] > s.copVx[peak]) peak = i;
  const d = detectSwingEvents(s, peak, ctx);
  const ctxN = Math.round(p.contextS * s.sampleRateHz);
  if (d.ok) {
    return { start: d.start, end: d.end, peak, events: d.events, impactSource: d.impactSource, forwardPress: d.forwardPress, downswingTravelMm: d.downswingTravelMm, partial: false, placed: false };
  }
  const events = placeEvents(s, at, p);
  let xMax = -Infinity;
  for (let i = events.top; i <= events.finish; i++) if (s.copX[i] > xMax) xMax = s.copX[i];
  return {
    start: Math.max(0, events.address - ctxN),
    end: Math.min(n - 1, events.finish + ctxN),
    peak,
    events,
    impactSource: 'detected',
    forwardPress: null,
    downswingTravelMm: xMax - s.copX[events.top],
    partial: false,
    placed: true,
  };
}
