// Landmark registration (Ramsay & Silverman, Functional Data Analysis, ch. 8): a piecewise linear time warp
// that sends each event time to its target position, so curves from different swings line up event by event.
// Between events k and k+1: h(t) = p_k + (t - t_k) (p_{k+1} - p_k) / (t_{k+1} - t_k).
// Outside the first and last events the end segments are extended linearly.
import { segmentIndex } from './nearest';

function assertIncreasing(name: string, v: ArrayLike<number>): void {
  for (let i = 0; i < v.length; i++) {
    if (!Number.isFinite(v[i])) throw new RangeError(`${name}[${i}] must be a finite number`);
    if (i > 0 && !(v[i] > v[i - 1])) throw new RangeError(`${name} must be strictly increasing (index ${i})`);
  }
}

function piecewise(xs: ArrayLike<number>, ys: ArrayLike<number>): (x: number) => number {
  return (x: number) => {
    // segment k such that xs[k] <= x < xs[k+1], clamped to the end segments for extrapolation
    const lo = segmentIndex(xs, x);
    return ys[lo] + ((x - xs[lo]) * (ys[lo + 1] - ys[lo])) / (xs[lo + 1] - xs[lo]);
  };
}

function checkPair(eventTimes: ArrayLike<number>, targetPositions: ArrayLike<number>): void {
  if (eventTimes.length !== targetPositions.length) {
    throw new RangeError(`eventTimes (${eventTimes.length}) and targetPositions (${targetPositions.length}) differ in length`);
  }
  if (eventTimes.length < 2) throw new RangeError('at least two landmarks are needed');
  assertIncreasing('eventTimes', eventTimes);
  assertIncreasing('targetPositions', targetPositions);
}

/** Time (s) -> registered position (e.g. % of the swing). */
export function landmarkWarp(eventTimes: ArrayLike<number>, targetPositions: ArrayLike<number>): (t: number) => number {
  checkPair(eventTimes, targetPositions);
  return piecewise(Float64Array.from(eventTimes), Float64Array.from(targetPositions));
}

/** Registered position -> time (s): the inverse warp, also piecewise linear. */
export function inverseLandmarkWarp(eventTimes: ArrayLike<number>, targetPositions: ArrayLike<number>): (p: number) => number {
  checkPair(eventTimes, targetPositions);
  return piecewise(Float64Array.from(targetPositions), Float64Array.from(eventTimes));
}

/** Linear interpolation of (time, values) at t; NaN outside the sampled range. `time` strictly increasing. */
export function interpolateAt(time: ArrayLike<number>, values: ArrayLike<number>, t: number): number {
  const n = time.length;
  if (n === 0 || !(t >= time[0]) || !(t <= time[n - 1])) return NaN;
  if (n === 1) return values[0];
  const lo = segmentIndex(time, t);
  const hi = lo + 1;
  const f = (t - time[lo]) / (time[hi] - time[lo]);
  return values[lo] + f * (values[hi] - values[lo]);
}

export interface RegisteredCurve {
  /** the registered axis: nPoints evenly spaced from the first to the last target position */
  axis: Float64Array;
  /** the curve's value at each axis point (linear interpolation in time; NaN outside the recording) */
  values: Float64Array;
}

/** Resample a curve onto the registered axis between its first and last landmark. */
export function registerCurve(
  time: ArrayLike<number>,
  values: ArrayLike<number>,
  eventTimes: ArrayLike<number>,
  targetPositions: ArrayLike<number>,
  nPoints = 101,
): RegisteredCurve {
  if (time.length !== values.length) throw new RangeError(`time (${time.length}) and values (${values.length}) differ in length`);
  if (!Number.isInteger(nPoints) || nPoints < 2) throw new RangeError(`nPoints must be an integer >= 2, got ${nPoints}`);
  const toTime = inverseLandmarkWarp(eventTimes, targetPositions);
  const p0 = targetPositions[0];
  const p1 = targetPositions[targetPositions.length - 1];
  const axis = new Float64Array(nPoints);
  const out = new Float64Array(nPoints);
  for (let i = 0; i < nPoints; i++) {
    axis[i] = p0 + ((p1 - p0) * i) / (nPoints - 1);
    out[i] = interpolateAt(time, values, toTime(axis[i]));
  }
  return { axis, values: out };
}
