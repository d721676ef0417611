// Per-sample series from the uniform forces: filtered sensor forces, per-foot totals, lead / heel / toe shares,
// centre of pressure per foot (foot frame) and combined (stance frame), COP velocity and speed.
import { SignalInputError } from './errors';
import { DEFAULT_CUTOFF_HZ, DEFAULT_FILTER_ORDER, zeroLagLowpass, zeroLagMinSamples } from './filter';
import { savgolDerivative } from './savgol';
import { medianInPlace } from './select';
import type { DerivedSeries, Handedness, Region, SensorLayout, SensorSpec, UniformRecording } from './types';
export { toStanceFrame } from './stance-frame';

export const DEFAULT_DERIVE = {
  cutoffHz: DEFAULT_CUTOFF_HZ,
  filterOrder: DEFAULT_FILTER_ORDER,
  /** Savitzky-Golay window for the COP derivative, in seconds (made an odd number of samples) */
  derivativeWindowS: 0.11,
  derivativePolyOrder: 2,
  /** A foot (or both feet) "carries" load at or above max(minLoadN, minLoadFraction x median total force). */
  minLoadN: 5,
  minLoadFraction: 0.01,
} as const;

export interface DeriveParams {
  handedness: Handedness;
  stanceWidthMm: number;
  cutoffHz?: number;
  filterOrder?: number;
  /** samples, odd; default: DEFAULT_DERIVE.derivativeWindowS worth of samples */
  derivativeWindow?: number;
  derivativePolyOrder?: number;
  /**
   * u.forces may be overwritten: each sensor is filtered in its own array, and the arrays then hold derive's own
   * series instead of new ones (the same numbers; for a caller that regularised a recording only for this, such as
   * the analyze command). u.forces no longer holds the forces afterwards, and the series' time is u.time itself.
   */
  consumeForces?: boolean;
}

/** Odd window of about `seconds` at fs, at least the smallest odd window longer than polyOrder + 1. */
export function derivativeWindowFor(fs: number, seconds: number = DEFAULT_DERIVE.derivativeWindowS, polyOrder: number = DEFAULT_DERIVE.derivativePolyOrder): number {
  if (!(fs > 0) || !(seconds > 0)) throw new RangeError('fs and seconds must be positive');
  let w = Math.round(seconds * fs);
  if (w % 2 === 0) w += 1;
  let min = polyOrder + 2;
  if (min % 2 === 0) min += 1;
  return Math.max(w, min);
}

/** The sensor's region: its own `region`, else heel when y_mm is below half the foot length (spec section 2). */
export function sensorRegion(sensor: SensorSpec, footLengthMm: number): Region {
  return sensor.region ?? (sensor.y_mm < footLengthMm / 2 ? 'heel' : 'toe');
}

/** Centre of pressure sum(f_i r_i) / sum(f_i); NaN coordinates when the forces sum to 0 or less. */
export function copOf(forces: ArrayLike<number>, xs: ArrayLike<number>, ys: ArrayLike<number>): { x: number; y: number; total: number } {
  if (forces.length !== xs.length || forces.length !== ys.length) throw new RangeError('forces, xs and ys must have the same length');
  let total = 0;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < forces.length; i++) {
    total += forces[i];
    mx += forces[i] * xs[i];
    my += forces[i] * ys[i];
  }
  return total > 0 ? { x: mx / total, y: my / total, total } : { x: NaN, y: NaN, total };
}

/** Adds one sensor's clamped force (max(f, 0)) to its foot's sums: force, heel force and the two moments. */
function accumulate(
  f: Float64Array,
  sum: Float64Array,
  heel: Float64Array | null,
  mx: Float64Array,
  my: Float64Array,
  x: number,
  y: number,
): void {
  const n = f.length;
  if (heel) {
    for (let i = 0; i < n; i++) {
      const v = f[i] > 0 ? f[i] : 0;
      sum[i] += v;
      heel[i] += v;
      mx[i] += v * x;
      my[i] += v * y;
    }
  } else {
    for (let i = 0; i < n; i++) {
      const v = f[i] > 0 ? f[i] : 0;
      sum[i] += v;
      mx[i] += v * x;
      my[i] += v * y;
    }
  }
}


