import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { SwingTraceViewer } from '@/components/charts/swing-trace-viewer';
import { wholeTraceSeries } from '@/components/swings/swing-view-model';
import { coarsenDisplay } from '@/lib/swings/coarsen-display';
import { overviewOf, type DisplaySeries } from '@/lib/jobs/display-series';
import { syntheticSwings } from './synthetic-swing';

// "Whole recording": the recording's display series, coarsened for the payload, drawn by the viewer at that zoom.
// coarsenDisplay merges k neighbouring min/max buckets; the check recomputes each merged bucket directly from the
// definition (min of the mins, max of the maxes over buckets [i*k, i*k+k)) with Math.min/Math.max over a slice.

function display(n: number, seed: number): Pick<DisplaySeries, 'bucketS' | 't' | 'traces'> {
  let x = seed;
  const rnd = () => ((x = (x * 16807) % 2147483647) / 2147483647);
  const min: (number | null)[] = [];
  const max: (number | null)[] = [];
  for (let i = 0; i < n; i++) {
    if (i % 97 === 5) {
      min.push(null); // a bucket with no load
      max.push(null);
      continue;
    }
    const a = Math.round(rnd() * 10000) / 100;
    const b = Math.round(rnd() * 10000) / 100;
    min.push(Math.min(a, b));
    max.push(Math.max(a, b));
  }
  const trace = { min, max };
  const traces = { lead_pct: trace, lead_heel_pct: trace, trail_heel_pct: trace, cop_x_mm: trace, cop_y_mm: trace, cop_speed_mm_s: trace, left_n: trace, right_n: trace, total_n: trace };
  return { bucketS: 0.05, t: Array.from({ length: n }, (_, i) => Math.round(i * 0.05 * 1000) / 1000), traces };
}

describe('coarsenDisplay', () => {
  it('merges k buckets into one: min of mins, max of maxes, start time of the first; at most maxBuckets', () => {
    const d = display(2000, 7);
    const c = coarsenDisplay(d, ['lead_pct'], 600);
    const k = Math.ceil(2000 / 600); // 4
    expect(c.t).toHaveLength(Math.ceil(2000 / k));
    expect(c.t.length).toBeLessThanOrEqual(600);
    expect(c.bucketS).toBeCloseTo(0.05 * k, 12);
    c.t.forEach((t, i) => {
      expect(t).toBe(d.t[i * k]);
      const mins = d.traces.lead_pct.min.slice(i * k, i * k + k).filter((v): v is number => v !== null);
      const maxs = d.traces.lead_pct.max.slice(i * k, i * k + k).filter((v): v is number => v !== null);
      expect(c.traces.lead_pct.min[i]).toBe(mins.length ? Math.min(...mins) : null);
      expect(c.traces.lead_pct.max[i]).toBe(maxs.length ? Math.max(...maxs) : null);
    });
    // the extremes of the whole recording survive
    const all = (a: (number | null)[]) => a.filter((v): v is number => v !== null);
    expect(Math.min(...all(c.traces.lead_pct.min))).toBe(Math.min(...all(d.traces.lead_pct.min)));
    expect(Math.max(...all(c.traces.lead_pct.max))).toBe(Math.max(...all(d.traces.lead_pct.max)));
  });

  it('leaves a small series alone and refuses a bad bucket count', () => {
    const d = display(300, 3);
    expect(coarsenDisplay(d, ['lead_pct'], 1000)).toBe(d);
    expect(() => coarsenDisplay(d, ['lead_pct'], 0)).toThrow(RangeError);
  });
});

describe('SwingTraceViewer at "Whole recording"', () => {
  const data = syntheticSwings(7, 2);
  const [first] = data.swings;
  const t = Array.from(data.series.time);
  const base = { series: data.series, window: first.window, events: first.events, layout: data.layout, handedness: 'right' as const, stanceWidthMm: 400, sensorFrames: first.frames };
  // a whole recording that runs 30 s past the swing's own stored series
  const n = 400;
  const time = Array.from({ length: n }, (_, i) => t[0] + (i * (t[t.length - 1] + 30 - t[0])) / (n - 1));
  const flat = (v: number) => Array.from({ length: n }, () => v);
  const whole = wholeTraceSeries({ time, leadPct: flat(50), copX: flat(0), leadHeelPct: flat(40), trailHeelPct: flat(40), copSpeed: flat(100), candidates: [] })!;

  it('draws the whole recording on the time axis and keeps the markers read-only there', () => {
    const swingOnly = renderToStaticMarkup(<SwingTraceViewer {...base} initialZoom="trace" onEventsChange={() => {}} />);
    const html = renderToStaticMarkup(<SwingTraceViewer {...base} wholeSeries={whole} initialZoom="trace" onEventsChange={() => {}} />);
    expect(html).toContain('Whole recording');
    // the last tick label of the time axis reaches past the swing's series (seconds from address)
    const lastTick = (h: string) => Math.max(...[...h.matchAll(/data-x-tick="(-?[\d.]+)"/g)].map((m) => Number(m[1])));
    expect(lastTick(html)).toBeGreaterThan(lastTick(swingOnly) + 20);
    expect(html).not.toContain('data-drag-event');
    expect(html).toContain('zoom in to move a marker');
    // the COP path is still the swing's own: five event dots
    expect(html.split('data-cop-event=').length - 1).toBe(5);
  });

  it('wholeTraceSeries: null for fewer than two points', () => {
    expect(wholeTraceSeries({ time: [1], leadPct: [1], copX: [1], leadHeelPct: [1], trailHeelPct: [1], copSpeed: [1], candidates: [] })).toBeNull();
  });
});

// overviewOf turns each coarsened bucket into two points (min at its start, max half a bucket later)
it('overviewOf after coarsenDisplay stays within 2 x maxBuckets points', () => {
  const o = overviewOf(coarsenDisplay(display(2000, 11), ['lead_pct'], 1000), ['lead_pct']);
  expect(o.time.length).toBeLessThanOrEqual(2000);
});
