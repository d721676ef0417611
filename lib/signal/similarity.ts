// Similarity of curves registered onto the same axis.

function checkCurves(curves: ArrayLike<number>[], min: number): number {
  if (curves.length < min) throw new RangeError(`at least ${min} curves are needed, got ${curves.length}`);
  const len = curves[0].length;
  if (len < 2) throw new RangeError('curves need at least two points');
  for (let c = 1; c < curves.length; c++) {
    if (curves[c].length !== len) throw new RangeError(`curve ${c} has ${curves[c].length} points, curve 0 has ${len}`);
  }
  for (const curve of curves) {
    for (let i = 0; i < len; i++) if (!Number.isFinite(curve[i])) throw new RangeError(`curves must be finite (point ${i})`);
  }
  return len;
}

/** Root-mean-square difference sqrt(mean((a_t - b_t)^2)). */
export function rmsDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const len = checkCurves([a, b], 2);
  let s = 0;
  for (let i = 0; i < len; i++) s += (a[i] - b[i]) ** 2;
  return Math.sqrt(s / len);
}

/**
 * Coefficient of multiple correlation, within-session form (Kadaba et al. 1989, J Orthop Res 7:849):
 *   CMC = sqrt(1 - [sum_i sum_t (Y_it - Ybar_t)^2 / (T (N - 1))] / [sum_i sum_t (Y_it - Ybar)^2 / (T N - 1)])
 * for N curves of T points; Ybar_t is the mean at point t, Ybar the grand mean.
 * NaN when the curves are all one constant, or when the ratio exceeds 1 (the root would be imaginary).
 */
export function cmc(curves: ArrayLike<number>[]): number {
  const T = checkCurves(curves, 2);
  const N = curves.length;
  let grand = 0;
  for (const c of curves) for (let t = 0; t < T; t++) grand += c[t];
  grand /= N * T;
  let within = 0;
  let total = 0;
  for (let t = 0; t < T; t++) {
    let mt = 0;
    for (const c of curves) mt += c[t];
    mt /= N;
    for (const c of curves) {
      within += (c[t] - mt) ** 2;
      total += (c[t] - grand) ** 2;
    }
  }
  if (total === 0) return NaN;
  const ratio = within / (T * (N - 1)) / (total / (T * N - 1));
  return ratio > 1 ? NaN : Math.sqrt(1 - ratio);
}
