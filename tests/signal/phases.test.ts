import { describe, expect, it } from 'vitest';
import { atEvent, phaseRows, phaseStats, tempoRatio } from '@/lib/signal/phases';
import type { DerivedSeries } from '@/lib/signal/types';

// A hand-built series: 11 samples at 10 Hz, COP moving on a 3-4-5 triangle so path lengths are exact.
function series(): DerivedSeries {
  const n = 11;
  const f = (g: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => g(i));
  const copX = f((i) => 3 * i);
  const copY = f((i) => 4 * i);
  return {
    sampleRateHz: 10,
    time: f((i) => 2 + i / 10),
    leftN: f(() => 400),
    rightN: f(() => 400),
    totalN: f(() => 800),
    leadPct: f((i) => 40 + 2 * i),
    leadHeelPct: f((i) => 50 + i),
    trailHeelPct: f((i) => 60 - i),
    leadToePct: f((i) => 50 - i),
    trailToePct: f((i) => 40 + i),
    leftCopX: f(() => 0),
    leftCopY: f(() => 0),
    rightCopX: f(() => 0),
    rightCopY: f(() => 0),
    copX,
    copY,
    copVx: f(() => 30),
    copVy: f(() => 40),
    copSpeed: f((i) => 50 + i),
  };
}

describe('phaseStats(series, from, to)', () => {
  it('gives duration, planar COP path, peak speed and mean lead %', () => {
    const p = phaseStats(series(), 2, 6);
    expect(p.duration_s).toBeCloseTo(0.4, 12);
    expect(p.cop_path_mm).toBeCloseTo(20, 12); // 4 steps of a 3-4-5 triangle: 4 x 5 mm (Pythagoras)
    expect(p.peak_cop_speed_mm_s).toBe(56);
    expect(p.mean_lead_pct).toBeCloseTo(48, 12); // mean of 44, 46, 48, 50, 52
  });
  it('throws RangeError on bad bounds', () => {
    expect(() => phaseStats(series(), 5, 4)).toThrow(RangeError);
    expect(() => phaseStats(series(), 0, 11)).toThrow(RangeError);
  });
});

describe('phaseRows / atEvent / tempoRatio', () => {
  const events = { address: 0, top: 6, transition: 7, impact: 8, finish: 10 };
  it('rows follow PHASES: backswing, transition, downswing, follow-through', () => {
    const rows = phaseRows(series(), events);
    expect(rows.map((r) => r.name)).toEqual(['backswing', 'transition', 'downswing', 'follow-through']);
    expect(rows.map((r) => [r.from, r.to])).toEqual([['address', 'top'], ['top', 'transition'], ['transition', 'impact'], ['impact', 'finish']]);
    expect(rows.reduce((s, r) => s + r.duration_s, 0)).toBeCloseTo(1, 12);
  });
  it('reads the values at an event sample', () => {
    expect(atEvent(series(), 3)).toEqual({ lead_pct: 46, lead_heel_pct: 53, trail_heel_pct: 57, cop_x_mm: 9, cop_y_mm: 12 });
  });
  it('tempo = (top - address) / (impact - top)', () => {
    expect(tempoRatio(series(), events)).toBeCloseTo(3, 12); // 0.6 s / 0.2 s; ~3:1 is typical (Grober & Cholewicki)
  });
});
