import { describe, expect, it } from 'vitest';
import { bandPath, linePath, xyPath } from '@/components/charts/lib/paths';
import { finiteExtent, paddedDomain, timeScale, valueScale, zeroBasedDomain, type ChartBox } from '@/components/charts/lib/scales';

// A 100 x 100 plot area: the box below has 20 px margins around it.
const box: ChartBox = { width: 140, height: 140, margin: { top: 20, right: 20, bottom: 20, left: 20 } };

describe('timeScale(domain, box) / valueScale(domain, box)', () => {
  it('maps the domain linearly onto the inner box, values upward', () => {
    const x = timeScale([1, 3], box);
    const y = valueScale([0, 100], box);
    // worked by hand from x(t) = (t - 1) / (3 - 1) * 100 and y(v) = 100 - v / 100 * 100
    expect(x(1)).toBe(0);
    expect(x(2)).toBe(50);
    expect(x(3)).toBe(100);
    expect(y(0)).toBe(100);
    expect(y(75)).toBe(25);
    expect(x.invert(25)).toBe(1.5);
  });

  it('throws a RangeError on an empty or non-finite domain', () => {
    expect(() => timeScale([2, 2], box)).toThrow(RangeError);
    expect(() => valueScale([0, NaN], box)).toThrow(/finite/);
  });
});

describe('finiteExtent / zeroBasedDomain / paddedDomain', () => {
  it('ignores NaN and honours the time window', () => {
    const t = [0, 1, 2, 3];
    expect(finiteExtent([[5, NaN, -2, 9]])).toEqual([-2, 9]);
    expect(finiteExtent([[5, NaN, -2, 9]], t, 0.5, 2.5)).toEqual([-2, -2]);
    expect(finiteExtent([[NaN, NaN]])).toBeNull();
  });
  it('gives a domain with width even for empty or flat data', () => {
    expect(zeroBasedDomain(null)).toEqual([0, 1]);
    expect(zeroBasedDomain([0, 200])).toEqual([0, 220.00000000000003]); // 200 * 1.1 in IEEE-754 double
    expect(paddedDomain([10, 10], 20, 0)).toEqual([0, 20]);
  });
});

describe('linePath(time, values, x, y)', () => {
  const x = timeScale([0, 2], box);
  const y = valueScale([0, 100], box);

  it('draws a 3-point series as an exact SVG path', () => {
    // by hand: (0,0)->(0,100), (1,50)->(50,50), (2,100)->(100,0); SVG 1.1 path grammar (W3C, section 8.3): M then L
    expect(linePath([0, 1, 2], [0, 50, 100], x, y)).toBe('M0,100L50,50L100,0');
  });

  it('breaks the path at a NaN instead of bridging it', () => {
    // the NaN at t = 1 ends the first sub-path; a new M starts the next (d3-shape line.defined: "gaps")
    expect(linePath([0, 0.5, 1, 1.5, 2], [0, 25, NaN, 75, 100], x, y)).toBe('M0,100L25,75M75,25L100,0');
  });

  it('returns an empty string when no sample is finite and rejects mismatched lengths', () => {
    expect(linePath([0, 1], [NaN, NaN], x, y)).toBe('');
    expect(() => linePath([0, 1, 2], [1, 2], x, y)).toThrow(/2 values for 3 time points/);
  });

  it('rounds coordinates to two decimals', () => {
    const x3 = timeScale([0, 3], box);
    // 1/3 * 100 = 33.333... -> 33.33
    expect(linePath([0, 1], [0, 0], x3, y)).toBe('M0,100L33.33,100');
  });
});

describe('bandPath(time, lower, upper, x, y) / xyPath', () => {
  const x = timeScale([0, 2], box);
  const y = valueScale([0, 100], box);
  it('closes the area along the upper edge forward and the lower edge backward', () => {
    // d3-shape area: y1 (upper) forward, then y0 (lower) backward, then Z
    expect(bandPath([0, 2], [40, 40], [60, 60], x, y)).toBe('M0,40L100,40L100,60L0,60Z');
  });
  it('draws an x-y path with the same NaN breaks', () => {
    // a lone point after a gap is a one-point closed sub-path (d3-shape curveLinear closes it: "M x,y Z")
    expect(xyPath([0, 1, NaN, 2], [0, 50, 50, 100], x, y)).toBe('M0,100L50,50M100,0Z');
  });
});
