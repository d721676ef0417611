// Savitzky-Golay smoothing differentiator: the least-squares polynomial over a sliding window, evaluated (or its
// derivative) at one point of the window. Same numbers as scipy.signal.savgol_coeffs / savgol_filter(mode='interp').
import { Matrix, solve } from 'ml-matrix';

function checkWindow(window: number, polyOrder: number, deriv: number, delta: number): void {
  if (!Number.isInteger(window) || window < 1) throw new RangeError(`window must be a positive integer, got ${window}`);
  if (!Number.isInteger(polyOrder) || polyOrder < 0 || polyOrder >= window) {
    throw new RangeError(`polyOrder must be an integer from 0 to window - 1 = ${window - 1}, got ${polyOrder}`);
  }
  if (!Number.isInteger(deriv) || deriv < 0) throw new RangeError(`deriv must be a non-negative integer, got ${deriv}`);
  if (!(Number.isFinite(delta) && delta > 0)) throw new RangeError(`delta must be a positive number, got ${delta}`);
}

/**
 * Weights w so that sum_k w[k] x[k] over one window is the deriv-th derivative, at window position `pos`, of the
 * least-squares polynomial of polyOrder through the window ("dot" order: w[0] applies to the first sample).
 * Minimum-norm solution of A w = e_deriv * deriv! / delta^deriv with A[k][j] = (j - pos)^k, i.e. w = A^T (A A^T)^-1 e.
 */
export function savgolWeightsAt(window: number, polyOrder: number, deriv: number, delta: number, pos: number): Float64Array {
  checkWindow(window, polyOrder, deriv, delta);
  const out = new Float64Array(window);
  if (deriv > polyOrder) return out; // the derivative of a lower-order polynomial is 0 (scipy returns zeros too)
  const a = new Matrix(polyOrder + 1, window);
  for (let k = 0; k <= polyOrder; k++) for (let j = 0; j < window; j++) a.set(k, j, Math.pow(j - pos, k));
  const rhs = Matrix.zeros(polyOrder + 1, 1);
  let fact = 1;
  for (let i = 2; i <= deriv; i++) fact *= i;
  rhs.set(deriv, 0, fact / Math.pow(delta, deriv));
  const z = solve(a.mmul(a.transpose()), rhs);
  const w = a.transpose().mmul(z);
  for (let j = 0; j < window; j++) out[j] = w.get(j, 0);
  return out;
}

/**
 * scipy.signal.savgol_coeffs(window, polyOrder, deriv, delta) with its defaults (pos = centre, use='conv'):
 * the weights in convolution order, i.e. reversed against the samples they multiply.
 */
export function savgolCoefficients(window: number, polyOrder: number, deriv: number, delta = 1): Float64Array {
  checkWindow(window, polyOrder, deriv, delta);
  const half = Math.floor(window / 2);
  const pos = window % 2 === 0 ? half - 0.5 : half;
  return savgolWeightsAt(window, polyOrder, deriv, delta, pos).reverse();
}

/**
 * Savitzky-Golay filtered deriv-th derivative of x (a new array, or `out` when given: x.length values, not x),
 * scipy's savgol_filter(..., mode='interp').
 */
export function savgolFilter(x: Float64Array, window: number, polyOrder: number, deriv: number, delta = 1, out?: Float64Array): Float64Array {
  checkWindow(window, polyOrder, deriv, delta);
  if (window % 2 === 0) throw new RangeError(`window must be odd, got ${window}`);
  const n = x.length;
  if (n < window) throw new RangeError(`the signal has ${n} samples; the window of ${window} needs at least that many`);
  if (out && (out.length !== n || out === x)) throw new RangeError('out must be a separate array of x.length values');
  const half = (window - 1) / 2;
  const y = out ?? new Float64Array(n);
  const centre = savgolWeightsAt(window, polyOrder, deriv, delta, half);
  for (let i = half; i < n - half; i++) {
    let acc = 0;
    const start = i - half;
    for (let k = 0; k < window; k++) acc += centre[k] * x[start + k];
    y[i] = acc;
  }
  // Edges: the polynomial fitted on the first / last whole window, evaluated at the edge positions (mode='interp').
  for (let j = 0; j < half; j++) {
    const wl = savgolWeightsAt(window, polyOrder, deriv, delta, j);
    const wr = savgolWeightsAt(window, polyOrder, deriv, delta, window - half + j);
    let left = 0;
    let right = 0;
    for (let k = 0; k < window; k++) {
      left += wl[k] * x[k];
      right += wr[k] * x[n - window + k];
    }
    y[j] = left;
    y[n - half + j] = right;
  }
  return y;
}

/** First derivative of x sampled every dt seconds, Savitzky-Golay smoothed (units of x per second). */
export function savgolDerivative(x: Float64Array, window: number, polyOrder: number, dt: number, out?: Float64Array): Float64Array {
  return savgolFilter(x, window, polyOrder, 1, dt, out);
}
