// Scales from series: D3 linear scales over the chart's inner box.
import { scaleLinear, type ScaleLinear } from 'd3';
import type { NumArray } from './types';

export interface ChartBox {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

export const innerWidth = (b: ChartBox) => Math.max(1, b.width - b.margin.left - b.margin.right);
export const innerHeight = (b: ChartBox) => Math.max(1, b.height - b.margin.top - b.margin.bottom);

function checkDomain(name: string, d: readonly [number, number]): void {
  if (!Number.isFinite(d[0]) || !Number.isFinite(d[1])) throw new RangeError(`${name} domain must be finite, got [${d[0]}, ${d[1]}]`);
  if (!(d[1] > d[0])) throw new RangeError(`${name} domain must be increasing, got [${d[0]}, ${d[1]}]`);
}

/** Seconds -> x pixels inside the inner box (0 at the left edge of the plot area). */
export function timeScale(domain: readonly [number, number], box: ChartBox): ScaleLinear<number, number> {
  checkDomain('time', domain);
  return scaleLinear().domain(domain).range([0, innerWidth(box)]);
}

/** Value -> y pixels (0 at the top of the plot area, so larger values are higher). */
export function valueScale(domain: readonly [number, number], box: ChartBox, nice = false): ScaleLinear<number, number> {
  checkDomain('value', domain);
  const s = scaleLinear().domain(domain).range([innerHeight(box), 0]);
  return nice ? s.nice(4) : s;
}

/** [min, max] of the finite values of several arrays, optionally only where time is inside [t0, t1]; null when none. */
export function finiteExtent(arrays: NumArray[], time?: NumArray, t0 = -Infinity, t1 = Infinity): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const a of arrays) {
    for (let i = 0; i < a.length; i++) {
      if (time && !(time[i] >= t0 && time[i] <= t1)) continue;
      const v = a[i];
      if (!Number.isFinite(v)) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return lo <= hi ? [lo, hi] : null;
}

/** A value domain that always has width: [0, max] padded by 10 %, or [0, 1] when there is nothing to show. */
export function zeroBasedDomain(extent: [number, number] | null): [number, number] {
  const hi = extent ? Math.max(extent[1], 0) : 0;
  return [0, hi > 0 ? hi * 1.1 : 1];
}

/** Symmetric-padded domain around the data (for COP in mm), at least `minSpan` wide. */
export function paddedDomain(extent: [number, number] | null, minSpan: number, pad = 0.08): [number, number] {
  if (!extent) return [-minSpan / 2, minSpan / 2];
  const span = Math.max(extent[1] - extent[0], minSpan);
  const mid = (extent[0] + extent[1]) / 2;
  return [mid - (span / 2) * (1 + pad), mid + (span / 2) * (1 + pad)];
}
