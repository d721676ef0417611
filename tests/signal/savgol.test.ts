import { describe, expect, it } from 'vitest';
import reference from '../fixtures/scipy/reference.json';
import { savgolCoefficients, savgolDerivative, savgolFilter } from '@/lib/signal/savgol';

const x = Float64Array.from(reference.x);

describe('savgolCoefficients(window, polyOrder, deriv, delta)', () => {
  it.each(reference.savgol_coeffs.map((r) => [r.window, r.poly, r.deriv, r.delta, r] as const))(
    'window %i poly %i deriv %i delta %f equals scipy.signal.savgol_coeffs',
    (window, poly, deriv, delta, r) => {
      // reference: scipy.signal.savgol_coeffs (Debian python3-scipy, tests/fixtures/scipy/reference.json)
      const c = savgolCoefficients(window, poly, deriv, delta);
      const scale = Math.max(...r.c.map(Math.abs));
      c.forEach((v, i) => expect(Math.abs(v - r.c[i]) / scale).toBeLessThan(1e-10));
    },
  );

  it('gives the classic 5-point quadratic smoothing weights', () => {
    // Savitzky & Golay 1964 table, quadratic, 5 points: (-3, 12, 17, 12, -3) / 35 [MEM]
    const c = savgolCoefficients(5, 2, 0);
    [-3, 12, 17, 12, -3].forEach((w, i) => expect(c[i]).toBeCloseTo(w / 35, 12));
  });

  it('refuses a polynomial order not below the window', () => {
    expect(() => savgolCoefficients(5, 5, 0)).toThrow(RangeError);
    expect(() => savgolCoefficients(0, 0, 0)).toThrow(RangeError);
    expect(() => savgolCoefficients(5, 2, 0, 0)).toThrow(RangeError);
  });
});

describe("savgolFilter / savgolDerivative (scipy mode='interp')", () => {
  it.each(reference.savgol_filter.map((r) => [r.window, r.poly, r.deriv, r] as const))(
    'window %i poly %i deriv %i equals scipy.signal.savgol_filter on the test signal',
    (window, poly, deriv, r) => {
      // reference: scipy.signal.savgol_filter(x, window, poly, deriv, delta=0.01, mode='interp') (Debian python3-scipy)
      const y = deriv === 1 ? savgolDerivative(x, window, poly, r.delta) : savgolFilter(x, window, poly, deriv, r.delta);
      const scale = Math.max(...r.y.map(Math.abs));
      y.forEach((v, i) => expect(Math.abs(v - r.y[i]) / scale).toBeLessThan(1e-10));
    },
  );

  it('differentiates a quadratic exactly, edges included', () => {
    // d/dt (3 t^2 - 2 t + 1) = 6 t - 2: a degree-2 fit reproduces a quadratic exactly [math]
    const dt = 0.01;
    const q = Float64Array.from({ length: 40 }, (_, i) => 3 * (i * dt) ** 2 - 2 * i * dt + 1);
    const d = savgolDerivative(q, 11, 2, dt);
    d.forEach((v, i) => expect(v).toBeCloseTo(6 * i * dt - 2, 9));
  });

  it('refuses an even window or a signal shorter than the window', () => {
    expect(() => savgolDerivative(x, 10, 2, 0.01)).toThrow(RangeError);
    expect(() => savgolDerivative(new Float64Array(5), 11, 2, 0.01)).toThrow(/at least/);
  });
});
