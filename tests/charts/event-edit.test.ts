import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { allowedRange, commit, eventsInOrder, moveEvent, startHistory, undo, UNDO_LIMIT, windowIndexes } from '@/components/charts/lib/event-edit';
import { EVENT_NAMES } from '@/lib/signal/types';
import type { SwingEvents } from '@/components/charts/lib/types';

// 100 Hz over 0..3 s: sample i is at i / 100 s (written as i / 100 so the times are the exact doubles used below).
const time = Float64Array.from({ length: 301 }, (_, i) => i / 100);
const win = { startS: 0.5, endS: 2.5 };
const ev: SwingEvents = { address: 0.8, top: 1.6, transition: 1.7, impact: 1.9, finish: 2.2 };

describe('moveEvent(time, events, name, t, window)', () => {
  it('snaps to the nearest sample', () => {
    expect(moveEvent(time, ev, 'top', 1.5432, win).top).toBe(154 / 100);
    expect(moveEvent(time, ev, 'top', 1.5478, win).top).toBe(155 / 100);
  });

  it('clamps between the neighbouring events, one sample apart, so the order stays strict', () => {
    // top may go no later than one sample before transition (1.70 s) and no earlier than one after address (0.80 s)
    expect(moveEvent(time, ev, 'top', 1.95, win).top).toBe(169 / 100);
    expect(moveEvent(time, ev, 'top', 0.1, win).top).toBe(81 / 100);
  });

  it('keeps address and finish inside the swing window', () => {
    expect(moveEvent(time, ev, 'address', 0.2, win).address).toBe(50 / 100);
    expect(moveEvent(time, ev, 'finish', 2.9, win).finish).toBe(250 / 100);
  });

  it('leaves the other events untouched and returns the same object when nothing moves', () => {
    const next = moveEvent(time, ev, 'impact', 1.85, win);
    expect(next).toEqual({ ...ev, impact: 185 / 100 });
    expect(moveEvent(time, ev, 'impact', 1.9004, win)).toBe(ev);
  });

  it('cannot move an event squeezed between adjacent samples', () => {
    const tight: SwingEvents = { ...ev, top: 1.69, transition: 1.7, impact: 1.71 };
    expect(allowedRange(time, tight, 'transition', win)).toEqual([170, 170]);
    expect(moveEvent(time, tight, 'transition', 1.0, win).transition).toBe(1.7);
  });

  it('keeps any sequence of drags ordered and inside the window (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.constantFrom(...EVENT_NAMES), fc.double({ min: -1, max: 4, noNaN: true })), { maxLength: 40 }), (drags) => {
        let e = ev;
        for (const [name, t] of drags) {
          e = moveEvent(time, e, name, t, win);
          expect(eventsInOrder(e, win)).toBe(true);
          // on the sample grid
          expect(Math.abs(e[name] * 100 - Math.round(e[name] * 100))).toBeLessThan(1e-9);
        }
      }),
    );
  });

  it('rejects a window with too few samples', () => {
    expect(() => windowIndexes(time, { startS: 1, endS: 1.02 })).toThrow(/fewer samples/);
    expect(() => windowIndexes(time, { startS: 2, endS: 1 })).toThrow(RangeError);
  });
});

describe('commit / undo', () => {
  it('undo walks back through committed states and stops at the first', () => {
    let h = startHistory(ev);
    const a = moveEvent(time, ev, 'top', 1.5, win);
    const b = moveEvent(time, a, 'impact', 1.95, win);
    h = commit(h, a);
    h = commit(h, a); // unchanged: no new entry
    h = commit(h, b);
    expect(h.past).toHaveLength(2);
    h = undo(h);
    expect(h.present).toBe(a);
    h = undo(h);
    expect(h.present).toBe(ev);
    expect(undo(h)).toBe(h);
  });

  it('keeps at most UNDO_LIMIT entries', () => {
    let h = startHistory(ev);
    for (let k = 1; k <= UNDO_LIMIT + 5; k++) h = commit(h, { ...ev, address: ev.address - k / 1000 });
    expect(h.past).toHaveLength(UNDO_LIMIT);
  });
});
