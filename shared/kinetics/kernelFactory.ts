import { FirstOrderKernel, SecondOrderKernel, ZeroOrderKernel, type ConversionKernel } from "./conversionKernel.js";
import { GeneralOrderKernel } from "./generalOrderKernel.js";

/** Points handled per kernel call: small enough to stay in cache. */
export const BLOCK_POINTS = 4096;

/** Orders with a closed-form conversion. */
export function hasClosedForm(order: number): boolean {
  return order === 0 || order === 1 || order === 2;
}

/**
 * A kernel for the order: closed form for 0, 1, 2 unless the order sensitivity is needed,
 * else the integrated general-order route (τ table built to at least tauMax).
 */
export function createConversionKernel(
  order: number,
  epsilonA: number,
  tauMax: number,
  needOrderSensitivity = false,
): ConversionKernel {
  if (!needOrderSensitivity) {
    if (order === 1) return new FirstOrderKernel();
    if (order === 0) return new ZeroOrderKernel(epsilonA);
    if (order === 2) return new SecondOrderKernel(epsilonA);
  }
  return new GeneralOrderKernel(order, epsilonA, tauMax);
}

/** Scale from time to reduced time, τ = k·cA0^(n−1)·t; NaN when cA0 is needed and missing. */
export function reducedTimeScale(k: number, order: number, cA0: number | undefined): number {
  if (order === 1) return k;
  if (cA0 === undefined || !(cA0 > 0)) return Number.NaN;
  return k * Math.pow(cA0, order - 1);
}
