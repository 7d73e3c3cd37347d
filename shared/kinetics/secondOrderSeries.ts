import { solveSecondOrder } from "./closedFormSeries.js";

/**
 * Second-order conversion as a Taylor polynomial in d = τ − τa about an anchor τa, from the rate
 * law (1 + εA·X)·dX/dτ = (1 − X)². Between anchors a point costs two short polynomials and no
 * division, logarithm or Newton step.
 */

/** Degree of the polynomial in d. */
export const SECOND_ORDER_DEGREE = 6;

/**
 * Reach as a fraction of the distance to the nearest singularity of X(τ): the remainder is then
 * of order (2·fraction)^(degree+1) ≈ 1e−17 (Cauchy bound on half the radius).
 */
const REACH_FRACTION = 1.8e-3;
/** Upper limit on the reach once the singularity is far away. */
const MAX_REACH = 0.02;

/**
 * X(τ) is singular only where d τ/dX = 0, at y = X/(1 − X) = −1/(1 + εA), that is at
 * τ* = −1 − εA·ln(εA/(1 + εA)) (complex for −1 < εA < 0). Returns the reach about τa.
 */
export function secondOrderReach(tauAnchor: number, eps: number): number {
  let distance: number;
  if (eps === 0) {
    distance = tauAnchor + 1;
  } else if (eps > 0) {
    distance = tauAnchor - (-1 + eps * Math.log((1 + eps) / eps));
  } else {
    const real = -1 - eps * Math.log(-eps / (1 + eps));
    distance = Math.hypot(tauAnchor - real, Math.PI * eps);
  }
  return Math.min(MAX_REACH, REACH_FRACTION * distance);
}

/** Conversion at τ by the exact implicit solve, warm-started from a nearby estimate of X. */
export function secondOrderConversion(tau: number, eps: number, estimate: number): number {
  const start = estimate > 0 && estimate < 1 ? estimate / (1 - estimate) : tau;
  const y = solveSecondOrder(tau, eps, start);
  return y / (1 + y);
}

/**
 * Fills a[0..degree] with the Taylor coefficients of X about the anchor where X = x0:
 * (1 + εA·a0)(j + 1)·a[j+1] = Σ u_i·u_(j−i) − εA·Σ_(i≥1) a_i·(j − i + 1)·a[j−i+1], u = 1 − X.
 */
export function secondOrderCoefficients(x0: number, eps: number, a: Float64Array): void {
  a[0] = x0;
  const p0 = 1 + eps * x0;
  for (let j = 0; j < SECOND_ORDER_DEGREE; j++) {
    let square = 0;
    for (let i = 0; i <= j; i++) square += (i === 0 ? 1 - x0 : -a[i]) * (j - i === 0 ? 1 - x0 : -a[j - i]);
    let cross = 0;
    for (let i = 1; i <= j; i++) cross += a[i] * (j - i + 1) * a[j - i + 1];
    a[j + 1] = (square - eps * cross) / ((j + 1) * p0);
  }
}
