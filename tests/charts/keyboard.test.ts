import { describe, expect, it } from 'vitest';
import { stepCursor, stepForKey } from '@/components/charts/lib/keyboard';
import { labelRows, placeLabels } from '@/components/charts/lib/label-layout';
import { phaseAt, phaseSpans } from '@/components/charts/lib/phase-bands';
import type { SwingEvents } from '@/components/charts/lib/types';

const time = Float64Array.from({ length: 301 }, (_, i) => i / 100);
const ev: SwingEvents = { address: 0.8, top: 1.6, transition: 1.7, impact: 1.9, finish: 2.2 };

describe('stepForKey(key, shift)', () => {
  it('maps arrows, Shift+arrows, brackets and Home/End', () => {
    expect(stepForKey('ArrowLeft', false)).toBe('prev-sample');
    expect(stepForKey('ArrowRight', false)).toBe('next-sample');
    expect(stepForKey('ArrowLeft', true)).toBe('prev-event');
    expect(stepForKey('ArrowRight', true)).toBe('next-event');
    expect(stepForKey('[', false)).toBe('prev-event');
    expect(stepForKey(']', false)).toBe('next-event');
    expect(stepForKey('Home', false)).toBe('first');
    expect(stepForKey('End', false)).toBe('last');
    expect(stepForKey('a', false)).toBeNull();
  });
});

describe('stepCursor(index, step, time, events, lo, hi)', () => {
  it('steps one sample and stays inside [lo, hi]', () => {
    expect(stepCursor(100, 'next-sample', time, ev, 50, 250)).toBe(101);
    expect(stepCursor(100, 'prev-sample', time, ev, 50, 250)).toBe(99);
    expect(stepCursor(250, 'next-sample', time, ev, 50, 250)).toBe(250);
    expect(stepCursor(50, 'prev-sample', time, ev, 50, 250)).toBe(50);
    expect(stepCursor(10, 'next-sample', time, ev, 50, 250)).toBe(51); // an outside cursor is clamped first
  });

  it('jumps event to event in swing order', () => {
    let i = 60;
    const seen: number[] = [];
    for (let k = 0; k < 6; k++) {
      i = stepCursor(i, 'next-event', time, ev, 50, 250);
      seen.push(i);
    }
    expect(seen).toEqual([80, 160, 170, 190, 220, 220]); // stays on finish: no later event
    expect(stepCursor(175, 'prev-event', time, ev, 50, 250)).toBe(170);
    expect(stepCursor(170, 'prev-event', time, ev, 50, 250)).toBe(160);
    expect(stepCursor(80, 'prev-event', time, ev, 50, 250)).toBe(80);
  });

  it('skips events outside the visible range; Home/End go to its ends', () => {
    expect(stepCursor(100, 'next-event', time, ev, 50, 165)).toBe(160);
    expect(stepCursor(160, 'next-event', time, ev, 50, 165)).toBe(160);
    expect(stepCursor(100, 'first', time, ev, 50, 250)).toBe(50);
    expect(stepCursor(100, 'last', time, ev, 50, 250)).toBe(250);
    expect(() => stepCursor(0, 'first', time, ev, 5, 4)).toThrow(RangeError);
  });
});

describe('phaseSpans(events) / phaseAt', () => {
  it('gives the four phases between the five events', () => {
    expect(phaseSpans(ev)).toEqual([
      { name: 'backswing', startS: 0.8, endS: 1.6 },
      { name: 'transition', startS: 1.6, endS: 1.7 },
      { name: 'downswing', startS: 1.7, endS: 1.9 },
      { name: 'follow-through', startS: 1.9, endS: 2.2 },
    ]);
    expect(phaseAt(ev, 1.65)).toBe('transition');
    expect(phaseAt(ev, 1.9)).toBe('follow-through'); // start inclusive
    expect(phaseAt(ev, 0.5)).toBeNull();
    expect(phaseAt(ev, 2.2)).toBeNull();
  });
});

describe('labelRows(slots)', () => {
  it('moves an overlapping label to the next row and reuses the first row when there is room', () => {
    // top and transition 10 px apart with 40 px labels overlap; impact is far enough to go back to row 0
    expect(labelRows([{ x: 100, width: 40 }, { x: 110, width: 40 }, { x: 200, width: 40 }])).toEqual([0, 1, 0]);
  });
});

describe('placeLabels(slots, maxX)', () => {
  // The property the issue asks for: no two labels in one row overlap, and every label stays inside [0, maxX].
  const overlapFree = (slots: { x: number; width: number }[], out: { row: number; x: number }[], gap: number) => {
    for (let i = 0; i < slots.length; i++) {
      const a = out[i];
      expect(a.x - slots[i].width / 2).toBeGreaterThanOrEqual(-1e-9);
      for (let j = i + 1; j < slots.length; j++) {
        const b = out[j];
        if (a.row !== b.row) continue;
        const apart = Math.abs(a.x - b.x) - (slots[i].width + slots[j].width) / 2;
        expect(apart).toBeGreaterThanOrEqual(gap - 1e-9);
      }
    }
  };

  it('five labels on one pixel (the whole-recording zoom): three rows, staggered, none overlapping', () => {
    const slots = ['address', 'top', 'transition', 'impact', 'finish'].map((n) => ({ x: 300, width: n.length * 10.5 * 0.56 }));
    const out = placeLabels(slots, 800, 4, 3);
    overlapFree(slots, out, 4);
    expect(new Set(out.map((o) => o.row)).size).toBe(3);
  });

  it('top and transition 3 px apart keep their own x in two rows; a label at the right edge slides in', () => {
    const slots = [{ x: 400, width: 20 }, { x: 403, width: 56 }, { x: 798, width: 30 }];
    const out = placeLabels(slots, 800);
    expect(out[0]).toEqual({ row: 0, x: 400 });
    expect(out[1]).toEqual({ row: 1, x: 403 });
    expect(out[2].x).toBe(785);
    overlapFree(slots, out, 4);
  });
});
