// Swing events from the centre-of-pressure (COP) velocity, all on the stance-frame X axis (+ toward the target).
//
// Definitions (sample indexes into a DerivedSeries; seconds are time[index]):
// - top:        the turn of the COP from trail-ward to lead-ward, i.e. the most trail-ward COP X: the last
//               zero crossing of COP X velocity from <= 0 to > 0 before the main lead-ward velocity peak (of the two
//               samples around the crossing, the one with the smaller COP X). The COP turn can come before the
//               club reaches its top (Smith et al. 2017; Ball & Best 2007). The velocity is the smoothed
//               derivative of derive.ts; where the lead-ward acceleration after the turn is much larger than the
//               trail-ward one before it, the smoothing moves the crossing 10-40 ms earlier than the extreme of the
//               unsmoothed COP (seen on our synthetic swings). The turn must lie within maxDownswingS of the peak.
// - transition: the first sample after top where the lead-ward COP X velocity reaches half of its peak: the
//               change of direction is under way (the rising half-peak point of the lead-ward move).
// - impact:     the file's impact marker (first marker sample after top, within maxDownswingS) when the file has an
//               impact column; otherwise the first sample after the velocity peak where the lead-ward COP X velocity
//               has dropped below half of its peak again (the falling half-peak point: the fast shift is over).
//               A file with an impact column but no marker in that window gets the detected impact ('detected').
// - address:    the end of the quiet stance: scanning back from the top (past a pause at the top) through the
//               backswing, the last sample whose COP speed is still below the quiet threshold, counting only
//               still stretches of at least minStillS (shorter dips inside the takeaway are noise).
// - finish:     the first sample after impact from which the COP speed stays below the settle threshold for
//               settleHoldS, with the lead foot carrying at least finishMinLeadPct over that hold.
// Events are strictly ordered address < top < transition < impact < finish; otherwise the candidate is rejected.
import type { DerivedSeries, EventName } from './types';

/**
 * All detection thresholds, in physical units. Values marked (scaled) are given for a 400 mm stance and scaled
 * in proportion to the stance width in use (a wider stance means longer and faster COP travel).
 * Values are common practice / tuned on our own synthetic sessions; none comes from a published standard.
 */
export const DETECTION_DEFAULTS = {
  /** stance width the (scaled) values below are given for, mm */
  referenceStanceWidthMm: 400,
  /** COP speed below which the golfer counts as still, mm/s (quiet stance sway is ~10-20 mm/s) */
  quietSpeedMmS: 40,
  /** a still stretch inside a move shorter than this is noise, not the address, s */
  minStillS: 0.1,
  /** minimum quiet stance before the takeaway, s */
  quietMinS: 0.4,
  /** share of quiet-window samples that must be below quietSpeedMmS (tolerates single noisy samples) */
  quietFraction: 0.9,
  /** lead-foot share during the quiet address, % (address is close to 50/50, common practice) */
  addressLeadPctMin: 30,
  addressLeadPctMax: 70,
  /** total force at address at least this fraction of the recording's median total force */
  loadedFraction: 0.5,
  /** backswing duration limits (address -> top), s; typical 0.7-1.0 s (Grober & Cholewicki) */
  backswingMinS: 0.3,
  backswingMaxS: 2.0,
  /** minimum trail-ward COP X travel from address to top, mm (scaled) */
  minBackswingTravelMm: 20,
  /** minimum peak lead-ward COP X velocity of a downswing, mm/s (scaled); waggles stay far below (~200 mm/s),
   *  walking and stepping exceed it and are told apart by the other checks */
  downswingPeakSpeedMmS: 600,
  /** minimum lead-ward COP X travel from top to the most lead-ward point before the finish, mm (scaled) */
  minDownswingTravelMm: 120,
  /** fraction of the peak lead-ward velocity that marks transition (rising) and detected impact (falling) */
  halfPeakFraction: 0.5,
  /** longest top -> impact, s; typical downswing 0.25-0.3 s (Grober & Cholewicki) */
  maxDownswingS: 0.6,
  /** a foot carrying less than this share of the total between address and impact counts as lifted, % */
  footLiftedPct: 4,
  /** COP speed below which the finish counts as settled, mm/s */
  settleSpeedMmS: 60,
  /** how long the COP must stay settled, s */
  settleHoldS: 0.3,
  /** longest impact -> finish, s */
  maxFollowThroughS: 3.0,
  /** lead-foot share over the finish hold, % (finish is nearly all on the lead foot, common practice) */
  finishMinLeadPct: 60,
  /** context kept before address and after the finish hold in a swing's window, s */
  contextS: 1.0,
} as const;

