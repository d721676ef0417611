import { describe, expect, it } from 'vitest';
import { copOf, DEFAULT_DERIVE, derivativeWindowFor, derive, sensorRegion, toStanceFrame } from '@/lib/signal/derive';
import { SignalInputError } from '@/lib/signal/errors';
import { zeroLagLowpass } from '@/lib/signal/filter';
import { BUILTIN_LAYOUT_FILES, BUILTIN_LAYOUTS, builtinLayout } from '@/lib/signal/layouts';
import { parseLayout } from '@/lib/signal/read';
import type { SensorLayout, UniformRecording } from '@/lib/signal/types';

// Invented layout: two sensors per foot, heel (y 30) and toe (y 200); x = medial offset in the foot frame.
const layout: SensorLayout = parseLayout({
  id: 'test-2',
  name: 'two per foot',
  foot_length_mm: 260,
  sensors: [
    { id: 'L1', foot: 'left', x_mm: 10, y_mm: 30, area_mm2: 700 },
    { id: 'L2', foot: 'left', x_mm: -20, y_mm: 200, area_mm2: 500 },
    { id: 'R1', foot: 'right', x_mm: 10, y_mm: 30, area_mm2: 700 },
    { id: 'R2', foot: 'right', x_mm: -20, y_mm: 200, area_mm2: 500 },
  ],
});

function uniform(n: number, fs: number, f: (id: string, i: number) => number): UniformRecording {
  const ids = ['L1', 'L2', 'R1', 'R2'];
  return {
    sampleRateHz: fs,
    time: Float64Array.from({ length: n }, (_, i) => i / fs),
    sensorIds: ids,
    forces: ids.map((id) => Float64Array.from({ length: n }, (_, i) => f(id, i))),
    impact: null,
    gaps: [],
  };
}
const constant = (v: Record<string, number>) => uniform(100, 100, (id) => v[id]);

describe('copOf(forces, xs, ys)', () => {
  it('gives the worked example', () => {
    // COP = Σ p_i r_i / Σ p_i (Winter 1995, Gait & Posture 3:193 [citation from memory]), computed by hand: p = [100, 300] at (0,0), (0.1,0.2) m -> (0.075, 0.150) m
    const c = copOf([100, 300], [0, 0.1], [0, 0.2]);
    expect(c.x).toBeCloseTo(0.075, 12);
    expect(c.y).toBeCloseTo(0.15, 12);
    expect(c.total).toBe(400);
  });
  it('is NaN without load', () => {
    expect(Number.isNaN(copOf([0, 0], [0, 1], [0, 1]).x)).toBe(true);
  });
});

