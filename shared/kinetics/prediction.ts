import { KineticsInputError } from "./kineticsInputError.js";
import { BLOCK_POINTS, createConversionKernel, reducedTimeScale } from "./kernelFactory.js";

/** A rate model at fixed conditions: order n, k in (mol/L)^(1−n)/s, εA, V0 (L), cA0 (mol/L). */
export interface RateModelAtConditions {
  order: number;
  k: number;
  epsilonA: number;
  V0: number;
  /** Needed unless the order is 1. */
  cA0?: number;
}

/** Conversion XA at each time (s) from the model. */
export function predictConversion(model: RateModelAtConditions, t: ArrayLike<number>): Float64Array {
  const scale = reducedTimeScale(model.k, model.order, model.cA0);
  if (!Number.isFinite(scale)) {
    throw new KineticsInputError("cA0", `An initial concentration cA0 > 0 is needed for order ${model.order}.`);
  }
  if (!(model.epsilonA > -1)) throw new KineticsInputError("epsilonA", `εA must exceed −1 (got ${model.epsilonA}).`);
  let tMax = 0;
  for (let i = 0; i < t.length; i++) if (t[i] > tMax) tMax = t[i];
  const kernel = createConversionKernel(model.order, model.epsilonA, scale * tMax);
  const X = new Float64Array(t.length);
  const rate = new Float64Array(BLOCK_POINTS);
  for (let from = 0; from < t.length; from += BLOCK_POINTS) {
    const to = Math.min(t.length, from + BLOCK_POINTS);
    kernel.fill(scale, t, from, to, X.subarray(from, to), rate, null);
  }
  return X;
}

/** Gas volume (L) at each time (s) from the model; constant V0 when εA = 0. */
export function predictVolume(model: RateModelAtConditions, t: ArrayLike<number>): Float64Array {
  if (model.epsilonA === 0) return new Float64Array(t.length).fill(model.V0);
  const X = predictConversion(model, t);
  const amplitude = model.V0 * model.epsilonA;
  for (let i = 0; i < X.length; i++) X[i] = model.V0 + amplitude * X[i];
  return X;
}
