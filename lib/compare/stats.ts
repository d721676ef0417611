// Pure statistics for comparing two sets of swings. No I/O.
// The t quantile is computed here (no package of ours has one): Student's t CDF through the regularized incomplete
// beta function I_x(a, b) (Numerical Recipes ch. 6.4, Lentz's continued fraction), inverted by bisection.

export function mean(xs: readonly number[]): number {
  if (xs.length === 0) return NaN;
  let s = 0;
  for (const x of xs) s += x;
  return s / xs.length;
}

/** Sample variance, divisor n - 1 (NaN for n < 2). */
export function variance(xs: readonly number[]): number {
  const n = xs.length;
  if (n < 2) return NaN;
  const m = mean(xs);
  let s = 0;
  for (const x of xs) s += (x - m) ** 2;
  return s / (n - 1);
}

export const sd = (xs: readonly number[]): number => Math.sqrt(variance(xs));

/** ln Gamma(x), Lanczos approximation (g = 7, n = 9), accurate to ~1e-15 for x > 0. */
export function lnGamma(x: number): number {
  const c = [0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7];
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  const z = x - 1;
  let a = c[0];
  const t = z + 7.5;
  for (let i = 1; i < 9; i++) a += c[i] / (z + i);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}

// Continued fraction for I_x(a, b) (modified Lentz).
function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 500; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return h;
}

/** Regularized incomplete beta I_x(a, b). */
export function regularizedBeta(x: number, a: number, b: number): number {
  if (!(a > 0) || !(b > 0)) throw new RangeError('a and b must be > 0');
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  // symmetry I_x(a,b) = 1 - I_(1-x)(b,a) keeps the continued fraction in its fast-converging region
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(x, a, b)) / a;
  return 1 - (front * betaContinuedFraction(1 - x, b, a)) / b;
}

/** Student's t CDF with df degrees of freedom (df may be fractional): P(T <= t). */
export function studentTCdf(t: number, df: number): number {
  if (!(df > 0)) throw new RangeError(`df must be > 0, got ${df}`);
  const x = df / (df + t * t);
  const tail = 0.5 * regularizedBeta(x, df / 2, 0.5); // P(T > |t|)
  return t >= 0 ? 1 - tail : tail;
}

/** Quantile of Student's t: the t with P(T <= t) = p, by bisection on the CDF (to ~1e-12). */
export function studentTQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`p must be in (0, 1), got ${p}`);
  if (p === 0.5) return 0;
  let lo = -1;
  let hi = 1;
  while (studentTCdf(lo, df) > p) lo *= 2;
  while (studentTCdf(hi, df) < p) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-12; i++) {
    const mid = (lo + hi) / 2;
    if (studentTCdf(mid, df) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

export interface WelchInterval {
  meanA: number;
  meanB: number;
  /** meanB - meanA */
  diff: number;
  se: number;
  df: number;
  tCritical: number;
  ci: [number, number];
}

/**
 * Welch's t interval for the difference of means (B - A), unequal variances:
 *   se = sqrt(sA^2/nA + sB^2/nB)
 *   df = (sA^2/nA + sB^2/nB)^2 / ((sA^2/nA)^2/(nA-1) + (sB^2/nB)^2/(nB-1))   (Welch-Satterthwaite)
 *   diff +- t_(1-alpha/2, df) * se
 * Null when either set has fewer than 2 values or both variances are 0 (no interval can be given).
 */
export function welchInterval(a: readonly number[], b: readonly number[], level = 0.95): WelchInterval | null {
  if (!(level > 0 && level < 1)) throw new RangeError(`level must be in (0, 1), got ${level}`);
  if (a.length < 2 || b.length < 2) return null;
  const va = variance(a) / a.length;
  const vb = variance(b) / b.length;
  const se2 = va + vb;
  if (!(se2 > 0)) return null;
  const df = se2 ** 2 / (va ** 2 / (a.length - 1) + vb ** 2 / (b.length - 1));
  const se = Math.sqrt(se2);
  const tCritical = studentTQuantile(1 - (1 - level) / 2, df);
  const meanA = mean(a);
  const meanB = mean(b);
  const diff = meanB - meanA;
  return { meanA, meanB, diff, se, df, tCritical, ci: [diff - tCritical * se, diff + tCritical * se] };
}

/** The honest note the compare view shows: below 3 swings in a set there is too little to say anything. */
export const MIN_SET_SIZE = 3;
export function smallSetNote(nA: number, nB: number): string | null {
  if (nA >= MIN_SET_SIZE && nB >= MIN_SET_SIZE) return null;
  return `Too few swings to say anything (${nA} and ${nB}; at least ${MIN_SET_SIZE} in each set are needed).`;
}
