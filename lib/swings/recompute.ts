// Values at the events, the phase table and the tempo ratio of one swing, from its stored full-rate window, with
// lib/signal's own functions (atEvents, phaseRows, tempoRatio) — the same code the analyzer ran, on the same
// samples, so an event at its automatic sample gives back exactly the automatic numbers.
import { atEvents, EVENT_NAMES, phaseRows, tempoRatio, type AtEvent, type EventName, type PhaseRow } from '@/lib/signal';
import { nearestSample, windowAsDerived, type StoredSwingSeries } from './stored-series';

export interface SwingNumbers {
  /** event times snapped to the nearest stored sample */
  times: Record<EventName, number>;
  /** sample index of each event inside the window */
  indexes: Record<EventName, number>;
  atEvents: Record<EventName, AtEvent>;
  phases: PhaseRow[];
  tempoRatio: number;
}

/** Sample index of each event time inside the window (nearest sample). */
export function snapToSamples(stored: StoredSwingSeries, times: Record<EventName, number>): Record<EventName, number> {
  const out = {} as Record<EventName, number>;
  for (const name of EVENT_NAMES) out[name] = nearestSample(stored.time, times[name]);
  return out;
}

/** Throws RangeError when the snapped events are not strictly ordered (phaseRows needs from <= to). */
export function recomputeSwing(stored: StoredSwingSeries, times: Record<EventName, number>): SwingNumbers {
  const indexes = snapToSamples(stored, times);
  EVENT_NAMES.forEach((name, k) => {
    if (k > 0 && !(indexes[name] > indexes[EVENT_NAMES[k - 1]])) {
      throw new RangeError(`${name} falls on or before ${EVENT_NAMES[k - 1]} at the stored sample rate`);
    }
  });
  const s = windowAsDerived(stored);
  const snapped = {} as Record<EventName, number>;
  for (const name of EVENT_NAMES) snapped[name] = stored.time[indexes[name]];
  return { times: snapped, indexes, atEvents: atEvents(s, indexes), phases: phaseRows(s, indexes), tempoRatio: tempoRatio(s, indexes) };
}
