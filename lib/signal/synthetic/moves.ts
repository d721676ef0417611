// The movements the generator strings together: relaxed standing, walking, a lifted foot, re-teeing, the set-up
// at address (still, waggles, a forward press, a short address) and the swing itself (full or partial).
// Common practice (domain.md): a quiet address near 50/50; backswing toward the trail foot (66-78 % trail, into
// the trail heel); a fast downswing of duration D to 80-88 % lead with impact at 5/6 D, 0.24-0.30 s after the top
// (tempo ~3:1, Grober & Cholewicki); a follow-through to 93-97 % lead onto the lead heel while the trail foot rolls
// onto its toes; a held finish; then back to a relaxed stance. A partial swing (a pitch) turns less: about 40 %
// lead at the top and about 80 % at the finish.
import { syncTo, type Tracks } from './track';

export type Distractor = 'walk' | 'step' | 'waggle' | 'retee' | 'lift';
export const DISTRACTORS: readonly Distractor[] = ['walk', 'step', 'waggle', 'retee', 'lift'];

/**
 * What the golfer does in the last moments before the takeaway:
 * - still: still at address for 0.6-1.2 s;
 * - waggle: 2-3 quick small back-and-forth weight shifts, then still for 0.3-0.6 s;
 * - press: still, then a forward press (a slight shift toward the lead foot, 0.18-0.3 s) straight into the takeaway;
 * - short: a small shuffle, then still for only 0.2-0.3 s.
 */
export type PreShot = 'still' | 'waggle' | 'press' | 'short';
export const PRE_SHOTS: readonly PreShot[] = ['still', 'waggle', 'press', 'short'];
export type SwingKind = 'full' | 'partial';

/** Design times of one swing, s on the recording's axis: the truth of the detector's tests. */
export interface SwingDesign {
  /** start of the takeaway: the first instant of the trail-ward move that leads to the top */
  takeaway: number;
  /** the most trail-ward point: every control arrives at its key frame here with zero velocity */
  top: number;
  /** duration of the lead-ward downswing move (eased), s; impact is at 5/6 of it */
  downD: number;
  /** top -> impact, s */
  impactS: number;
  /** end of the follow-through: the COP comes to rest on the lead side */
  finish: number;
  partial: boolean;
  /** the forward press, when the pre-shot routine had one: its start and end, s */
  press: { start: number; end: number } | null;
}

/** Relaxed stance: both feet, slow small weight shifts (too slow to look like a swing), until `until`. */
export function idle(tr: Tracks, rnd: () => number, until: number): void {
  let t = tr.lead.end;
  while (until - t > 5) {
    // at most 4.5 s per shift, so the loop ends before `until`
    t += 1.5 + rnd();
    tr.lead.to(t, 0.5 + (rnd() - 0.5) * 0.16);
    t += 1 + rnd();
    tr.lead.holdUntil(t);
  }
  if (until - t >= 1) tr.lead.to(until - 0.5, 0.5);
  syncTo(tr, until);
}

/** Walking: single support with the other foot in the air, heel-to-toe roll, brief double support. */
export function walk(tr: Tracks, rnd: () => number, steps: number): void {
  let t = tr.lead.end;
  let onLead = rnd() < 0.5;
  t += 0.35;
  tr.lead.to(t, onLead ? 1 : 0);
  syncTo(tr, t);
  for (let s = 0; s < steps; s++) {
    const stance = 0.38 + rnd() * 0.08;
    const heel = onLead ? tr.leadHeel : tr.trailHeel;
    heel.to(tr.lead.end, 0.85);
    heel.to(t + stance, 0.1);
    t += stance;
    tr.lead.holdUntil(t);
    t += 0.1 + rnd() * 0.04; // double support: the weight passes to the other foot
    onLead = !onLead;
    tr.lead.to(t, onLead ? 1 : 0);
    tr.load.to(t - 0.05, 1.12).to(t, 1);
    syncTo(tr, t);
  }
  t += 0.4;
  tr.lead.to(t, 0.5);
  tr.leadHeel.to(t, 0.5);
  tr.trailHeel.to(t, 0.5);
  syncTo(tr, t + 1.2);
}

/** A foot lifted off the ground for a while, then put down again. */
export function lift(tr: Tracks, rnd: () => number, hold: number): void {
  let t = tr.lead.end + 0.5;
  tr.lead.to(t, rnd() < 0.5 ? 1 : 0);
  t += hold;
  tr.lead.holdUntil(t);
  t += 0.5;
  tr.lead.to(t, 0.5);
  syncTo(tr, t + 1.2);
}

/** Re-teeing: walk to the ball, bend over it on mostly one foot, walk back. */
export function retee(tr: Tracks, rnd: () => number): void {
  walk(tr, rnd, 2);
  let t = tr.lead.end + 0.6;
  const onLead = rnd() < 0.5;
  tr.lead.to(t, onLead ? 0.85 : 0.15);
  tr.leadHeel.to(t, 0.2);
  tr.trailHeel.to(t, 0.2);
  tr.load.to(t, 1.05);
  t += 1.2 + rnd() * 0.6;
  syncTo(tr, t);
  t += 0.6;
  tr.lead.to(t, onLead ? 1 : 0); // the other foot comes off the ground as the golfer stands up
  tr.leadHeel.to(t, 0.5);
  tr.trailHeel.to(t, 0.5);
  tr.load.to(t, 1);
  syncTo(tr, t + 0.3);
  walk(tr, rnd, 2);
}

