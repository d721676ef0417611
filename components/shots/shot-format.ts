// Display of shot values in the viewer's units (values arrive in SI: m/s, m, degrees, rpm) and the coach's names
// for the measures and results.
import type { MetricId, Outcome, UnitSystem } from '@/lib/contracts/shots';
import { displayUnits, distanceFromM, speedFromMps } from '@/lib/shots/units';

export const OUTCOME_LABELS: Record<Outcome, string> = {
  ball_speed: 'Ball speed',
  carry: 'Carry',
  total: 'Total distance',
  launch_angle: 'Launch angle',
  spin: 'Spin',
  offline: 'Offline (right +)',
};

export const METRIC_LABELS: Record<MetricId, string> = {
  lead_pct_at_address: 'Lead foot % at address',
  lead_pct_at_top: 'Lead foot % at the top',
  lead_pct_at_transition: 'Lead foot % at transition',
  lead_pct_at_impact: 'Lead foot % at impact',
  lead_pct_at_finish: 'Lead foot % at the finish',
  trail_heel_pct_at_top: 'Trail heel % at the top',
  lead_heel_pct_at_finish: 'Lead heel % at the finish',
  tempo_ratio: 'Tempo (backswing : downswing)',
  backswing_s: 'Backswing time (s)',
  downswing_s: 'Downswing time (s)',
  peak_cop_speed: 'Fastest pressure move (mm/s)',
  forward_press_mm: 'Forward press (mm)',
};

/** Help text in lab terms, for the title attribute. */
export const METRIC_HELP: Partial<Record<MetricId, string>> = {
  peak_cop_speed: 'Peak centre-of-pressure (COP) speed over the swing phases, mm/s.',
  tempo_ratio: 'Backswing duration divided by downswing duration.',
  forward_press_mm: 'COP shift toward the lead side just before the takeaway, mm.',
};

export function outcomeUnit(outcome: Outcome, system: UnitSystem): string {
  const u = displayUnits(system);
  if (outcome === 'ball_speed') return u.speed;
  if (outcome === 'launch_angle') return '°';
  if (outcome === 'spin') return 'rpm';
  return u.distance;
}

/** An SI outcome value in the viewer's unit. */
export function outcomeValue(outcome: Outcome, si: number, system: UnitSystem): number {
  const u = displayUnits(system);
  if (outcome === 'ball_speed') return speedFromMps(si, u.speed);
  if (outcome === 'carry' || outcome === 'total' || outcome === 'offline') return distanceFromM(si, u.distance);
  return si;
}

export function formatOutcome(outcome: Outcome, si: number | null, system: UnitSystem): string {
  if (si === null) return '–';
  const v = outcomeValue(outcome, si, system);
  return outcome === 'spin' ? Math.round(v).toString() : v.toFixed(1);
}

export const formatSigned = (s: number | null, digits = 2) => (s === null ? '–' : `${s >= 0 ? '+' : '−'}${Math.abs(s).toFixed(digits)}`);
