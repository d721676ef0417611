// The display series of a recording: each derived trace cut into equal time buckets and kept as the min and max of
// every bucket (so a short spike survives however far the view is zoomed out). 2,000 buckets = 4,000 points per
// trace, enough for a full-width chart; recordings shorter than that keep every sample (min = max).
import type { DerivedSeries } from '@/lib/signal';

export const DISPLAY_BUCKETS = 2000;

const TRACES = {
  lead_pct: 'leadPct',
  left_n: 'leftN',
  right_n: 'rightN',
  total_n: 'totalN',
  cop_x_mm: 'copX',
  cop_y_mm: 'copY',
  cop_speed_mm_s: 'copSpeed',
  lead_heel_pct: 'leadHeelPct',
  trail_heel_pct: 'trailHeelPct',
} as const satisfies Record<string, keyof DerivedSeries>;

export type TraceName = keyof typeof TRACES;

export interface DisplaySeries {
  method: 'minmax';
  buckets: number;
  /** seconds per bucket */
  bucketS: number;
  /** start time of each bucket, s on the recording's time axis */
  t: number[];
  /** per trace: min and max over each bucket; null where the bucket holds no finite value (e.g. no load) */
  traces: Record<TraceName, { min: (number | null)[]; max: (number | null)[] }>;
}

const rounded = (v: number) => (Number.isFinite(v) ? Math.round(v * 100) / 100 : null);

export function displaySeries(series: DerivedSeries, buckets = DISPLAY_BUCKETS): DisplaySeries {
  const n = series.time.length;
  const count = Math.max(1, Math.min(buckets, n));
  const t: number[] = [];
  const bounds: number[] = [];
  for (let b = 0; b <= count; b++) bounds.push(Math.round((b * n) / count));
  for (let b = 0; b < count; b++) t.push(Math.round(series.time[bounds[b]] * 1000) / 1000);
  const traces = {} as DisplaySeries['traces'];
  for (const [name, key] of Object.entries(TRACES) as [TraceName, keyof DerivedSeries][]) {
    const values = series[key] as Float64Array;
    const min: (number | null)[] = [];
    const max: (number | null)[] = [];
    for (let b = 0; b < count; b++) {
      let lo = Infinity;
      let hi = -Infinity;
      for (let i = bounds[b]; i < bounds[b + 1]; i++) {
        const v = values[i];
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
      min.push(lo === Infinity ? null : rounded(lo));
      max.push(hi === -Infinity ? null : rounded(hi));
    }
    traces[name] = { min, max };
  }
  const duration = n > 1 ? series.time[n - 1] - series.time[0] : 0;
  return { method: 'minmax', buckets: count, bucketS: count > 0 ? duration / count : 0, t, traces };
}

/**
 * A low-resolution overview of some traces for the whole recording, from the stored display series: each bucket
 * becomes two points (its min at the bucket start, its max half a bucket later) so peaks stay visible; a bucket of
 * one sample (min = max) stays one point.
 */
export function overviewOf(
  display: Pick<DisplaySeries, 'bucketS' | 't' | 'traces'>,
  names: readonly TraceName[],
): { time: number[]; traces: Record<string, (number | null)[]> } {
  const time: number[] = [];
  const traces: Record<string, (number | null)[]> = Object.fromEntries(names.map((n) => [n, []]));
  display.t.forEach((t0, b) => {
    const single = names.every((n) => display.traces[n].min[b] === display.traces[n].max[b]);
    time.push(t0);
    for (const n of names) traces[n].push(display.traces[n].min[b]);
    if (!single) {
      time.push(Math.round((t0 + display.bucketS / 2) * 1000) / 1000);
      for (const n of names) traces[n].push(display.traces[n].max[b]);
    }
  });
  return { time, traces };
}