function waggles(tr: Tracks, rnd: () => number, t: number, f0: number): number {
  // small quick back-and-forth of the weight at address
  const cycles = 2 + Math.floor(rnd() * 2);
  for (let c = 0; c < cycles; c++) {
    tr.lead.to((t += 0.2), f0 + 0.03).to((t += 0.2), f0 - 0.03);
  }
  tr.lead.to((t += 0.2), f0);
  return t;
}

/**
 * Setting up at address, then the pre-shot routine; returns the takeaway time, the lead share the takeaway starts
 * from and the forward press. `legacyWaggle` is the waggle distractor: waggles, then still for 0.9-1.3 s.
 */
export function setUp(tr: Tracks, rnd: () => number, pre: PreShot, legacyWaggle = false): { t: number; f0: number; press: SwingDesign['press'] } {
  let t = tr.lead.end;
  const f0 = 0.5 + (rnd() - 0.5) * 0.06;
  t += 0.6;
  tr.lead.to(t, f0);
  tr.leadHeel.to(t, 0.5 + (rnd() - 0.5) * 0.1);
  tr.trailHeel.to(t, 0.5 + (rnd() - 0.5) * 0.1);
  t += 0.6 + rnd() * 0.6;
  syncTo(tr, t);
  if (legacyWaggle) {
    t = waggles(tr, rnd, t, f0);
    t += 0.9 + rnd() * 0.4;
    syncTo(tr, t);
    return { t, f0, press: null };
  }
  if (pre === 'still') {
    t += 0.6 + rnd() * 0.6;
    syncTo(tr, t);
    return { t, f0, press: null };
  }
  if (pre === 'waggle') {
    t = waggles(tr, rnd, t, f0);
    t += 0.3 + rnd() * 0.3;
    syncTo(tr, t);
    return { t, f0, press: null };
  }
  if (pre === 'short') {
    // a small shuffle of the weight, then only a brief still moment before the takeaway
    const d = (rnd() < 0.5 ? -1 : 1) * (0.03 + rnd() * 0.02);
    tr.lead.to((t += 0.3), f0 + d).to((t += 0.3), f0);
    t += 0.2 + rnd() * 0.1;
    syncTo(tr, t);
    return { t, f0, press: null };
  }
  // press: still, then a slight shift toward the lead foot that runs straight into the takeaway
  t += 0.4 + rnd() * 0.6;
  syncTo(tr, t);
  const start = t;
  const size = 0.025 + rnd() * 0.025;
  t += 0.18 + rnd() * 0.12;
  tr.lead.to(t, f0 + size);
  syncTo(tr, t);
  return { t, f0: f0 + size, press: { start, end: t } };
}

/** Back from wherever the weight is to a relaxed, even stance. */
export function relax(tr: Tracks, t: number): void {
  tr.lead.to(t, 0.5);
  tr.leadHeel.to(t, 0.5);
  tr.trailHeel.to(t, 0.5);
  syncTo(tr, t + 1);
}

/** One swing from the relaxed stance; returns its design times. */
export function swing(tr: Tracks, rnd: () => number, pre: PreShot, kind: SwingKind, legacyWaggle = false): SwingDesign {
  const { t: takeaway, press } = setUp(tr, rnd, pre, legacyWaggle);
  const partial = kind === 'partial';
  // takeaway -> top 0.75-1.0 s (Grober & Cholewicki: backswing 0.7-1.0 s); a pitch a little shorter
  const backswingS = partial ? 0.6 + rnd() * 0.2 : 0.75 + rnd() * 0.25;
  const top = takeaway + backswingS;
  tr.lead.to(top, partial ? 0.37 + rnd() * 0.06 : 0.22 + rnd() * 0.12);
  tr.trailHeel.to(top, partial ? 0.55 + rnd() * 0.05 : 0.6 + rnd() * 0.1);
  tr.leadHeel.to(top, 0.45);
  syncTo(tr, top);
  const impactS = partial ? 0.26 + rnd() * 0.06 : 0.24 + rnd() * 0.06;
  const downD = (impactS * 6) / 5;
  const downEnd = top + downD;
  tr.lead.to(downEnd, partial ? 0.72 + rnd() * 0.06 : 0.8 + rnd() * 0.08);
  syncTo(tr, downEnd);
  const finish = downEnd + 0.45 + rnd() * 0.15;
  tr.lead.to(finish, partial ? 0.79 + rnd() * 0.04 : 0.93 + rnd() * 0.04);
  tr.leadHeel.to(finish, partial ? 0.6 + rnd() * 0.1 : 0.7 + rnd() * 0.1);
  tr.trailHeel.to(finish, partial ? 0.25 : 0.1);
  syncTo(tr, finish);
  const t = finish + 1.5 + rnd();
  syncTo(tr, t);
  relax(tr, t + 0.9);
  return { takeaway, top, downD, impactS, finish, partial, press };
}
