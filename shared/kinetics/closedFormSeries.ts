/** Short series and the second-order solve shared by the closed-form kernels and the fused fit passes. */

/** Largest distance from the anchor served by the series (degree 8: error below 1e-20). */
export const SERIES_REACH = 0.02;
const C2 = 1 / 2;
const C3 = 1 / 6;
const C4 = 1 / 24;
const C5 = 1 / 120;
const C6 = 1 / 720;
const C7 = 1 / 5040;
const C8 = 1 / 40320;

/** e^x − 1 for |x| ≤ SERIES_REACH. */
export function expm1Series(x: number): number {
  return x * (1 + x * (C2 + x * (C3 + x * (C4 + x * (C5 + x * (C6 + x * (C7 + x * C8)))))));
}

/** τ reach of one second-order anchor: keeps the predictor error near 1e−9 for εA in [−0.9, 5]. */
export const SECOND_ORDER_REACH = 5e-4;
const L2 = 1 / 2;
const L3 = 1 / 3;
const L4 = 1 / 4;
const L5 = 1 / 5;
const L6 = 1 / 6;
const L7 = 1 / 7;
const L8 = 1 / 8;

/** ln(1 + z) for |z| ≤ 5e−3 (error below 1e−20). */
export function log1pSeries(z: number): number {
  return z * (1 - z * (L2 - z * (L3 - z * (L4 - z * (L5 - z * (L6 - z * (L7 - z * L8)))))));
}

/** y = X/(1 − X) at reduced time τ > 0 by safeguarded Newton from `start`. */
export function solveSecondOrder(tau: number, eps: number, start: number): number {
  if (!(tau > 0)) return tau === 0 ? 0 : Number.NaN;
  let y = start > 0 ? start : tau / (1 + Math.abs(eps));
  for (let iteration = 0; iteration < 100; iteration++) {
    const residual = (1 + eps) * y - eps * Math.log1p(y) - tau;
    let next = y - residual / (1 + (eps * y) / (1 + y));
    if (!(next > 0)) next = 0.5 * y;
    const change = Math.abs(next - y);
    y = next;
    if (change <= 1e-15 * y) break;
  }
  return y;
}