/** NaN runs filled for differentiation (into `y`): linear inside, nearest value at the ends. Null when all NaN. */
function bridgeNaN(x: Float64Array, y: Float64Array): Float64Array | null {
  y.set(x);
  const n = y.length;
  let prev = -1;
  for (let i = 0; i <= n; i++) {
    if (i < n && Number.isNaN(y[i])) continue;
    if (i - prev > 1) {
      if (prev < 0 && i >= n) return null;
      for (let k = prev + 1; k < i; k++) {
        y[k] = prev < 0 ? y[i] : i >= n ? y[prev] : y[prev] + ((y[i] - y[prev]) * (k - prev)) / (i - prev);
      }
    }
    prev = i;
  }
  return y;
}

/**
 * The derived series of a uniform recording (mm, N, %, mm/s):
 * - each layout sensor is low-passed with zeroLagLowpass (default 20 Hz, order 2 per pass) and clamped at 0 N;
 * - leadPct, heel and toe shares are NaN where the divisor force is below the load threshold
 *   max(5 N, 1 % of the median total force) (DEFAULT_DERIVE); so are the per-foot COPs, and the combined COP where
 *   the total is below it;
 * - COP velocity: Savitzky-Golay first derivative (window DEFAULT_DERIVE.derivativeWindowS, i.e. 11 samples at
 *   100 Hz, poly 2; scipy mode='interp' at the ends) of the COP with its NaN runs bridged (linear inside, nearest
 *   value at the ends); the velocity is NaN again wherever the COP is NaN.
 */
