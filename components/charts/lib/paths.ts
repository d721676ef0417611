// SVG path strings with D3's line and area generators. A NaN (or other non-finite) sample ends the current
// segment, so a gap shows as a gap and is never bridged by a straight line.
import { area, line } from 'd3';
import type { ScaleLinear } from 'd3';
import type { NumArray } from './types';

type Scale = ScaleLinear<number, number>;

const indexes = (n: number) => Array.from({ length: n }, (_, i) => i);

function checkLengths(time: NumArray, ...arrays: NumArray[]): void {
  for (const a of arrays) {
    if (a.length !== time.length) throw new RangeError(`series has ${a.length} values for ${time.length} time points`);
  }
}

/** The line through (time[i], values[i]); '' when no sample is finite. */
export function linePath(time: NumArray, values: NumArray, x: Scale, y: Scale): string {
  checkLengths(time, values);
  const gen = line<number>()
    .defined((i) => Number.isFinite(time[i]) && Number.isFinite(values[i]))
    .x((i) => x(time[i]))
    .y((i) => y(values[i]))
    .digits(2);
  return gen(indexes(time.length)) ?? '';
}

/** The area between lower and upper (a band); breaks wherever either bound is missing. */
export function bandPath(time: NumArray, lower: NumArray, upper: NumArray, x: Scale, y: Scale): string {
  checkLengths(time, lower, upper);
  const gen = area<number>()
    .defined((i) => Number.isFinite(time[i]) && Number.isFinite(lower[i]) && Number.isFinite(upper[i]))
    .x((i) => x(time[i]))
    .y0((i) => y(lower[i]))
    .y1((i) => y(upper[i]))
    .digits(2);
  return gen(indexes(time.length)) ?? '';
}

/** A 2-D path (COP X, COP Y) in any frame; NaN breaks it like linePath. */
export function xyPath(xs: NumArray, ys: NumArray, x: Scale, y: Scale): string {
  checkLengths(xs, ys);
  const gen = line<number>()
    .defined((i) => Number.isFinite(xs[i]) && Number.isFinite(ys[i]))
    .x((i) => x(xs[i]))
    .y((i) => y(ys[i]))
    .digits(2);
  return gen(indexes(xs.length)) ?? '';
}
