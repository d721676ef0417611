// The drill report for a session: for each check a drill works on, the mean before the assignment date and in this
// session alone ("after"), and how far it moved (after - before). Pure: takes swing facts, returns numbers.
import { mean } from '@/lib/compare/stats';
import type { SwingFacts } from '@/lib/targets/swing-facts';
import type { Measure, TargetEvent } from '@/lib/targets/types';

export interface CheckMove {
  event: TargetEvent;
  measure: Measure;
  before: { mean: number; n: number } | null;
  after: { mean: number; n: number } | null;
  moved: number | null;
}

function summary(xs: number[]): { mean: number; n: number } | null {
  return xs.length === 0 ? null : { mean: mean(xs), n: xs.length };
}

/** before: sessions dated before assignedAt; after: the swings of this one session (never pooled with others). */
export function checkMoves(checks: { event: TargetEvent; measure: Measure }[], swings: SwingFacts[], assignedAt: string, sessionId: number): CheckMove[] {
  const visible = swings.filter((s) => !s.hidden);
  return checks.map(({ event, measure }) => {
    const pick = (list: SwingFacts[]) => list.map((s) => s.values[event]?.[measure]).filter((v): v is number => v !== null && v !== undefined && Number.isFinite(v));
    const before = summary(pick(visible.filter((s) => s.sessionDate < assignedAt)));
    const after = summary(pick(visible.filter((s) => s.sessionId === sessionId)));
    return { event, measure, before, after, moved: before && after ? after.mean - before.mean : null };
  });
}
