// Display downsampling (min/max per pixel bucket): a line drawn at one point per pixel loses its spikes, so each
// bucket keeps its lowest and its highest sample, in time order. A bucket that holds a missing sample also keeps
// one NaN, so gaps survive. With no more samples than 2 per bucket the series is returned as a copy.
import type { NumArray } from './types';

export interface Sampled {
  time: Float64Array;
  values: Float64Array;
}

export function minMaxDownsample(time: NumArray, values: NumArray, buckets: number): Sampled {
  if (time.length !== values.length) throw new RangeError(`time (${time.length}) and values (${values.length}) differ in length`);
  if (!Number.isInteger(buckets) || buckets < 1) throw new RangeError(`buckets must be an integer >= 1, got ${buckets}`);
  const n = time.length;
  if (n <= buckets * 2) return { time: Float64Array.from(time), values: Float64Array.from(values) };
  const outT: number[] = [];
  const outV: number[] = [];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * n) / buckets);
    const to = Math.floor(((b + 1) * n) / buckets);
    let iMin = -1;
    let iMax = -1;
    let iNaN = -1;
    for (let i = from; i < to; i++) {
      const v = values[i];
      if (!Number.isFinite(v)) {
        if (iNaN < 0) iNaN = i;
        continue;
      }
      if (iMin < 0 || v < values[iMin]) iMin = i;
      if (iMax < 0 || v > values[iMax]) iMax = i;
    }
    const keep = [...new Set([iMin, iMax, iNaN].filter((i) => i >= 0))].sort((a, c) => a - c);
    for (const i of keep) {
      outT.push(time[i]);
      outV.push(i === iNaN ? NaN : values[i]);
    }
  }
  return { time: Float64Array.from(outT), values: Float64Array.from(outV) };
}

/** The index range [i0, i1] of the samples inside [t0, t1], widened by one sample each side so lines reach the edges. */
export function visibleRange(time: NumArray, t0: number, t1: number): [number, number] {
  const n = time.length;
  if (n === 0) return [0, -1];
  let i0 = 0;
  while (i0 < n - 1 && time[i0 + 1] < t0) i0++;
  let i1 = n - 1;
  while (i1 > 0 && time[i1 - 1] > t1) i1--;
  return [i0, Math.max(i0, i1)];
}

/** Plain copies of [i0, i1] of each array (subarray when typed, slice otherwise). */
export function sliceRange(a: NumArray, i0: number, i1: number): NumArray {
  if (ArrayBuffer.isView(a)) return (a as unknown as Float64Array).subarray(i0, i1 + 1);
  return Array.prototype.slice.call(a, i0, i1 + 1) as number[];
}
