// Thresholds of the swing finder, in physical units, and the rejection reasons.
import type { EventName } from '../types';

/**
 * All detection thresholds, in physical units. Values marked (scaled) are given for a 400 mm stance and scaled
 * in proportion to the stance width in use (a wider stance means longer and faster COP travel).
 * Values are common practice / tuned on our own generated sessions (tuning seeds only); none comes from a
 * published standard.
 */
export const DETECTION_DEFAULTS = {
  /** stance width the (scaled) values below are given for, mm */
  referenceStanceWidthMm: 400,
  /** floor of the quiet threshold: COP speed below which the golfer counts as still, mm/s (quiet stance sway is
   *  ~10-20 mm/s); the threshold in use is the larger of this and noiseFloorFactor x the recording's noise floor */
  quietSpeedMmS: 40,
  /** quiet threshold = max(quietSpeedMmS, noiseFloorFactor x noise floor); the noise floor is a low percentile of
   *  the COP speed's medians over short blocks (still stretches), see noise.ts */
  noiseFloorFactor: 4,
  /** shortest still moment that counts as an address, s */
  quietMinS: 0.2,
  /** a waggle or forward press within this time before the takeaway belongs to the set-up, s */
  preShotS: 1.0,
  /** share of the still moment's samples that must be below the quiet threshold (tolerates single noisy samples) */
  quietFraction: 0.9,
  /** lead-foot share during the still address, % (address is close to 50/50, common practice) */
  addressLeadPctMin: 30,
  addressLeadPctMax: 70,
  /** total force at address at least this fraction of the recording's median total force */
  loadedFraction: 0.5,
  /** backswing duration limits (address -> top), s; typical 0.7-1.0 s (Grober & Cholewicki) */
  backswingMinS: 0.3,
  backswingMaxS: 2.0,
  /** a pause at the top may last this long, s */
  topPauseMaxS: 0.3,
  /** the takeaway's start may lie this far before the trail-ward COP X velocity first exceeds half the quiet
   *  threshold (the slow first part of the move), s */
  takeawayOnsetMaxS: 0.2,
  /** inside the backswing, dips of the trail-ward velocity this short are noise, s */
  takeawayGapS: 0.06,
  /** minimum trail-ward COP X travel from address to top, mm (scaled) */
  minBackswingTravelMm: 12,
  /** lead-ward COP X velocity that makes a candidate, mm/s (scaled); waggles and forward presses stay far below
   *  (~200 mm/s), walking and stepping exceed it and are told apart by the other checks */
  downswingPeakSpeedMmS: 300,
  /** minimum lead-ward COP X travel from top to the most lead-ward point before the finish, mm (scaled) */
  minDownswingTravelMm: 60,
  /** a swing is partial when its lead-ward travel is below this fraction of the file's full-size swings' median */
  partialTravelFraction: 0.78,
  /** a swing travelling at least this fraction of the stance width toward the lead foot is full-size; their median
   *  is the file's own reference; in a file without any, every swing below it is partial */
  fullTravelOfStance: 0.58,
  /** the most trail-ward filtered COP X is searched this far around the velocity's zero crossing, s */
  topSearchS: 0.06,
  /** fraction of the peak lead-ward velocity that marks transition (rising) and detected impact (falling) */
  halfPeakFraction: 0.5,
  /** longest top -> impact, s; typical downswing 0.25-0.3 s (Grober & Cholewicki) */
  maxDownswingS: 0.6,
  /** a foot carrying less than this share of the total between address and impact counts as lifted, % */
  footLiftedPct: 4,
  /** floor of the settle threshold: COP speed below which the finish counts as settled, mm/s; the threshold in
   *  use is the larger of this and 1.5 x the quiet threshold */
  settleSpeedMmS: 60,
  /** most COP drift over the settled hold, mm (slow rolling onto the lead foot is not yet the finish) */
  settleDriftMm: 5,
  /** how long the COP must stay settled, s */
  settleHoldS: 0.3,
  /** longest impact -> finish, s */
  maxFollowThroughS: 3.0,
  /** lead-foot share over the finish hold, % (finish is nearly all on the lead foot, common practice) */
  finishMinLeadPct: 60,
  /** lead-ward COP X velocity that marks a forward press, mm/s */
  pressSpeedMmS: 15,
  /** smallest forward press reported, mm of lead-ward COP X travel (scaled) */
  pressMinMm: 4,
  /** a forward press must end within this time before the takeaway, s */
  pressMaxGapS: 0.15,
  /** context kept before address and after the finish hold in a swing's window, s */
  contextS: 1.0,
} as const;

export type DetectionParams = { -readonly [K in keyof typeof DETECTION_DEFAULTS]: number };

const SCALED = ['minBackswingTravelMm', 'downswingPeakSpeedMmS', 'minDownswingTravelMm', 'pressMinMm'] as const;

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

/** One line per rejection reason, for logs and the UI (coach words). */
export const REJECT_REASONS: Record<RejectReason, string> = {
  'no-turn': 'the weight never turned from the trail side toward the lead side before the fast move',
  'no-backswing': 'no weight shift toward the trail foot before the turn',
  'backswing-too-short': 'the backswing was shorter than a swing’s',
  'backswing-too-long': 'no takeaway found within the longest backswing before the turn',
  'no-quiet-address': 'the golfer was not still at address before the takeaway',
  'not-loaded': 'too little weight on the insoles at address (insoles unloaded)',
  'address-not-balanced': 'the weight was not shared between the feet at address',
  'backswing-too-small': 'the weight moved too little toward the trail foot in the backswing',
  'downswing-too-long': 'too long from the top to impact',
  'foot-lifted': 'a foot was lifted between address and impact (a step or walking)',
  'no-settled-finish': 'the weight did not settle after impact',
  'finish-not-on-lead-side': 'the finish was not held on the lead foot',
  'downswing-too-small': 'the weight moved too little toward the lead foot',
  'events-out-of-order': 'the events would not be in order address < top < transition < impact < finish',
  'inside-previous-swing': 'part of a swing already found',
};

export type EventIndexes = Record<EventName, number>;
