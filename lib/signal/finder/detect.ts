// The events of one candidate swing, one finder per event (downswing.ts, top.ts, address.ts, finish.ts,
// forward-press.ts), and the checks that tell a swing from walking, stepping, re-teeing, waggles and a lifted foot.
// Events are strictly ordered address < top < transition < impact < finish; otherwise the candidate is rejected.
import type { DerivedSeries } from '../types';
import { findStillAddress, findTakeaway } from './address';
import { findDetectedImpact, findMarkedImpact, findTransition } from './downswing';
import { findFinish } from './finish';
import { findForwardPress, type ForwardPress } from './forward-press';
import type { DetectionParams, EventIndexes, RejectReason } from './params';
import { findTop } from './top';

export type EventDetection =
  | {
      ok: true;
      events: EventIndexes;
      impactSource: 'marker' | 'detected';
      forwardPress: ForwardPress | null;
      /** lead-ward COP X travel from the top to its furthest point before the finish, mm */
      downswingTravelMm: number;
      start: number;
      end: number;
    }
  | { ok: false; reason: RejectReason; start: number; end: number };

export interface EventContext {
  params: DetectionParams;
  /** impact marker on the series' sample grid, or null when the file has no impact column */
  impact: Uint8Array | null;
  /** the total force (N) an address must at least carry */
  loadedN: number;
  /** COP speed thresholds from the recording's own noise floor (noise.ts) */
  quietMmS: number;
  settleMmS: number;
  /** a coach asked for this swing: skip the still-address, balance, load, lead-side finish and travel checks */
  relaxed?: boolean;
}

/** Events of the swing whose main lead-ward COP X velocity peak is at sample `peak`. */
export function detectSwingEvents(s: DerivedSeries, peak: number, ctx: EventContext): EventDetection {
  const { params: p, impact: marker, loadedN, quietMmS, settleMmS } = ctx;
  const strict = !ctx.relaxed;
  const fs = s.sampleRateHz;
  const n = s.time.length;
  const x = s.copX;
  const lead = s.leadPct;
  const ctxN = Math.round(p.contextS * fs);
  let start = Math.max(0, peak - Math.round(p.backswingMaxS * fs));
  let end = Math.min(n - 1, peak + Math.round((p.maxFollowThroughS + p.settleHoldS) * fs));
  const reject = (reason: RejectReason): EventDetection => ({ ok: false, reason, start, end });

  const lo = Math.max(0, peak - Math.round(p.maxDownswingS * fs));
  const transition = findTransition(s.copVx, peak, lo, p);
  const impactDetected = findDetectedImpact(s.copVx, peak, p);
  if (impactDetected >= n) return reject('no-settled-finish');
  const top = findTop(s, transition, lo, p);
  if (top < 0) return reject('no-turn');

  const address = findTakeaway(s, top, quietMmS, p);
  if (address < 0) return reject(top > 0 && s.copVx[top - 1] < 0 ? 'backswing-too-long' : 'no-backswing');
  start = Math.max(0, address - ctxN);
  const backswingS = (top - address) / fs;
  if (backswingS < p.backswingMinS) return reject('backswing-too-short');
  if (backswingS > p.backswingMaxS) return reject('backswing-too-long');

  if (strict) {
    const still = findStillAddress(s, address, quietMmS, p);
    if (!still) return reject('no-quiet-address');
    let loaded = true;
    let balanced = true;
    for (let i = still.from; i <= address; i++) {
      if (!(s.totalN[i] >= loadedN)) loaded = false;
      if (i <= still.to && !(lead[i] >= p.addressLeadPctMin && lead[i] <= p.addressLeadPctMax)) balanced = false;
    }
    if (!(lead[address] >= p.addressLeadPctMin && lead[address] <= p.addressLeadPctMax)) balanced = false;
    if (!loaded) return reject('not-loaded');
    if (!balanced) return reject('address-not-balanced');
    if (x[address] - x[top] < p.minBackswingTravelMm) return reject('backswing-too-small');
  }

  let impact = impactDetected;
  let impactSource: 'marker' | 'detected' = 'detected';
  const marked = marker ? findMarkedImpact(marker, top, s, p) : -1;
  if (marked >= 0) {
    impact = marked;
    impactSource = 'marker';
  }
  if ((impact - top) / fs > p.maxDownswingS) return reject('downswing-too-long');

  for (let i = address; i <= impact; i++) {
    if (!(lead[i] >= p.footLiftedPct && lead[i] <= 100 - p.footLiftedPct)) return reject('foot-lifted');
  }

  const { finish, holdN } = findFinish(s, impact, settleMmS, p);
  if (finish < 0) return reject('no-settled-finish');
  end = Math.min(n - 1, finish + holdN + ctxN);
  let leadSum = 0;
  for (let i = finish; i < finish + holdN; i++) leadSum += lead[i];
  if (strict && !(leadSum / holdN >= p.finishMinLeadPct)) return reject('finish-not-on-lead-side');

  let xMax = -Infinity;
  for (let i = top; i <= finish; i++) if (x[i] > xMax) xMax = x[i];
  const downswingTravelMm = xMax - x[top];
  if (strict && downswingTravelMm < p.minDownswingTravelMm) return reject('downswing-too-small');

  if (!(address < top && top < transition && transition < impact && impact < finish)) return reject('events-out-of-order');
  const forwardPress = findForwardPress(s, address, p);
  return { ok: true, events: { address, top, transition, impact, finish }, impactSource, forwardPress, downswingTravelMm, start, end };
}

/**
 * Events placed for a coach to adjust when even the relaxed detection fails at a candidate: top = the most
 * trail-ward COP X in the second before the fastest lead-ward sample near `at`, transition / impact at the half-peak
 * points, address 0.8 s before the top and finish 0.8 s after impact (typical durations, Grober & Cholewicki),
 * clipped to the recording and kept in order.
 */
export function placeEvents(s: DerivedSeries, at: number, p: DetectionParams): EventIndexes {
  const fs = s.sampleRateHz;
  const n = s.time.length;
  const vx = s.copVx;
  const w = Math.round(0.5 * fs);
  let peak = Math.max(0, Math.min(n - 1, at));
  for (let i = Math.max(1, at - w); i <= Math.min(n - 2, at + w); i++) if (vx[i] > vx[peak]) peak = i;
  peak = Math.max(2, Math.min(n - 3, peak));
  let top = peak - 1;
  for (let i = Math.max(1, peak - fs); i < peak; i++) if (s.copX[i] < s.copX[top]) top = i;
  let transition = findTransition(vx, peak, top + 1, p);
  let impact = Math.min(n - 2, findDetectedImpact(vx, peak, p));
  if (transition <= top) transition = top + 1;
  if (impact <= transition) impact = Math.min(n - 2, transition + 1);
  const address = Math.max(0, Math.min(top - 1, top - Math.round(0.8 * fs)));
  const finish = Math.min(n - 1, Math.max(impact + 1, impact + Math.round(0.8 * fs)));
  return { address, top, transition, impact, finish };
}
