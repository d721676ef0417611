// Mean +- k standard deviations over a set of curves registered onto the same axis.
// SD is the sample standard deviation (divisor n - 1); with a single curve it is NaN.
// NaN points are skipped per axis point, so `n` is per point.

export interface Band {
  mean: Float64Array;
  sd: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  /** number of curves with a finite value at each point */
  n: Uint32Array;
}

export function meanSdBand(curves: ArrayLike<number>[], k = 1): Band {
  if (curves.length === 0) throw new RangeError('meanSdBand needs at least one curve');
  if (!(k >= 0) || !Number.isFinite(k)) throw new RangeError(`k must be a finite number >= 0, got ${k}`);
  const len = curves[0].length;
  for (let c = 1; c < curves.length; c++) {
    if (curves[c].length !== len) throw new RangeError(`curve ${c} has ${curves[c].length} points, curve 0 has ${len}`);
  }
  const mean = new Float64Array(len);
  const sd = new Float64Array(len);
  const lower = new Float64Array(len);
  const upper = new Float64Array(len);
  const n = new Uint32Array(len);
  for (let i = 0; i < len; i++) {
    // Welford's update: numerically stable single pass
    let count = 0;
    let m = 0;
    let m2 = 0;
    for (let c = 0; c < curves.length; c++) {
      const v = curves[c][i];
      if (!Number.isFinite(v)) continue;
      count++;
      const d = v - m;
      m += d / count;
      m2 += d * (v - m);
    }
    n[i] = count;
    mean[i] = count > 0 ? m : NaN;
    sd[i] = count > 1 ? Math.sqrt(m2 / (count - 1)) : NaN;
    lower[i] = mean[i] - k * sd[i];
    upper[i] = mean[i] + k * sd[i];
  }
  return { mean, sd, lower, upper, n };
}
