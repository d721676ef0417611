// Property tests of the derived series (fast-check): invariants that hold for any non-negative forces.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { copOf, derive } from '@/lib/signal/derive';
import { builtinLayout } from '@/lib/signal/layouts';
import type { Handedness, UniformRecording } from '@/lib/signal/types';

const layout = builtinLayout('pair-8')!;
const ids = layout.sensors.map((s) => s.id);
const N = 24;

function recording(forces: number[][]): UniformRecording {
  return {
    sampleRateHz: 100,
    time: Float64Array.from({ length: N }, (_, i) => i / 100),
    sensorIds: ids,
    forces: forces.map((f) => Float64Array.from(f)),
    impact: null,
    gaps: [],
  };
}

const force = fc.double({ min: 0, max: 2000, noNaN: true });
const channels = fc.array(fc.array(force, { minLength: N, maxLength: N }), { minLength: ids.length, maxLength: ids.length });
const constantChannels = fc.array(fc.oneof(fc.constant(0), fc.double({ min: 1, max: 2000, noNaN: true })), {
  minLength: ids.length,
  maxLength: ids.length,
});
const handedness = fc.constantFrom<Handedness>('right', 'left');

/** Andrew's monotone chain; returns the hull counter-clockwise (collinear points dropped). */
function hull(points: [number, number][]): [number, number][] {
  const p = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (p.length < 3) return p;
  const cross = (o: number[], a: number[], b: number[]) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: [number, number][] = [];
  for (const q of p) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], q) <= 0) lower.pop();
    lower.push(q);
  }
  const upper: [number, number][] = [];
  for (const q of p.reverse()) {
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], q) <= 0) upper.pop();
    upper.push(q);
  }
  const h = [...lower.slice(0, -1), ...upper.slice(0, -1)];
  return h.length ? h : [p[0]]; // all points equal
}

/** Distance from the point to the hull (0 inside), so degenerate hulls (a point, a segment) work too. */
function distanceOutside(pt: [number, number], h: [number, number][]): number {
  const seg = (a: number[], b: number[]) => {
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const len2 = dx * dx + dy * dy;
    const t = len2 ? Math.max(0, Math.min(1, ((pt[0] - a[0]) * dx + (pt[1] - a[1]) * dy) / len2)) : 0;
    return Math.hypot(pt[0] - a[0] - t * dx, pt[1] - a[1] - t * dy);
  };
  if (h.length === 1) return Math.hypot(pt[0] - h[0][0], pt[1] - h[0][1]);
  if (h.length >= 3) {
    const inside = h.every((a, i) => {
      const b = h[(i + 1) % h.length];
      return (b[0] - a[0]) * (pt[1] - a[1]) - (b[1] - a[1]) * (pt[0] - a[0]) >= -1e-9;
    });
    if (inside) return 0;
  }
  return Math.min(...h.map((a, i) => seg(a, h[(i + 1) % h.length])));
}

