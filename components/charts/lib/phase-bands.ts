// Phase spans from the event times: each phase runs from its opening event to its closing event (PHASES).
import { PHASES, type PhaseName } from '@/lib/signal/types';
import type { SwingEvents } from './types';

export interface PhaseSpan {
  name: PhaseName;
  startS: number;
  endS: number;
}

/** A phase's name on a chart: the name itself (lib/signal/types.ts PHASE_NAMES), in lower case. */
export const phaseLabel = (name: PhaseName): string => name;

/** One span per phase with a positive duration, in swing order. */
export function phaseSpans(events: SwingEvents): PhaseSpan[] {
  const out: PhaseSpan[] = [];
  for (const p of PHASES) {
    const startS = events[p.from];
    const endS = events[p.to];
    if (Number.isFinite(startS) && Number.isFinite(endS) && endS > startS) out.push({ name: p.name, startS, endS });
  }
  return out;
}

/** The phase that contains t (start inclusive), or null before address / after finish. */
export function phaseAt(events: SwingEvents, t: number): PhaseName | null {
  for (const s of phaseSpans(events)) if (t >= s.startS && t < s.endS) return s.name;
  return null;
}
