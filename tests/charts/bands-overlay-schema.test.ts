import { describe, expect, it } from 'vitest';
import { bandOnTime } from '@/components/charts/lib/bands';
import { forceRadius, insoleOutline, isLeadFoot, sensorsInStance } from '@/components/charts/lib/insole';
import { alignOverlay } from '@/components/charts/lib/overlay';
import { textWidth } from '@/components/charts/lib/label-layout';
import { placeLabels } from '@/components/charts/lib/point-labels';
import { traceSeriesSchema } from '@/components/charts/lib/series-schema';
import { builtinLayout } from '@/lib/signal/layouts';
import type { SwingEvents, TraceSeries } from '@/components/charts/lib/types';

const ev: SwingEvents = { address: 1, top: 2, transition: 2.1, impact: 2.3, finish: 3 };

describe('bandOnTime(band, events)', () => {
  it('passes a band already on time through unchanged', () => {
    const b = bandOnTime({ label: 'r', axis: 'time', x: [1, 2], lower: [10, 20], upper: [30, 40] }, ev);
    expect(Array.from(b.time)).toEqual([1, 2]);
  });

  it('carries registered positions onto this swing through its events (piecewise linear inverse warp)', () => {
    // Ramsay & Silverman, Functional Data Analysis ch. 8, landmark registration: position p between landmarks k and
    // k+1 maps to t_k + (p - p_k)(t_{k+1} - t_k)/(p_{k+1} - p_k). Worked by hand with landmarks 0, 25, 50, 75, 100:
    // 0 -> 1 (address), 12.5 -> 1.5, 25 -> 2 (top), 62.5 -> 2.2, 100 -> 3 (finish).
    const b = bandOnTime({ label: 'r', axis: 'swing-pct', x: [0, 12.5, 25, 62.5, 100], lower: [0, 0, 0, 0, 0], upper: [1, 1, 1, 1, 1], landmarks: [0, 25, 50, 75, 100] }, ev);
    const t = Array.from(b.time);
    [1, 1.5, 2, 2.2, 3].forEach((v, i) => expect(t[i]).toBeCloseTo(v, 12));
  });

  it('says what is wrong with a malformed band', () => {
    expect(() => bandOnTime({ label: 'bad', axis: 'time', x: [1, 2], lower: [1], upper: [1, 2] }, ev)).toThrow(/"bad".*same length/);
    expect(() => bandOnTime({ label: 'bad', axis: 'swing-pct', x: [0], lower: [0], upper: [0] }, ev)).toThrow(/5 landmarks/);
  });
});

describe('alignOverlay(overlay, events)', () => {
  it('shifts the other swing so both impacts coincide', () => {
    const series = { time: [10, 10.5, 11] } as unknown as TraceSeries;
    const other: SwingEvents = { address: 9.5, top: 10.2, transition: 10.3, impact: 10.5, finish: 11 };
    const t = Array.from(alignOverlay({ label: 'o', series, events: other }, ev).time);
    [1.8, 2.3, 2.8].forEach((v, i) => expect(t[i]).toBeCloseTo(v, 12)); // 2.3 - 10.5 = -8.2 s shift
  });
});

describe('traceSeriesSchema', () => {
  const ok = { time: [0, 0.01], leadPct: [50, null], leadHeelPct: [1, 2], trailHeelPct: [1, 2], copX: [0, 0], copY: [0, 0], copSpeed: [0, 0] };
  it('turns null (JSON has no NaN) back into NaN', () => {
    const s = traceSeriesSchema.parse(ok);
    expect(Number.isNaN(s.leadPct[1])).toBe(true);
    expect(s.time).toBeInstanceOf(Float64Array);
  });
  it('names the field that is wrong', () => {
    const r = traceSeriesSchema.safeParse({ ...ok, copSpeed: [0] });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(['copSpeed']);
    const r2 = traceSeriesSchema.safeParse({ ...ok, time: [0, 0] });
    expect(r2.error?.issues[0].path).toEqual(['time', 1]);
  });
});

describe('insole geometry', () => {
  const layout = builtinLayout('pair-8')!;
  it('puts the lead insole toward the target and mirrors medial sides', () => {
    expect(isLeadFoot('left', 'right')).toBe(true);
    expect(isLeadFoot('left', 'left')).toBe(false);
    const lead = insoleOutline(layout, true, 400);
    const trail = insoleOutline(layout, false, 400);
    // centreline of the lead foot at +w/2, trail at -w/2 (README stance frame); heel back at y = -L/2, toe at +L/2
    expect(Math.min(...lead.map((p) => p[0]))).toBeGreaterThan(0);
    expect(Math.max(...trail.map((p) => p[0]))).toBeLessThan(0);
    expect(Math.min(...lead.map((p) => p[1]))).toBe(-130);
    expect(Math.max(...lead.map((p) => p[1]))).toBe(130);
  });
  it('keeps every sensor of the built-in layout inside its insole outline', () => {
    const inside = (pt: [number, number], poly: [number, number][]) => {
      // even-odd ray casting (Shimrat, CACM 1962, algorithm 112)
      let c = false;
      for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
        const [xi, yi] = poly[i];
        const [xj, yj] = poly[j];
        if (yi > pt[1] !== yj > pt[1] && pt[0] < ((xj - xi) * (pt[1] - yi)) / (yj - yi) + xi) c = !c;
      }
      return c;
    };
    const lead = insoleOutline(layout, true, 400);
    const trail = insoleOutline(layout, false, 400);
    for (const s of sensorsInStance(layout, 'right', 400)) expect(inside([s.x, s.y], s.lead ? lead : trail)).toBe(true);
  });
  it('grows dot area with force and keeps a minimum dot', () => {
    expect(forceRadius(0, 100)).toBe(2.5);
    expect(forceRadius(100, 100)).toBe(11);
    // area proportional to force: r - rMin scales with sqrt(f / fMax); a quarter of the force gives half the growth
    expect(forceRadius(25, 100)).toBeCloseTo(2.5 + 8.5 / 2, 12);
    expect(forceRadius(NaN, 100)).toBe(2.5);
  });
});

describe('placeLabels(points)', () => {
  it('never lets two placed labels overlap, and drops one that cannot fit', () => {
    const pts = Array.from({ length: 12 }, (_, i) => ({ x: 50, y: 50, text: `event ${i}` }));
    const out = placeLabels(pts);
    expect(out[0]).not.toBeNull();
    expect(out.some((l) => l === null)).toBe(true);
    // the same text everywhere, so every label box is w x h with w from textWidth and h = font + 2
    const w = textWidth('event 0', 9.5);
    const h = 9.5 + 2;
    const boxes = out.filter((l) => l !== null).map((l) => {
      const x0 = l!.anchor === 'start' ? l!.x : l!.anchor === 'end' ? l!.x - w : l!.x - w / 2;
      return { x0, x1: x0 + w, y0: l!.y - h / 2, y1: l!.y + h / 2 };
    });
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i];
        const b = boxes[j];
        expect(a.x0 < b.x1 - 1e-9 && b.x0 < a.x1 - 1e-9 && a.y0 < b.y1 - 1e-9 && b.y0 < a.y1 - 1e-9).toBe(false);
      }
  });
});
