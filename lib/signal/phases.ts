// Per-swing numbers: values at each event and per-phase summaries (README "The analysis command").
// Full precision here; rounding happens only where JSON is written (analyze.ts roundAnalysis).
import type { EventIndexes } from './events';
import { EVENT_NAMES, PHASES, type AtEvent, type DerivedSeries, type EventName, type PhaseRow } from './types';

export function atEvent(s: DerivedSeries, i: number): AtEvent {
  return {
    lead_pct: s.leadPct[i],
    lead_heel_pct: s.leadHeelPct[i],
    trail_heel_pct: s.trailHeelPct[i],
    cop_x_mm: s.copX[i],
    cop_y_mm: s.copY[i],
  };
}

export function atEvents(s: DerivedSeries, events: EventIndexes): Record<EventName, AtEvent> {
  const out = {} as Record<EventName, AtEvent>;
  for (const name of EVENT_NAMES) out[name] = atEvent(s, events[name]);
  return out;
}

/**
 * One phase between samples `from` and `to` (both included):
 * duration_s = t_to - t_from; cop_path_mm = sum |COP_i - COP_(i-1)| over the phase (planar path length);
 * peak_cop_speed_mm_s = max COP speed; mean_lead_pct = mean lead % (NaN samples skipped).
 */
export function phaseStats(s: DerivedSeries, from: number, to: number): Omit<PhaseRow, 'name' | 'from' | 'to'> {
  if (!(Number.isInteger(from) && Number.isInteger(to) && from >= 0 && to >= from && to < s.time.length)) {
    throw new RangeError(`bad phase bounds ${from}..${to} for ${s.time.length} samples`);
  }
  let path = 0;
  let peak = -Infinity;
  let leadSum = 0;
  let leadN = 0;
  for (let i = from; i <= to; i++) {
    if (i > from) path += Math.hypot(s.copX[i] - s.copX[i - 1], s.copY[i] - s.copY[i - 1]);
    if (s.copSpeed[i] > peak) peak = s.copSpeed[i];
    if (Number.isFinite(s.leadPct[i])) {
      leadSum += s.leadPct[i];
      leadN++;
    }
  }
  return {
    duration_s: s.time[to] - s.time[from],
    cop_path_mm: path,
    peak_cop_speed_mm_s: peak,
    mean_lead_pct: leadN > 0 ? leadSum / leadN : NaN,
  };
}

export function phaseRows(s: DerivedSeries, events: EventIndexes): PhaseRow[] {
  return PHASES.map((ph) => ({ name: ph.name, from: ph.from, to: ph.to, ...phaseStats(s, events[ph.from], events[ph.to]) }));
}

/** Tempo = backswing time / (top -> impact) time, i.e. (top - address) / (impact - top); ~3 is typical (Grober & Cholewicki). */
export function tempoRatio(s: DerivedSeries, events: EventIndexes): number {
  const t = s.time;
  return (t[events.top] - t[events.address]) / (t[events.impact] - t[events.top]);
}
