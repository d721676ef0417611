// Moving an event marker: the new time snaps to the nearest sample and is clamped so that
// address < top < transition < impact < finish stays strictly ordered (at least one sample apart) and every event
// stays inside the swing window. Undo keeps the committed states (one entry per finished drag).
import { EVENT_NAMES, type EventName } from '@/lib/signal/types';
import { nearestIndex } from './nearest';
import type { NumArray, SwingEvents, TimeWindow } from './types';

/** First and last sample index inside the window. */
export function windowIndexes(time: NumArray, window: TimeWindow): [number, number] {
  if (!(window.endS > window.startS)) throw new RangeError(`swing window must have endS > startS, got [${window.startS}, ${window.endS}]`);
  let lo = nearestIndex(time, window.startS);
  if (time[lo] < window.startS) lo++;
  let hi = nearestIndex(time, window.endS);
  if (time[hi] > window.endS) hi--;
  if (hi - lo < EVENT_NAMES.length - 1) throw new RangeError('the swing window holds fewer samples than there are events');
  return [lo, hi];
}

/** The sample-index range an event may move within, given the other events. */
export function allowedRange(time: NumArray, events: SwingEvents, name: EventName, window: TimeWindow): [number, number] {
  const [wLo, wHi] = windowIndexes(time, window);
  const k = EVENT_NAMES.indexOf(name);
  if (k < 0) throw new RangeError(`unknown event "${name}"`);
  const prev = k > 0 ? nearestIndex(time, events[EVENT_NAMES[k - 1]]) + 1 : wLo;
  const next = k < EVENT_NAMES.length - 1 ? nearestIndex(time, events[EVENT_NAMES[k + 1]]) - 1 : wHi;
  return [Math.max(wLo, prev), Math.min(wHi, next)];
}

/** The events with `name` moved to the sample nearest t, clamped between its neighbours and the window. */
export function moveEvent(time: NumArray, events: SwingEvents, name: EventName, t: number, window: TimeWindow): SwingEvents {
  const [lo, hi] = allowedRange(time, events, name, window);
  if (hi < lo) return events; // neighbours are adjacent samples: nowhere to go
  const i = Math.min(hi, Math.max(lo, nearestIndex(time, t)));
  return events[name] === time[i] ? events : { ...events, [name]: time[i] };
}

/** True when the events are strictly increasing in swing order and inside the window. */
export function eventsInOrder(events: SwingEvents, window: TimeWindow): boolean {
  for (let k = 0; k < EVENT_NAMES.length; k++) {
    const t = events[EVENT_NAMES[k]];
    if (!Number.isFinite(t) || t < window.startS || t > window.endS) return false;
    if (k > 0 && !(t > events[EVENT_NAMES[k - 1]])) return false;
  }
  return true;
}

export function sameEvents(a: SwingEvents, b: SwingEvents): boolean {
  return EVENT_NAMES.every((n) => a[n] === b[n]);
}

/** Committed event states: `present` plus what undo goes back to. */
export interface EventHistory {
  past: SwingEvents[];
  present: SwingEvents;
}

export const UNDO_LIMIT = 50;

export function startHistory(events: SwingEvents): EventHistory {
  return { past: [], present: events };
}

/** Commit a new state; no entry when nothing changed. The oldest entries fall off past UNDO_LIMIT. */
export function commit(h: EventHistory, next: SwingEvents): EventHistory {
  if (sameEvents(h.present, next)) return h;
  const past = [...h.past, h.present];
  return { past: past.length > UNDO_LIMIT ? past.slice(past.length - UNDO_LIMIT) : past, present: next };
}

export function undo(h: EventHistory): EventHistory {
  if (h.past.length === 0) return h;
  return { past: h.past.slice(0, -1), present: h.past[h.past.length - 1] };
}
