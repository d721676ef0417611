// Named per-swing metrics for compare and progress: '<event>.<measure>' (e.g. 'impact.leadPct', 'address.copSide'),
// '<phase>.<field>' (e.g. 'backswing.durationS', 'downswing.peakCopSpeedMmS') and 'tempoRatio'.
import { PHASE_NAMES } from '@/lib/signal/types';
import type { SwingFacts } from '@/lib/targets/swing-facts';
import { MEASURES, TARGET_EVENTS, type Measure, type TargetEvent } from '@/lib/targets/types';

export const PHASES = PHASE_NAMES;
export const PHASE_FIELDS = ['durationS', 'copPathMm', 'peakCopSpeedMmS', 'meanLeadPct'] as const;

export const METRICS: readonly string[] = [
  'tempoRatio',
  ...TARGET_EVENTS.flatMap((e) => MEASURES.map((m) => `${e}.${m}`)),
  ...PHASES.flatMap((p) => PHASE_FIELDS.map((f) => `${p}.${f}`)),
];

export const DEFAULT_METRICS = ['impact.leadPct', 'top.trailHeelPct', 'tempoRatio', 'backswing.durationS', 'downswing.durationS'];

export function metricValue(s: SwingFacts, metric: string): number | null {
  if (metric === 'tempoRatio') return s.tempoRatio;
  const [a, b] = metric.split('.');
  let v: number | null | undefined;
  if ((TARGET_EVENTS as readonly string[]).includes(a)) v = s.values[a as TargetEvent]?.[b as Measure];
  else v = s.phases[a]?.[b as (typeof PHASE_FIELDS)[number]];
  return v === null || v === undefined || !Number.isFinite(v) ? null : v;
}

export function metricValues(swings: SwingFacts[], metric: string): number[] {
  return swings.map((s) => metricValue(s, metric)).filter((v): v is number => v !== null);
}
