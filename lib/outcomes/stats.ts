// Pure statistics for "what goes with the result": Pearson's r with its Fisher z interval and p value, Spearman's
// rho, the least squares line and the Benjamini-Hochberg adjustment. No I/O. Inputs are never mutated.
import { regularizedBeta } from '@/lib/compare/stats';

/** Standard normal 0.975 quantile (scipy.stats.norm.ppf(0.975) = 1.959963984540054, checked in the tests). */
export const Z_975 = 1.959963984540054;

function checkPairs(x: readonly number[], y: readonly number[]): number {
  if (x.length !== y.length) throw new RangeError(`x and y differ in length (${x.length} vs ${y.length})`);
  for (let i = 0; i < x.length; i++) if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) throw new RangeError(`pair ${i} is not finite`);
  return x.length;
}

function meanOf(xs: readonly number[]): number {
  let s = 0;
  for (const v of xs) s += v;
  return s / xs.length;
}

/** Pearson's r = sum((x - mx)(y - my)) / sqrt(sum((x - mx)^2) sum((y - my)^2)); NaN when n < 2 or a side is constant. */
export function pearson(x: readonly number[], y: readonly number[]): number {
  const n = checkPairs(x, y);
  if (n < 2) return NaN;
  const mx = meanOf(x);
  const my = meanOf(y);
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (sxx === 0 || syy === 0) return NaN;
  return Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
}

/** Ranks 1..n, ties get the mean of the ranks they span (scipy.stats.rankdata method 'average'). */
export function averageRanks(xs: readonly number[]): number[] {
  const order = xs.map((v, i) => i).sort((a, b) => xs[a] - xs[b]);
  const ranks = new Array<number>(xs.length);
  for (let k = 0; k < order.length; ) {
    let end = k;
    while (end + 1 < order.length && xs[order[end + 1]] === xs[order[k]]) end++;
    const rank = (k + end) / 2 + 1;
    for (let m = k; m <= end; m++) ranks[order[m]] = rank;
    k = end + 1;
  }
  return ranks;
}

/** Spearman's rho: Pearson's r of the average ranks. */
export function spearman(x: readonly number[], y: readonly number[]): number {
  checkPairs(x, y);
  return pearson(averageRanks(x), averageRanks(y));
}

/** Least squares line y = intercept + slope x (slope = Sxy / Sxx). */
export function leastSquares(x: readonly number[], y: readonly number[]): { slope: number; intercept: number } {
  const n = checkPairs(x, y);
  if (n < 2) return { slope: NaN, intercept: NaN };
  const mx = meanOf(x);
  const my = meanOf(y);
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
  }
  if (sxx === 0) return { slope: NaN, intercept: NaN };
  const slope = sxy / sxx;
  return { slope, intercept: my - slope * mx };
}

/**
 * 95 % interval of r by Fisher's z: z = atanh(r), SE = 1 / sqrt(n - 3), tanh(z ± 1.959964 SE). Null for n < 4
 * (no standard error) or |r| = 1 (z is infinite).
 */
export function fisherInterval(r: number, n: number, z = Z_975): { low: number; high: number } | null {
  if (!(n >= 4) || !Number.isFinite(r) || Math.abs(r) >= 1) return null;
  const zr = Math.atanh(r);
  const se = 1 / Math.sqrt(n - 3);
  return { low: Math.tanh(zr - z * se), high: Math.tanh(zr + z * se) };
}

/** Two-sided p value of r under no correlation: t = r sqrt((n - 2) / (1 - r^2)) on n - 2 degrees of freedom. */
export function pearsonP(r: number, n: number): number {
  if (!(n >= 3) || !Number.isFinite(r)) return NaN;
  if (Math.abs(r) >= 1) return 0;
  const df = n - 2;
  const t2 = (r * r * df) / (1 - r * r);
  // P(|T| > |t|) = I_(df / (df + t^2))(df / 2, 1 / 2)
  return regularizedBeta(df / (df + t2), df / 2, 0.5);
}

/** Benjamini-Hochberg adjusted p values: p_(i) m / i, made monotone from the largest down, capped at 1. NaN stays NaN. */
export function benjaminiHochberg(ps: readonly number[]): number[] {
  const idx = ps.map((p, i) => i).filter((i) => Number.isFinite(ps[i]));
  const m = idx.length;
  const out = ps.map(() => NaN);
  idx.sort((a, b) => ps[a] - ps[b]);
  let running = 1;
  for (let k = m - 1; k >= 0; k--) {
    const p = ps[idx[k]];
    if (p < 0 || p > 1) throw new RangeError(`p value ${p} is outside [0, 1]`);
    running = Math.min(running, (p * m) / (k + 1));
    out[idx[k]] = running;
  }
  return out;
}

export interface Correlation {
  n: number;
  r: number | null;
  rLow: number | null;
  rHigh: number | null;
  rho: number | null;
  p: number | null;
  slope: number | null;
  intercept: number | null;
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/** Everything the outcomes answer reports about one metric against one outcome. */
export function correlate(x: readonly number[], y: readonly number[]): Correlation {
  const n = checkPairs(x, y);
  const r = pearson(x, y);
  const ci = fisherInterval(r, n);
  const line = leastSquares(x, y);
  return {
    n,
    r: finiteOrNull(r),
    rLow: ci ? ci.low : null,
    rHigh: ci ? ci.high : null,
    rho: n >= 2 ? finiteOrNull(spearman(x, y)) : null,
    p: finiteOrNull(pearsonP(r, n)),
    slope: finiteOrNull(line.slope),
    intercept: finiteOrNull(line.intercept),
  };
}
