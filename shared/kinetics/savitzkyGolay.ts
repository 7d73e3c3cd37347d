import { choleskyFactor, choleskySolve } from "./smallLinearAlgebra.js";

export interface SmoothingOptions {
  /** Points in each local fit (odd, default 11). */
  window?: number;
  /** Degree of the local polynomial (default 2). */
  polynomialOrder?: number;
}

/**
 * Savitzky–Golay first derivative dy/dx at every point, by a local polynomial least-squares fit
 * over `window` neighbours, so uneven spacing is handled exactly. Near the ends the window is
 * shifted inwards and the polynomial differentiated at the point itself.
 */
export function smoothedDerivative(x: ArrayLike<number>, y: ArrayLike<number>, options: SmoothingOptions = {}): Float64Array {
  const n = x.length;
  const degree = options.polynomialOrder ?? 2;
  let window = options.window ?? 11;
  if (window % 2 === 0) window += 1;
  window = Math.min(window, n % 2 === 1 ? n : n - 1);
  const out = new Float64Array(n).fill(Number.NaN);
  const terms = degree + 1;
  if (window < terms + 1 || degree < 1) return out;
  const half = (window - 1) / 2;
  const moments = new Float64Array(2 * degree + 1);
  const rhs = new Float64Array(terms);
  const normal = new Float64Array(terms * terms);
  for (let i = 0; i < n; i++) {
    const lo = Math.min(Math.max(0, i - half), n - window);
    const hi = lo + window - 1;
    const span = 0.5 * (x[hi] - x[lo]);
    if (!(span > 0)) continue;
    moments.fill(0);
    rhs.fill(0);
    for (let j = lo; j <= hi; j++) {
      const u = (x[j] - x[i]) / span;
      let power = 1;
      for (let m = 0; m <= 2 * degree; m++) {
        moments[m] += power;
        if (m < terms) rhs[m] += power * y[j];
        power *= u;
      }
    }
    for (let r = 0; r < terms; r++) for (let c = 0; c < terms; c++) normal[r * terms + c] = moments[r + c];
    const factor = choleskyFactor(normal, terms);
    if (factor === undefined) continue;
    out[i] = choleskySolve(factor, rhs, terms)[1] / span;
  }
  return out;
}