describe('properties of derive', () => {
  it('lead, heel and toe shares stay within 0..100 %', () => {
    fc.assert(
      fc.property(channels, handedness, (f, hand) => {
        const d = derive(recording(f), layout, { handedness: hand, stanceWidthMm: 400 });
        for (const series of [d.leadPct, d.leadHeelPct, d.trailHeelPct, d.leadToePct, d.trailToePct]) {
          for (const v of series) if (!Number.isNaN(v)) expect(v >= -1e-9 && v <= 100 + 1e-9).toBe(true);
        }
      }),
      { numRuns: 60 },
    );
  });

  it('copOf lies inside the convex hull of the loaded sensors (strictly positive forces)', () => {
    const foot = layout.sensors.filter((s) => s.foot === 'left');
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 1e4, noNaN: true })), { minLength: 8, maxLength: 8 }), (f) => {
        fc.pre(f.some((v) => v > 0));
        const c = copOf(f, foot.map((s) => s.x_mm), foot.map((s) => s.y_mm));
        const loaded = foot.filter((_, i) => f[i] > 0).map((s): [number, number] => [s.x_mm, s.y_mm]);
        expect(distanceOutside([c.x, c.y], hull(loaded))).toBeLessThan(1e-6);
      }),
    );
  });

  it('per-foot COP from derive lies inside the hull of the loaded sensors (constant forces)', () => {
    fc.assert(
      fc.property(constantChannels, (level) => {
        const d = derive(recording(level.map((v) => new Array(N).fill(v))), layout, { handedness: 'right', stanceWidthMm: 400 });
        for (const foot of ['left', 'right'] as const) {
          const loaded = layout.sensors
            .map((s, i) => [s, level[i]] as const)
            .filter(([s, v]) => s.foot === foot && v > 0)
            .map(([s]): [number, number] => [s.x_mm, s.y_mm]);
          const x = foot === 'left' ? d.leftCopX : d.rightCopX;
          const y = foot === 'left' ? d.leftCopY : d.rightCopY;
          if (loaded.length === 0) continue;
          if (Number.isNaN(x[12])) continue; // below the documented load threshold
          expect(distanceOutside([x[12], y[12]], hull(loaded))).toBeLessThan(1e-6);
        }
      }),
      { numRuns: 80 },
    );
  });

  it('mirroring the feet and the handedness gives the same lead share and stance-frame COP', () => {
    fc.assert(
      fc.property(channels, handedness, fc.double({ min: 0, max: 800, noNaN: true }), (f, hand, w) => {
        const mirrored = ids.map((id) => f[ids.indexOf((id[0] === 'L' ? 'R' : 'L') + id.slice(1))]);
        const other: Handedness = hand === 'right' ? 'left' : 'right';
        const a = derive(recording(f), layout, { handedness: hand, stanceWidthMm: w });
        const b = derive(recording(mirrored), layout, { handedness: other, stanceWidthMm: w });
        const same = (p: Float64Array, q: Float64Array) =>
          p.forEach((v, i) => (Number.isNaN(v) ? expect(q[i]).toBeNaN() : expect(Math.abs(v - q[i])).toBeLessThan(1e-9 * (1 + Math.abs(v)))));
        same(a.leadPct, b.leadPct);
        same(a.leadHeelPct, b.leadHeelPct);
        same(a.copX, b.copX);
        same(a.copY, b.copY);
      }),
      { numRuns: 40 },
    );
  });

  it('scaling all forces leaves shares and COP unchanged', () => {
    const loadedChannels = fc.array(fc.array(fc.double({ min: 10, max: 2000, noNaN: true }), { minLength: N, maxLength: N }), {
      minLength: ids.length,
      maxLength: ids.length,
    });
    fc.assert(
      fc.property(loadedChannels, fc.double({ min: 0.5, max: 100, noNaN: true }), (f, s) => {
        const a = derive(recording(f), layout, { handedness: 'right', stanceWidthMm: 400 });
        const b = derive(recording(f.map((c) => c.map((v) => v * s))), layout, { handedness: 'right', stanceWidthMm: 400 });
        // Compared where both are defined. Where a divisor is "no load" (below max(5 N, 1 % of the median total),
        // lib/signal/derive.ts) the value is NaN, and the 5 N floor does not scale with the forces: a filtered heel
        // total that undershoots near it after a step (as fast-check found, seed 1689595631) is NaN at one scale and
        // defined at the other. The invariance is a claim about the defined values.
        for (const key of ['leadPct', 'leadHeelPct', 'trailToePct', 'copX', 'copY', 'leftCopX', 'rightCopY'] as const) {
          a[key].forEach((v, i) => {
            const w = b[key][i];
            if (Number.isFinite(v) && Number.isFinite(w)) expect(Math.abs(v - w)).toBeLessThan(1e-7 * (1 + Math.abs(v)));
          });
        }
      }),
      { numRuns: 40 },
    );
  });
});