describe('derive(u, layout, params)', () => {
  const forces = { L1: 300, L2: 100, R1: 50, R2: 150 };

  it('gives per-foot totals, lead, heel and toe shares', () => {
    const d = derive(constant(forces), layout, { handedness: 'right', stanceWidthMm: 400 });
    // spec section 4: lead_pct = lead-foot force / total x 100; lead = left foot for a right-handed golfer
    expect(d.leftN[50]).toBeCloseTo(400, 9);
    expect(d.rightN[50]).toBeCloseTo(200, 9);
    expect(d.leadPct[50]).toBeCloseTo(66.6667, 3);
    expect(d.leadHeelPct[50]).toBeCloseTo(75, 9);
    expect(d.leadToePct[50]).toBeCloseTo(25, 9);
    expect(d.trailHeelPct[50]).toBeCloseTo(25, 9);
    const lefty = derive(constant(forces), layout, { handedness: 'left', stanceWidthMm: 400 });
    expect(lefty.leadPct[50]).toBeCloseTo(33.3333, 3);
    expect(lefty.leadHeelPct[50]).toBeCloseTo(25, 9);
  });

  it('gives per-foot COP in the foot frame and the net COP of both feet in the stance frame', () => {
    const w = 400;
    const d = derive(constant(forces), layout, { handedness: 'right', stanceWidthMm: w });
    const left = copOf([300, 100], [10, -20], [30, 200]);
    const right = copOf([50, 150], [10, -20], [30, 200]);
    expect(d.leftCopX[10]).toBeCloseTo(left.x, 9);
    expect(d.leftCopY[10]).toBeCloseTo(left.y, 9);
    expect(d.rightCopX[10]).toBeCloseTo(right.x, 9);
    // Winter 1995 [MEM]: COP_net = (COP_L Fz_L + COP_R Fz_R) / (Fz_L + Fz_R), each foot's COP in the stance frame
    const lead = toStanceFrame(left.x, left.y, true, w, 260);
    const trail = toStanceFrame(right.x, right.y, false, w, 260);
    expect(d.copX[10]).toBeCloseTo((lead.x * 400 + trail.x * 200) / 600, 9);
    expect(d.copY[10]).toBeCloseTo((lead.y * 400 + trail.y * 200) / 600, 9);
  });

  it('puts the lead foot at +w/2 with its medial side toward the trail foot', () => {
    // spec section 2: X toward the target, lead centreline +w/2, trail -w/2; foot-frame +x is medial
    const leadOnly = derive(constant({ L1: 500, L2: 0, R1: 0, R2: 0 }), layout, { handedness: 'right', stanceWidthMm: 400 });
    expect(leadOnly.copX[50]).toBeCloseTo(200 - 10, 9);
    expect(leadOnly.copY[50]).toBeCloseTo(30 - 130, 9);
    expect(Number.isNaN(leadOnly.rightCopX[50])).toBe(true); // the unloaded foot has no COP
    const trailOnly = derive(constant({ L1: 500, L2: 0, R1: 0, R2: 0 }), layout, { handedness: 'left', stanceWidthMm: 400 });
    expect(trailOnly.copX[50]).toBeCloseTo(-200 + 10, 9);
    expect(trailOnly.leadPct[50]).toBeCloseTo(0, 9);
  });

  it('gives NaN shares and COP when the feet carry no load', () => {
    const d = derive(uniform(100, 100, (id, i) => (i >= 40 && i < 60 ? 0 : id === 'L1' ? 400 : 0)), layout, {
      handedness: 'right',
      stanceWidthMm: 400,
    });
    expect(Number.isNaN(d.leadPct[50])).toBe(true);
    expect(Number.isNaN(d.copX[50])).toBe(true);
    expect(Number.isNaN(d.copVx[50])).toBe(true);
    expect(d.leadPct[10]).toBeCloseTo(100, 6);
  });

  it('clamps negative filter overshoot to 0 N', () => {
    const u = uniform(200, 100, (id, i) => (id === 'L1' && i >= 100 ? 800 : 0));
    const d = derive(u, layout, { handedness: 'right', stanceWidthMm: 400 });
    const unclamped = zeroLagLowpass(u.forces[0], 100, DEFAULT_DERIVE.cutoffHz);
    expect(Math.min(...unclamped)).toBeLessThan(-1); // the zero-lag step response dips below 0 before the step
    unclamped.forEach((v, i) => expect(d.leftN[i]).toBe(Math.max(0, v)));
    expect(d.leftN[150]).toBeCloseTo(800, 3);
  });

  it('differentiates a COP moving at constant speed', () => {
    // Lead foot only: f(L1) = 500 - k t, f(L2) = k t, so x = 10 - 30 k t / 500 and y = 30 + 170 k t / 500 (mm).
    const k = 200; // N/s over 2 s: the load moves from heel to toe
    const u = uniform(201, 100, (id, i) => (id === 'L1' ? 500 - (k * i) / 100 : id === 'L2' ? (k * i) / 100 : 0));
    const d = derive(u, layout, { handedness: 'right', stanceWidthMm: 400 });
    for (const i of [50, 100, 150]) {
      expect(d.copVx[i]).toBeCloseTo((30 * k) / 500, 6); // X = w/2 - x, so +12 mm/s toward the target
      expect(d.copVy[i]).toBeCloseTo((170 * k) / 500, 6);
      expect(d.copSpeed[i]).toBeCloseTo(Math.hypot(12, 68), 6);
    }
  });

  it('uses documented defaults and refuses recordings too short to filter', () => {
    expect(DEFAULT_DERIVE.cutoffHz).toBe(20);
    expect(DEFAULT_DERIVE.filterOrder).toBe(2);
    expect(derivativeWindowFor(100)).toBe(11);
    expect(derivativeWindowFor(500)).toBe(55);
    expect(derivativeWindowFor(20)).toBe(5);
    expect(() => derive(uniform(8, 100, () => 1), layout, { handedness: 'right', stanceWidthMm: 400 })).toThrow(SignalInputError);
    expect(() => derive(constant(forces), layout, { handedness: 'up' as 'right', stanceWidthMm: 400 })).toThrow(RangeError);
  });

  it('does not mutate the recording', () => {
    const u = uniform(100, 100, (id, i) => (id === 'L1' ? (i % 7) * 10 : 5));
    const before = u.forces.map((f) => Float64Array.from(f));
    derive(u, layout, { handedness: 'right', stanceWidthMm: 400 });
    expect(u.forces).toEqual(before);
  });
});

describe('regions and built-in layouts', () => {
  it('counts sensors below half the foot length as heel unless a region is given', () => {
    expect(sensorRegion({ id: 'L1', foot: 'left', x_mm: 0, y_mm: 129, area_mm2: 1 }, 260)).toBe('heel');
    expect(sensorRegion({ id: 'L1', foot: 'left', x_mm: 0, y_mm: 130, area_mm2: 1 }, 260)).toBe('toe');
    expect(sensorRegion({ id: 'L1', foot: 'left', x_mm: 0, y_mm: 200, area_mm2: 1, region: 'heel' }, 260)).toBe('heel');
  });
  it('ships pair-8 and pair-16 with the same foot-frame positions on both feet', () => {
    for (const [id, per] of [['pair-8', 8], ['pair-16', 16]] as const) {
      const l = builtinLayout(id)!;
      expect(l.sensors.length).toBe(2 * per);
      const left = l.sensors.filter((s) => s.foot === 'left');
      const right = l.sensors.filter((s) => s.foot === 'right');
      left.forEach((s, i) => expect([right[i].x_mm, right[i].y_mm]).toEqual([s.x_mm, s.y_mm]));
    }
    expect(builtinLayout('nope')).toBeUndefined();
    expect(Object.keys(BUILTIN_LAYOUTS)).toEqual(['pair-8', 'pair-16']);
  });
  it('ships layout files that the layout schema accepts unchanged (they are not parsed at start-up)', () => {
    for (const id of ['pair-8', 'pair-16']) {
      expect(parseLayout(BUILTIN_LAYOUT_FILES[id])).toEqual(BUILTIN_LAYOUTS[id]);
      expect(Object.isFrozen(BUILTIN_LAYOUTS[id].sensors[0])).toBe(true);
    }
  });
});
