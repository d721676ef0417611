import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { averageRanks, benjaminiHochberg, correlate, fisherInterval, leastSquares, pearson, pearsonP, spearman, Z_975 } from '@/lib/outcomes/stats';

// Reference: scipy.stats 1.10.1 from Debian's python3-scipy (pearsonr with its confidence_interval, spearmanr,
// linregress, norm.ppf), on the fixture vectors written by tests/fixtures/scipy/make-outcomes-reference.py.
interface Case {
  name: string;
  x: number[];
  y: number[];
  pearson_r: number;
  pearson_p: number;
  pearson_ci: [number, number];
  spearman_rho: number;
  slope: number;
  intercept: number;
}
const ref = JSON.parse(readFileSync(new URL('../fixtures/scipy/outcomes-reference.json', import.meta.url), 'utf8')) as { norm_ppf_0975: number; cases: Case[] };

const close = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(tol);

describe('correlation against scipy.stats (Debian python3-scipy 1.10)', () => {
  it('the 0.975 normal quantile equals scipy.stats.norm.ppf(0.975)', () => {
    close(Z_975, ref.norm_ppf_0975, 1e-15);
  });

  for (const c of ref.cases) {
    it(`${c.name}: r = pearsonr, rho = spearmanr, slope and intercept = linregress, to 1e-9`, () => {
      close(pearson(c.x, c.y), c.pearson_r, 1e-9);
      close(spearman(c.x, c.y), c.spearman_rho, 1e-9);
      const line = leastSquares(c.x, c.y);
      close(line.slope, c.slope, 1e-9);
      close(line.intercept, c.intercept, 1e-9);
    });

    it(`${c.name}: Fisher z interval = pearsonr(...).confidence_interval(0.95); p = pearsonr's p value`, () => {
      const ci = fisherInterval(pearson(c.x, c.y), c.x.length)!;
      close(ci.low, c.pearson_ci[0], 1e-9);
      close(ci.high, c.pearson_ci[1], 1e-9);
      close(pearsonP(pearson(c.x, c.y), c.x.length), c.pearson_p, 1e-9 + 1e-7 * c.pearson_p);
    });
  }

  it('correlate() bundles the same numbers', () => {
    const c = ref.cases[0];
    const out = correlate(c.x, c.y);
    expect(out.n).toBe(c.x.length);
    close(out.r!, c.pearson_r, 1e-9);
    close(out.rLow!, c.pearson_ci[0], 1e-9);
    close(out.rho!, c.spearman_rho, 1e-9);
  });
});

describe('fisherInterval(r, n)', () => {
  it('matches the textbook worked example: r = 0.5, n = 30 -> [0.17043, 0.72896]', () => {
    // Fisher's z (Fisher 1921), as in statistics handbooks (e.g. Zar, Biostatistical Analysis, ch. 19 - citation
    // from memory): z = atanh(0.5) = 0.549306, SE = 1/sqrt(27) = 0.192450, tanh(z ± 1.959964 SE).
    // The interval values were computed with scipy (shared/docs/check-values.md).
    const ci = fisherInterval(0.5, 30)!;
    close(Math.atanh(0.5), 0.549306, 1e-6);
    close(1 / Math.sqrt(27), 0.19245, 1e-6);
    close(ci.low, 0.17043, 1e-5);
    close(ci.high, 0.72896, 1e-5);
  });

  it('has no interval below n = 4 or at |r| = 1', () => {
    expect(fisherInterval(0.5, 3)).toBeNull();
    expect(fisherInterval(1, 30)).toBeNull();
  });
});

describe('benjaminiHochberg(ps)', () => {
  it('matches the worked example p = [0.01, 0.04, 0.03, 0.005] -> [0.02, 0.04, 0.04, 0.02]', () => {
    // Benjamini & Hochberg 1995, J R Stat Soc B 57(1):289-300 (citation from memory); adjusted values computed with
    // scipy (shared/docs/check-values.md). Debian's scipy 1.10 has no false_discovery_control (added in 1.11).
    const adj = benjaminiHochberg([0.01, 0.04, 0.03, 0.005]);
    [0.02, 0.04, 0.04, 0.02].forEach((v, i) => close(adj[i], v, 1e-12));
  });

  it('caps at 1, keeps NaN out of the count, and refuses p outside [0, 1]', () => {
    const adj = benjaminiHochberg([0.9, NaN, 0.8]);
    expect(Number.isNaN(adj[1])).toBe(true);
    close(adj[0], 0.9, 1e-12); // 0.9 * 2 / 2
    close(adj[2], 0.9, 1e-12); // min(0.8 * 2 / 1, 0.9)
    expect(benjaminiHochberg([0.7, 0.8, 0.9]).every((p) => p <= 1)).toBe(true);
    expect(() => benjaminiHochberg([1.5])).toThrow(RangeError);
  });
});

describe('averageRanks', () => {
  it('gives ties the mean of their ranks (as scipy.stats.rankdata, method "average")', () => {
    // rankdata([10, 20, 20, 5]) = [2, 3.5, 3.5, 1] (by hand from the definition)
    expect(averageRanks([10, 20, 20, 5])).toEqual([2, 3.5, 3.5, 1]);
  });
});