export type DetectionParams = { -readonly [K in keyof typeof DETECTION_DEFAULTS]: number };

const SCALED = ['minBackswingTravelMm', 'downswingPeakSpeedMmS', 'minDownswingTravelMm'] as const;

/** The defaults (or overrides) with the (scaled) values adjusted to the stance width. */
export function detectionParams(stanceWidthMm: number, overrides: Partial<DetectionParams> = {}): DetectionParams {
  if (!(stanceWidthMm > 0) || !Number.isFinite(stanceWidthMm)) {
    throw new RangeError(`stanceWidthMm must be a positive number, got ${stanceWidthMm}`);
  }
  const p: DetectionParams = { ...DETECTION_DEFAULTS, ...overrides };
  for (const [k, v] of Object.entries(p)) {
    if (!Number.isFinite(v) || v < 0) throw new RangeError(`detection parameter ${k} must be a finite number >= 0, got ${v}`);
  }
  const scale = stanceWidthMm / p.referenceStanceWidthMm;
  for (const k of SCALED) if (overrides[k] === undefined) p[k] *= scale;
  return p;
}

export type RejectReason =
  | 'no-turn'
  | 'no-backswing'
  | 'backswing-too-short'
  | 'backswing-too-long'
  | 'no-quiet-address'
  | 'not-loaded'
  | 'address-not-balanced'
  | 'backswing-too-small'
  | 'downswing-too-long'
  | 'foot-lifted'
  | 'no-settled-finish'
  | 'finish-not-on-lead-side'
  | 'downswing-too-small'
  | 'events-out-of-order'
  | 'inside-previous-swing';

/** One line per rejection reason, for logs and the UI. */
export const REJECT_REASONS: Record<RejectReason, string> = {
  'no-turn': 'no trail-to-lead turn of the COP before the fast lead-ward move',
  'no-backswing': 'no trail-ward COP move before the turn',
  'backswing-too-short': 'backswing shorter than the minimum',
  'backswing-too-long': 'no quiet stance within the longest backswing before the turn',
  'no-quiet-address': 'the golfer was not still long enough before the takeaway',
  'not-loaded': 'too little total force during the address (insoles unloaded)',
  'address-not-balanced': 'the weight was not shared between the feet at address',
  'backswing-too-small': 'the COP moved too little toward the trail foot in the backswing',
  'downswing-too-long': 'too long from the top to impact',
  'foot-lifted': 'a foot was lifted between address and impact (a step or walking)',
  'no-settled-finish': 'the COP did not settle after impact',
  'finish-not-on-lead-side': 'the finish was not held on the lead foot',
  'downswing-too-small': 'the COP moved too little toward the lead foot',
  'events-out-of-order': 'the events would not be in order address < top < transition < impact < finish',
  'inside-previous-swing': 'part of a swing already found',
};

export type EventIndexes = Record<EventName, number>;

export type EventDetection =
  | { ok: true; events: EventIndexes; impactSource: 'marker' | 'detected'; start: number; end: number }
  | { ok: false; reason: RejectReason; start: number; end: number };

export interface EventContext {
  params: DetectionParams;
  /** impact marker on the series' sample grid, or null when the file has no impact column */
  impact: Uint8Array | null;
  /** the total force (N) an address must at least carry */
  loadedN: number;
}

