import { solveSecondOrder } from "./closedFormSeries.js";

/**
 * Second-order conversion as a Taylor polynomial in d = τ − τa about an anchor τa, from the rate
 * law (1 + εA·X)·dX/dτ = (1 − X)². Between anchors a point costs two short polynomials and no
 * division, logarithm or Newton step.
 */

/** Degree of the polynomial in d; secondOrderCoefficients and the passes' loops are written out for it. */
export const SECOND_ORDER_DEGREE = 6;

/**
 * Reach as a fraction of the distance to the nearest singularity of X(τ): the remainder is then
 * of order (2·fraction)^(degree+1) ≈ 1e−17 (Cauchy bound on half the radius).
 */
const REACH_FRACTION = 1.8e-3;
/** Upper limit on the reach once the singularity is far away. */
const MAX_REACH = 0.02;

/** Where X(τ) is singular in the complex τ plane; fixed by εA alone, so found once per pass. */
export interface SecondOrderSingularity {
  real: number;
  imaginary: number;
}

/**
 * X(τ) is singular only where d τ/dX = 0, at y = X/(1 − X) = −1/(1 + εA), that is at
 * τ* = −1 − εA·ln(εA/(1 + εA)) (complex for −1 < εA < 0).
 */
export function secondOrderSingularity(eps: number): SecondOrderSingularity {
  if (eps === 0) return { real: -1, imaginary: 0 };
  if (eps > 0) return { real: -1 + eps * Math.log((1 + eps) / eps), imaginary: 0 };
  return { real: -1 - eps * Math.log(-eps / (1 + eps)), imaginary: Math.PI * eps };
}

/** The reach about the anchor τa: a fixed fraction of its distance to the singularity, capped. */
export function secondOrderReach(tauAnchor: number, singularity: SecondOrderSingularity): number {
  const { real, imaginary } = singularity;
  // For εA ≥ 0 the singularity lies on the real axis below zero, so τa − τ* is the distance.
  const distance = imaginary === 0 ? tauAnchor - real : Math.hypot(tauAnchor - real, imaginary);
  return Math.min(MAX_REACH, REACH_FRACTION * distance);
}

/** Conversion at τ by the exact implicit solve, warm-started from a nearby estimate of X. */
export function secondOrderConversion(tau: number, eps: number, estimate: number): number {
  const start = estimate > 0 && estimate < 1 ? estimate / (1 - estimate) : tau;
  const y = solveSecondOrder(tau, eps, start);
  return y / (1 + y);
}

/**
 * Fills a[0..6] with the Taylor coefficients of X about the anchor where X = x0:
 * (1 + εA·a0)(j + 1)·a[j+1] = Σ u_i·u_(j−i) − εA·Σ_(i≥1) a_i·(j − i + 1)·a[j−i+1], u = 1 − X,
 * written out for degree 6 (the sums in a loop cost most of an anchor's time, measured).
 */
export function secondOrderCoefficients(x0: number, eps: number, a: Float64Array): void {
  const U = 1 - x0;
  const p0 = 1 + eps * x0;
  const a1 = (U * U) / p0;
  const a2 = (-2 * U * a1 - eps * a1 * a1) / (2 * p0);
  const a3 = (-2 * U * a2 + a1 * a1 - 3 * eps * a1 * a2) / (3 * p0);
  const a4 = (-2 * U * a3 + 2 * a1 * a2 - eps * (4 * a1 * a3 + 2 * a2 * a2)) / (4 * p0);
  const a5 = (-2 * U * a4 + 2 * a1 * a3 + a2 * a2 - 5 * eps * (a1 * a4 + a2 * a3)) / (5 * p0);
  const a6 = (-2 * U * a5 + 2 * (a1 * a4 + a2 * a3) - eps * (6 * a1 * a5 + 6 * a2 * a4 + 3 * a3 * a3)) / (6 * p0);
  a[0] = x0;
  a[1] = a1;
  a[2] = a2;
  a[3] = a3;
  a[4] = a4;
  a[5] = a5;
  a[6] = a6;
}
