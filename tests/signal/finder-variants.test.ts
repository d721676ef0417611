import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeRecording } from '@/lib/signal/analyze';
import { parseRecording } from '@/lib/signal/read';
import {
  DISTRACTOR_ONLY,
  FINDER_VARIANTS,
  generateSession,
  HELD_OUT_SEEDS,
  quantile,
  scoreFinder,
  variantOptions,
  type FinderScore,
  type SwingMatch,
} from '@/lib/signal/synthetic';
import type { EventName } from '@/lib/signal/types';

// The swing finder's targets, on generated sessions whose seeds were kept out of tuning (HELD_OUT_SEEDS): every
// variant of lib/signal/synthetic/variants.ts (50-500 Hz, sensor noise x1-x3, golfers of 550-1100 N, both hands,
// N and kPa, waggles and forward presses right before the takeaway, short addresses, partial swings, every
// distractor). The truth is the generator's construction (the times it builds each move from), never a threshold
// of the detector. Tolerances are the product targets (issue "Every swing"), not derived from the detector:
// - 100 % of full swings found, >= 95 % of partial swings, 0 false swings;
// - address within 100 ms, top within 20 ms, finish within 250 ms, for >= 95 % of swings;
// - the top's median error (bias) within +/- 10 ms;
// - the forward press found within 100 ms of its start where there was one, none where the golfer stood still.
const found = (out: ReturnType<typeof analyzeRecording>) =>
  out.result.swings.map((w) => ({
    events: w.events,
    partial: w.partial,
    forwardPress: w.forward_press ? { timeS: w.forward_press.time_s, sizeMm: w.forward_press.size_mm } : null,
  }));

const scores: { variant: string; seed: number; score: FinderScore }[] = [];
const all: SwingMatch[] = [];
let distractorSwings = 0;

beforeAll(() => {
  for (const v of FINDER_VARIANTS) {
    for (const seed of HELD_OUT_SEEDS) {
      const s = generateSession(variantOptions(v, seed));
      const score = scoreFinder(s.truth.swings, found(analyzeRecording(parseRecording(s.csv()), s.layout)));
      scores.push({ variant: v.name, seed, score });
      all.push(...score.matches);
    }
  }
  for (const seed of HELD_OUT_SEEDS) {
    const s = generateSession({ ...DISTRACTOR_ONLY, seed });
    distractorSwings += analyzeRecording(parseRecording(s.csv()), s.layout).result.swings.length;
  }
}, 300_000);

const within = (e: EventName, tolS: number) => all.filter((m) => Math.abs(m.error[e]) <= tolS).length / all.length;

describe('swing finder on held-out generated variants', () => {
  it('finds every full swing and >= 95 % of partial swings, with no false swing', () => {
    for (const { variant, seed, score } of scores) {
      expect(score.foundFull, `${variant}, seed ${seed}`).toBe(score.trueFull);
      expect(score.falseSwings, `${variant}, seed ${seed}`).toBe(0);
    }
    const truePartial = scores.reduce((a, s) => a + s.score.truePartial, 0);
    const foundPartial = scores.reduce((a, s) => a + s.score.foundPartial, 0);
    expect(truePartial).toBeGreaterThan(20);
    expect(foundPartial / truePartial).toBeGreaterThanOrEqual(0.95);
  });

  it('finds no swing in walking, stepping, re-teeing, waggles or a lifted foot alone', () => {
    expect(distractorSwings).toBe(0);
  });

  it('places address within 100 ms, top within 20 ms and finish within 250 ms for >= 95 % of swings', () => {
    expect(all.length).toBeGreaterThan(250);
    expect(within('address', 0.1)).toBeGreaterThanOrEqual(0.95);
    expect(within('top', 0.02)).toBeGreaterThanOrEqual(0.95);
    expect(within('finish', 0.25)).toBeGreaterThanOrEqual(0.95);
  });

  it('has no top bias beyond +/- 10 ms', () => {
    expect(Math.abs(quantile(all.map((m) => m.error.top), 0.5))).toBeLessThanOrEqual(0.01);
  });

  it('flags partial swings as partial and full swings as full', () => {
    const right = all.filter((m) => Boolean(m.found.partial) === m.truth.partial).length;
    expect(right / all.length).toBeGreaterThanOrEqual(0.95);
  });

  it('reports the forward press before the takeaway, and none after a still address', () => {
    const pressed = all.filter((m) => m.truth.forwardPress);
    expect(pressed.length).toBeGreaterThan(20);
    const hit = pressed.filter((m) => m.found.forwardPress && Math.abs(m.found.forwardPress.timeS - m.truth.forwardPress!.timeS) <= 0.1);
    expect(hit.length / pressed.length).toBeGreaterThanOrEqual(0.95);
    // size: the generator's own lead-ward COP X travel of the press (noise-free), within 3 mm
    for (const m of hit) expect(Math.abs(m.found.forwardPress!.sizeMm - m.truth.forwardPress!.sizeMm)).toBeLessThanOrEqual(3);
    const still = all.filter((m) => m.truth.preShot === 'still');
    expect(still.filter((m) => m.found.forwardPress === null).length / still.length).toBeGreaterThanOrEqual(0.95);
  });
});
