// Scoring one swing against a target: each check passes when |actual - expected| <= tolerance.
// `by` is how far outside the tolerance the value lies (0 when it passes), signed: + above, - below.
import type { Measure, TargetCheck, TargetEvent, Tempo } from './types';

export type EventValues = Partial<Record<TargetEvent, Partial<Record<Measure, number | null>>>>;

export interface CheckResult extends TargetCheck {
  actual: number | null;
  pass: boolean;
  /** signed distance past the tolerance (0 on a pass, null when the value is missing) */
  by: number | null;
}

export interface TempoResult extends Tempo {
  actual: number | null;
  pass: boolean;
}

export interface TargetScore {
  checks: CheckResult[];
  tempo?: TempoResult;
  summary: { passed: number; total: number; text: string };
}

export function scoreCheck(check: TargetCheck, actual: number | null | undefined): CheckResult {
  if (actual === null || actual === undefined || !Number.isFinite(actual)) return { ...check, actual: null, pass: false, by: null };
  const d = actual - check.expected;
  const pass = Math.abs(d) <= check.tolerance;
  const by = pass ? 0 : d > 0 ? d - check.tolerance : d + check.tolerance;
  return { ...check, actual, pass, by };
}

export function scoreSwing(target: { checks: TargetCheck[]; tempo: Tempo | null }, values: EventValues, tempoRatio: number | null): TargetScore {
  const checks = target.checks.map((c) => scoreCheck(c, values[c.event]?.[c.measure]));
  let tempo: TempoResult | undefined;
  if (target.tempo) {
    const ok = tempoRatio !== null && Number.isFinite(tempoRatio);
    tempo = { ...target.tempo, actual: ok ? tempoRatio : null, pass: ok && tempoRatio >= target.tempo.min && tempoRatio <= target.tempo.max };
  }
  const passed = checks.filter((c) => c.pass).length + (tempo?.pass ? 1 : 0);
  const total = checks.length + (tempo ? 1 : 0);
  const missed = checks.filter((c) => !c.pass).map((c) => `${c.measure} at ${c.event}`);
  if (tempo && !tempo.pass) missed.push('tempo');
  const text = missed.length === 0 ? `All ${total} checks within tolerance.` : `${passed} of ${total} within tolerance; outside: ${missed.join(', ')}.`;
  return { checks, ...(tempo ? { tempo } : {}), summary: { passed, total, text } };
}