export function derive(u: UniformRecording, layout: SensorLayout, params: DeriveParams): DerivedSeries {
  const { handedness, stanceWidthMm } = params;
  if (handedness !== 'right' && handedness !== 'left') throw new RangeError(`handedness must be right or left, got ${handedness}`);
  if (!(Number.isFinite(stanceWidthMm) && stanceWidthMm >= 0)) throw new RangeError(`stanceWidthMm must be >= 0, got ${stanceWidthMm}`);
  const fs = u.sampleRateHz;
  const cutoff = params.cutoffHz ?? DEFAULT_DERIVE.cutoffHz;
  const order = params.filterOrder ?? DEFAULT_DERIVE.filterOrder;
  const polyOrder = params.derivativePolyOrder ?? DEFAULT_DERIVE.derivativePolyOrder;
  const window = params.derivativeWindow ?? derivativeWindowFor(fs, DEFAULT_DERIVE.derivativeWindowS, polyOrder);
  const n = u.time.length;
  const need = Math.max(zeroLagMinSamples(order), window);
  if (n < need) {
    throw new SignalInputError('too-few-samples', `${n} samples after resampling; the filter and derivative need at least ${need}`);
  }
  const leadFoot = handedness === 'right' ? 'left' : 'right';
  const L = layout.foot_length_mm;

  // Memory for the series: new arrays, or arrays whose values are no longer needed (`free`): with consumeForces the
  // force arrays once filtered and summed; always the heel sums and moments once read. One buffer for every
  // sensor's filtered force otherwise: only the sums are kept.
  const consume = params.consumeForces === true;
  const free: Float64Array[] = [];
  const alloc = () => free.pop() ?? new Float64Array(n);
  if (consume) {
    for (const sensor of layout.sensors) {
      if (u.sensorIds.indexOf(sensor.id) < 0) throw new SignalInputError('sensor-missing', `sensor ${sensor.id} of layout "${layout.id}" is not in the recording`);
    }
  }
  const scratch = consume ? null : new Float64Array(n);
  // per foot: force, heel force and the two moments, made when the foot's first sensor comes (with consumeForces a
  // foot whose sensors come after the other's sums into the arrays of the other's filtered forces)
  type Sums = { n: Float64Array; heel: Float64Array; mx: Float64Array; my: Float64Array };
  const zeroed = () => free.pop()?.fill(0) ?? new Float64Array(n);
  const feet: { left?: Sums; right?: Sums } = {};
  const sumsOf = (foot: 'left' | 'right'): Sums => (feet[foot] ??= { n: zeroed(), heel: zeroed(), mx: zeroed(), my: zeroed() });
  for (const sensor of layout.sensors) {
    const idx = u.sensorIds.indexOf(sensor.id);
    if (idx < 0) throw new SignalInputError('sensor-missing', `sensor ${sensor.id} of layout "${layout.id}" is not in the recording`);
    // Ringing of the filter at sharp unloading dips a little below 0; a sensor cannot pull, and negative weights
    // would push the COP outside the loaded sensors and the shares outside 0..100 %, so they are clamped to 0.
    const x = u.forces[idx];
    const f = scratch ?? (x.length === n ? x : x.subarray(0, n));
    zeroLagLowpass(x, fs, cutoff, order, f);
    const a = sumsOf(sensor.foot);
    const heel = sensorRegion(sensor, L) === 'heel';
    accumulate(f, a.n, heel ? a.heel : null, a.mx, a.my, sensor.x_mm, sensor.y_mm);
    if (consume) free.push(f);
  }
  const acc = { left: sumsOf('left'), right: sumsOf('right') };

  const totalN = alloc();
  for (let i = 0; i < n; i++) totalN[i] = acc.left.n[i] + acc.right.n[i];
  const work = scratch ?? alloc(); // the median's working copy
  work.set(totalN);
  const minLoad = Math.max(DEFAULT_DERIVE.minLoadN, DEFAULT_DERIVE.minLoadFraction * medianInPlace(work));
  if (consume) free.push(work);

  const share = (part: Float64Array, whole: Float64Array) => {
    const out = alloc();
    for (let i = 0; i < n; i++) out[i] = whole[i] >= minLoad ? (part[i] / whole[i]) * 100 : NaN;
    return out;
  };
  const toeShare = (foot: typeof acc.left) => {
    const out = alloc();
    for (let i = 0; i < n; i++) out[i] = foot.n[i] >= minLoad ? ((foot.n[i] - foot.heel[i]) / foot.n[i]) * 100 : NaN;
    return out;
  };
  const ratio = (m: Float64Array, w: Float64Array) => {
    const out = alloc();
    for (let i = 0; i < n; i++) out[i] = w[i] >= minLoad ? m[i] / w[i] : NaN;
    return out;
  };

  const lead = acc[leadFoot];
  const trail = acc[leadFoot === 'left' ? 'right' : 'left'];
  // Net COP = (COP_lead F_lead + COP_trail F_trail) / (F_lead + F_trail) (Winter 1995), from the moments directly,
  // so it is defined whenever the total carries load, even with one foot off the ground.
  const copX = alloc();
  const copY = alloc();
  const half = stanceWidthMm / 2;
  for (let i = 0; i < n; i++) {
    const t = totalN[i];
    if (t >= minLoad) {
      copX[i] = (lead.n[i] * half - lead.mx[i] - trail.n[i] * half + trail.mx[i]) / t;
      copY[i] = (lead.my[i] + trail.my[i]) / t - L / 2;
    } else {
      copX[i] = NaN;
      copY[i] = NaN;
    }
  }
  const leadPct = share(lead.n, totalN);
  const leadHeelPct = share(lead.heel, lead.n);
  const trailHeelPct = share(trail.heel, trail.n);
  const leadToePct = toeShare(lead);
  const trailToePct = toeShare(trail);
  const leftCopX = ratio(acc.left.mx, acc.left.n);
  const leftCopY = ratio(acc.left.my, acc.left.n);
  const rightCopX = ratio(acc.right.mx, acc.right.n);
  const rightCopY = ratio(acc.right.my, acc.right.n);
  // the heel sums and the moments are read for the last time above: their memory serves the velocities
  for (const foot of [acc.left, acc.right]) free.push(foot.heel, foot.mx, foot.my);

  const dt = 1 / fs;
  const velocity = (c: Float64Array) => {
    const bridged = bridgeNaN(c, alloc());
    if (!bridged) return alloc().fill(NaN);
    const v = savgolDerivative(bridged, window, polyOrder, dt, alloc());
    free.push(bridged);
    for (let i = 0; i < n; i++) if (Number.isNaN(c[i])) v[i] = NaN;
    return v;
  };
  const copVx = velocity(copX);
  const copVy = velocity(copY);
  const copSpeed = alloc();
  for (let i = 0; i < n; i++) copSpeed[i] = Math.hypot(copVx[i], copVy[i]);

  // consumeForces: u is the caller's to give up, so its time axis is taken as it is
  const time = consume ? u.time : alloc();
  if (!consume) time.set(u.time);
  return {
    sampleRateHz: fs,
    time,
    leftN: acc.left.n,
    rightN: acc.right.n,
    totalN,
    leadPct,
    leadHeelPct,
    trailHeelPct,
    leadToePct,
    trailToePct,
    leftCopX,
    leftCopY,
    rightCopX,
    rightCopY,
    copX,
    copY,
    copVx,
    copVy,
    copSpeed,
  };
}
