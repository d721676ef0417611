import { describe, expect, it } from 'vitest';
import { mean, regularizedBeta, smallSetNote, studentTCdf, studentTQuantile, variance, welchInterval } from '@/lib/compare/stats';

// Welch's t interval (unequal variances, Welch-Satterthwaite df) against hand-worked small examples. Reference numbers
// from Debian's python3-scipy (/usr/bin/python3): df = (va + vb)^2 / (va^2/(nA-1) + vb^2/(nB-1)), va = var(a, ddof=1)/nA,
// t = scipy.stats.t.ppf(0.975, df), ci = (mean(b) - mean(a)) -+ t * sqrt(va + vb).

describe("Student's t distribution", () => {
  it('quantiles match scipy.stats.t.ppf', () => {
    expect(studentTQuantile(0.975, 1)).toBeCloseTo(12.706204736432095, 8); // scipy.stats.t.ppf(0.975, 1)
    expect(studentTQuantile(0.975, 4)).toBeCloseTo(2.7764451051977987, 9); // scipy.stats.t.ppf(0.975, 4)
    expect(studentTQuantile(0.975, 30)).toBeCloseTo(2.0422724563012373, 9); // scipy.stats.t.ppf(0.975, 30)
    expect(studentTQuantile(0.9, 7.5)).toBeCloseTo(1.4052118464151129, 9); // scipy.stats.t.ppf(0.9, 7.5)
    expect(studentTQuantile(0.995, 4.837988135926818)).toBeCloseTo(4.102532741918457, 8); // scipy.stats.t.ppf(0.995, 4.838)
    expect(studentTQuantile(0.025, 4)).toBeCloseTo(-2.7764451051977987, 9); // symmetry of t
  });

  it('the CDF matches scipy.stats.t.cdf', () => {
    expect(studentTCdf(1.5, 3.3)).toBeCloseTo(0.8887484016403541, 10); // scipy.stats.t.cdf(1.5, 3.3)
    expect(studentTCdf(-2.0, 2.5)).toBeCloseTo(0.078695747878983, 10); // scipy.stats.t.cdf(-2.0, 2.5)
    expect(studentTCdf(0, 5)).toBe(0.5); // symmetry
  });

  it('the regularized incomplete beta has its closed forms', () => {
    expect(regularizedBeta(0.3, 1, 1)).toBeCloseTo(0.3, 12); // I_x(1,1) = x (math)
    expect(regularizedBeta(0.3, 2, 1)).toBeCloseTo(0.09, 12); // I_x(a,1) = x^a (math)
    expect(regularizedBeta(0.3, 1, 3)).toBeCloseTo(1 - 0.7 ** 3, 12); // I_x(1,b) = 1 - (1-x)^b (math)
  });
});

describe("Welch's t interval", () => {
  it('a = [2.1, 2.5, 2.3, 2.8, 2.4], b = [3.0, 3.4, 2.9, 3.8]: hand-worked, numbers from scipy', () => {
    const a = [2.1, 2.5, 2.3, 2.8, 2.4];
    const b = [3.0, 3.4, 2.9, 3.8];
    expect(mean(a)).toBeCloseTo(2.42, 12); // by hand: 12.1 / 5
    expect(variance(a)).toBeCloseTo(0.067, 12); // by hand: sum of squares 0.268 / 4
    const w = welchInterval(a, b)!;
    expect(w.diff).toBeCloseTo(0.855, 12); // 3.275 - 2.42 by hand; numpy 0.8550000000000004
    expect(w.se).toBeCloseTo(0.23599081903045854, 12); // numpy sqrt(va + vb)
    expect(w.df).toBeCloseTo(4.837988135926818, 10); // Welch-Satterthwaite, numpy
    expect(w.tCritical).toBeCloseTo(2.5966904608962036, 8); // scipy.stats.t.ppf(0.975, df)
    expect(w.ci[0]).toBeCloseTo(0.2422048913645265, 8); // scipy
    expect(w.ci[1]).toBeCloseTo(1.4677951086354744, 8); // scipy
  });

  it('three and three: a = [80, 84, 82], b = [70, 72, 75]', () => {
    const w = welchInterval([80, 84, 82], [70, 72, 75])!;
    expect(w.df).toBeCloseTo(3.8059405940594067, 10); // numpy
    expect(w.ci[0]).toBeCloseTo(-14.924821478140888, 7); // scipy
    expect(w.ci[1]).toBeCloseTo(-4.408511855192455, 7); // scipy
  });

  it('gives no interval below 2 values or with no spread, and the honest note below 3', () => {
    expect(welchInterval([1], [2, 3])).toBeNull();
    expect(welchInterval([1, 1], [2, 2])).toBeNull();
    expect(smallSetNote(2, 10)).toMatch(/too few swings to say anything/i);
    expect(smallSetNote(3, 3)).toBeNull();
  });
});
