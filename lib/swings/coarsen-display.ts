import type { DisplaySeries, TraceName } from '@/lib/jobs/display-series';

// The recording's stored display series (up to 2,000 min/max buckets per trace) is finer than a whole-recording view
// needs. Merging every `k` neighbouring buckets into one (min of their mins, max of their maxes) keeps every peak and
// dip while cutting the payload: 1,000 buckets give 2,000 points per trace, about 2 points per pixel of a wide chart.

export const WHOLE_TRACE_BUCKETS = 1000;

type Display = Pick<DisplaySeries, 'bucketS' | 't' | 'traces'>;

const lower = (a: number | null, b: number | null) => (a === null ? b : b === null ? a : Math.min(a, b));
const upper = (a: number | null, b: number | null) => (a === null ? b : b === null ? a : Math.max(a, b));

/** At most `maxBuckets` buckets of the given traces; the input is returned as is when it is already that small. */
export function coarsenDisplay(display: Display, names: readonly TraceName[], maxBuckets = WHOLE_TRACE_BUCKETS): Display {
  if (!Number.isInteger(maxBuckets) || maxBuckets < 1) throw new RangeError('maxBuckets must be a positive integer');
  const n = display.t.length;
  if (n <= maxBuckets) return display;
  const k = Math.ceil(n / maxBuckets);
  const t: number[] = [];
  const traces = Object.fromEntries(names.map((name) => [name, { min: [] as (number | null)[], max: [] as (number | null)[] }])) as Display['traces'];
  for (let start = 0; start < n; start += k) {
    t.push(display.t[start]);
    for (const name of names) {
      let lo: number | null = null;
      let hi: number | null = null;
      for (let b = start; b < Math.min(n, start + k); b++) {
        lo = lower(lo, display.traces[name].min[b]);
        hi = upper(hi, display.traces[name].max[b]);
      }
      traces[name].min.push(lo);
      traces[name].max.push(hi);
    }
  }
  return { bucketS: display.bucketS * k, t, traces };
}