/** Events of the swing whose main lead-ward COP X velocity peak is at sample `peak`. */
export function detectSwingEvents(s: DerivedSeries, peak: number, ctx: EventContext): EventDetection {
  const { params: p, impact: marker, loadedN } = ctx;
  const fs = s.sampleRateHz;
  const n = s.time.length;
  const vx = s.copVx;
  const x = s.copX;
  const speed = s.copSpeed;
  const lead = s.leadPct;
  const ctxN = Math.round(p.contextS * fs);
  let start = Math.max(0, peak - Math.round(p.backswingMaxS * fs));
  let end = Math.min(n - 1, peak + Math.round((p.maxFollowThroughS + p.settleHoldS) * fs));
  const reject = (reason: RejectReason): EventDetection => ({ ok: false, reason, start, end });

  const vPeak = vx[peak];
  const half = vPeak * p.halfPeakFraction;
  const lo = Math.max(0, peak - Math.round(p.maxDownswingS * fs));

  let transition = peak;
  while (transition - 1 >= lo && vx[transition - 1] >= half) transition--;
  let fall = peak;
  while (fall + 1 < n && vx[fall + 1] >= half) fall++;
  const impactDetected = fall + 1;
  if (impactDetected >= n) return reject('no-settled-finish');

  let k = transition;
  while (k - 1 >= lo && vx[k - 1] > 0) k--;
  if (k - 1 < lo) return reject('no-turn');
  const top = x[k - 1] <= x[k] ? k - 1 : k;

  const bLo = Math.max(0, top - Math.round(p.backswingMaxS * fs));
  // back from the top: past a pause at the top, then through the backswing to the last still stretch;
  // stillness shorter than minStillS inside the move is noise
  let i = top;
  while (i >= bLo && speed[i] < p.quietSpeedMmS) i--;
  const stillN = Math.max(1, Math.round(p.minStillS * fs));
  let address = -1;
  for (let still = 0; i >= bLo; i--) {
    still = speed[i] < p.quietSpeedMmS ? still + 1 : 0;
    if (still === stillN) {
      address = i + stillN - 1;
      break;
    }
  }
  if (address < 0) return reject('backswing-too-long');
  let vMin = 0;
  for (let j = address; j <= top; j++) if (vx[j] < vMin) vMin = vx[j];
  if (!(vMin < -p.quietSpeedMmS)) return reject('no-backswing');
  start = Math.max(0, address - ctxN);
  const backswingS = (top - address) / fs;
  if (backswingS < p.backswingMinS) return reject('backswing-too-short');
  if (backswingS > p.backswingMaxS) return reject('backswing-too-long');

  const quietN = Math.round(p.quietMinS * fs);
  const qa = address - quietN;
  if (qa < 0) return reject('no-quiet-address');
  let quiet = 0;
  let loaded = true;
  let balanced = true;
  for (let i = qa; i <= address; i++) {
    if (speed[i] < p.quietSpeedMmS) quiet++;
    if (!(s.totalN[i] >= loadedN)) loaded = false;
    if (!(lead[i] >= p.addressLeadPctMin && lead[i] <= p.addressLeadPctMax)) balanced = false;
  }
  if (quiet < p.quietFraction * (quietN + 1)) return reject('no-quiet-address');
  if (!loaded) return reject('not-loaded');
  if (!balanced) return reject('address-not-balanced');
  if (x[address] - x[top] < p.minBackswingTravelMm) return reject('backswing-too-small');

  let impact = impactDetected;
  let impactSource: 'marker' | 'detected' = 'detected';
  if (marker) {
    const mHi = Math.min(n - 1, top + Math.round(p.maxDownswingS * fs));
    for (let i = top + 1; i <= mHi; i++) {
      if (marker[i]) {
        impact = i;
        impactSource = 'marker';
        break;
      }
    }
  }
  if ((impact - top) / fs > p.maxDownswingS) return reject('downswing-too-long');

  for (let i = address; i <= impact; i++) {
    if (!(lead[i] >= p.footLiftedPct && lead[i] <= 100 - p.footLiftedPct)) return reject('foot-lifted');
  }

  const holdN = Math.max(1, Math.round(p.settleHoldS * fs));
  const fLast = Math.min(n - 1, impact + Math.round((p.maxFollowThroughS + p.settleHoldS) * fs));
  let finish = -1;
  let run = 0;
  for (let i = impact + 1; i <= fLast; i++) {
    run = speed[i] < p.settleSpeedMmS ? run + 1 : 0;
    if (run === holdN) {
      finish = i - holdN + 1;
      break;
    }
  }
  if (finish < 0 || (finish - impact) / fs > p.maxFollowThroughS) return reject('no-settled-finish');
  end = Math.min(n - 1, finish + holdN + ctxN);
  let leadSum = 0;
  for (let i = finish; i < finish + holdN; i++) leadSum += lead[i];
  if (!(leadSum / holdN >= p.finishMinLeadPct)) return reject('finish-not-on-lead-side');

  let xMax = -Infinity;
  for (let i = top; i <= finish; i++) if (x[i] > xMax) xMax = x[i];
  if (xMax - x[top] < p.minDownswingTravelMm) return reject('downswing-too-small');

  if (!(address < top && top < transition && transition < impact && impact < finish)) {
    return reject('events-out-of-order');
  }
  return { ok: true, events: { address, top, transition, impact, finish }, impactSource, start, end };
}
