// Scoring the swing finder against the generator's truth: each true swing is matched to the found swing whose top
// lies within 0.3 s of its own; unmatched found swings are false swings. Used by the tests and bench:finder.
import type { EventName } from '../types';
import type { TruthSwing } from './session';

export interface FoundSwing {
  events: Record<EventName, number>;
  partial?: boolean;
  forwardPress?: { timeS: number; sizeMm: number } | null;
}

export interface SwingMatch {
  truth: TruthSwing;
  found: FoundSwing;
  /** found - true, s */
  error: Record<EventName, number>;
}

export interface FinderScore {
  trueFull: number;
  truePartial: number;
  foundFull: number;
  foundPartial: number;
  falseSwings: number;
  matches: SwingMatch[];
}

const MATCH_S = 0.3;
const EVENTS: EventName[] = ['address', 'top', 'transition', 'impact', 'finish'];

export function scoreFinder(truth: readonly TruthSwing[], found: readonly FoundSwing[]): FinderScore {
  const used = new Set<number>();
  const matches: SwingMatch[] = [];
  for (const t of truth) {
    let best = -1;
    for (let k = 0; k < found.length; k++) {
      if (used.has(k)) continue;
      const d = Math.abs(found[k].events.top - t.events.top);
      if (d <= MATCH_S && (best < 0 || d < Math.abs(found[best].events.top - t.events.top))) best = k;
    }
    if (best < 0) continue;
    used.add(best);
    const error = {} as Record<EventName, number>;
    for (const e of EVENTS) error[e] = found[best].events[e] - t.events[e];
    matches.push({ truth: t, found: found[best], error });
  }
  return {
    trueFull: truth.filter((t) => !t.partial).length,
    truePartial: truth.filter((t) => t.partial).length,
    foundFull: matches.filter((m) => !m.truth.partial).length,
    foundPartial: matches.filter((m) => m.truth.partial).length,
    falseSwings: found.length - matches.length,
    matches,
  };
}

/** The q-quantile (0..1) of the values, linear between order statistics; NaN when empty. */
export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) return NaN;
  const s = [...values].sort((a, b) => a - b);
  const p = (s.length - 1) * q;
  const lo = Math.floor(p);
  const hi = Math.ceil(p);
  return s[lo] + (s[hi] - s[lo]) * (p - lo);
}
