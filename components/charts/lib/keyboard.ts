// Keyboard stepping of the cursor: one sample with the arrow keys, event to event with Shift+arrow or [ and ],
// and to the ends of the visible range with Home / End.
import { EVENT_NAMES } from '@/lib/signal/types';
import { nearestIndex } from './nearest';
import type { NumArray, SwingEvents } from './types';

export type CursorStep = 'prev-sample' | 'next-sample' | 'prev-event' | 'next-event' | 'first' | 'last';

/** The step a key press asks for, or null when the key is not ours. */
export function stepForKey(key: string, shiftKey: boolean): CursorStep | null {
  if (key === 'ArrowLeft') return shiftKey ? 'prev-event' : 'prev-sample';
  if (key === 'ArrowRight') return shiftKey ? 'next-event' : 'next-sample';
  if (key === '[') return 'prev-event';
  if (key === ']') return 'next-event';
  if (key === 'Home') return 'first';
  if (key === 'End') return 'last';
  return null;
}

/**
 * The cursor's new sample index, kept inside [lo, hi]. Event steps go to the nearest event strictly after
 * (or before) the cursor; with no such event the cursor stays put.
 */
export function stepCursor(index: number, step: CursorStep, time: NumArray, events: SwingEvents, lo: number, hi: number): number {
  if (!(lo <= hi)) throw new RangeError(`cursor range must have lo <= hi, got [${lo}, ${hi}]`);
  const clamp = (i: number) => Math.min(hi, Math.max(lo, i));
  const i = clamp(index);
  switch (step) {
    case 'prev-sample':
      return clamp(i - 1);
    case 'next-sample':
      return clamp(i + 1);
    case 'first':
      return lo;
    case 'last':
      return hi;
    case 'next-event': {
      const marks = EVENT_NAMES.map((n) => nearestIndex(time, events[n])).filter((k) => k > i && k <= hi);
      return marks.length ? Math.min(...marks) : i;
    }
    case 'prev-event': {
      const marks = EVENT_NAMES.map((n) => nearestIndex(time, events[n])).filter((k) => k < i && k >= lo);
      return marks.length ? Math.max(...marks) : i;
    }
  }
}
