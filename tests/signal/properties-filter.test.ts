// Property tests of the zero-lag filter (fast-check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { zeroLagLowpass, zeroLagMinSamples } from '@/lib/signal/filter';

describe('properties of zeroLagLowpass', () => {
  it('a constant signal filters to itself (to 1e-9)', () => {
    // unit gain at 0 Hz plus steady-state initial conditions (scipy.signal.sosfilt_zi): no transient
    fc.assert(
      fc.property(
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.constantFrom(50, 100, 200, 500, 1000),
        fc.double({ min: 0.02, max: 0.3, noNaN: true }),
        fc.constantFrom(2, 4, 6),
        fc.integer({ min: 0, max: 200 }),
        (c, fs, frac, order, extra) => {
          const x = new Float64Array(zeroLagMinSamples(order) + extra).fill(c);
          const y = zeroLagLowpass(x, fs, frac * fs, order);
          y.forEach((v) => expect(Math.abs(v - c)).toBeLessThan(1e-9 * Math.max(1, Math.abs(c))));
        },
      ),
    );
  });

  it('is linear: filter(a x + b y) = a filter(x) + b filter(y)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1000, max: 1000, noNaN: true }), { minLength: 40, maxLength: 40 }),
        fc.array(fc.double({ min: -1000, max: 1000, noNaN: true }), { minLength: 40, maxLength: 40 }),
        fc.double({ min: -5, max: 5, noNaN: true }),
        (xs, ys, a) => {
          const x = Float64Array.from(xs);
          const y = Float64Array.from(ys);
          const mix = zeroLagLowpass(Float64Array.from(xs, (v, i) => a * v + y[i]), 100, 20);
          const fx = zeroLagLowpass(x, 100, 20);
          const fy = zeroLagLowpass(y, 100, 20);
          mix.forEach((v, i) => expect(Math.abs(v - (a * fx[i] + fy[i]))).toBeLessThan(1e-7));
        },
      ),
    );
  });
});
