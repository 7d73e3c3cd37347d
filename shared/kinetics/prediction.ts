import { KineticsInputError } from "./kineticsInputError.js";
import { BLOCK_POINTS, createConversionKernel, reducedTimeScale } from "./kernelFactory.js";
import { carriedVolumes, gridVolumes } from "./exponentialVolumes.js";
import { likelyGrid } from "./regularGrid.js";
import { secondOrderVolumes } from "./secondOrderPasses.js";

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
  const X = new Float64Array(t.length);
  fillConversion(model, checkedScale(model), t, X);
  return X;
}

/** Above this many points, predicted volumes at orders 0 and 1 carry the exponential along the times. */
const MANY_POINTS = 1000;

/** Gas volume (L) at each time (s) from the model; constant V0 when εA = 0. */
export function predictVolume(model: RateModelAtConditions, t: ArrayLike<number>): Float64Array {
  if (model.epsilonA === 0) return new Float64Array(t.length).fill(model.V0);
  const scale = checkedScale(model);
  const V = new Float64Array(t.length);
  const order = model.order;
  if (order === 2) {
    secondOrderVolumes(model.V0, model.epsilonA, scale, t, V);
    return V;
  }
  if ((order === 0 || order === 1) && t instanceof Float64Array && t.length > MANY_POINTS) {
    const grid = likelyGrid(t, scale);
    const done = grid === undefined ? 0 : gridVolumes(order, scale, model.V0, model.epsilonA, t, grid, V);
    if (done < t.length) carriedVolumes(order, scale, model.V0, model.epsilonA, t, done, V);
    return V;
  }
  fillConversion(model, scale, t, V);
  const amplitude = model.V0 * model.epsilonA;
  for (let i = 0; i < V.length; i++) V[i] = model.V0 + amplitude * V[i];
  return V;
}

/** k·cA0^(n−1), or a KineticsInputError naming what is missing. */
function checkedScale(model: RateModelAtConditions): number {
  const scale = reducedTimeScale(model.k, model.order, model.cA0);
  if (!Number.isFinite(scale)) {
    throw new KineticsInputError("cA0", `An initial concentration cA0 > 0 is needed for order ${model.order}.`);
  }
  if (!(model.epsilonA > -1)) throw new KineticsInputError("epsilonA", `εA must exceed −1 (got ${model.epsilonA}).`);
  return scale;
}

/** Writes the conversion at each time into X. */
function fillConversion(model: RateModelAtConditions, scale: number, t: ArrayLike<number>, X: Float64Array): void {
  let tMax = 0;
  for (let i = 0; i < t.length; i++) if (t[i] > tMax) tMax = t[i];
  const kernel = createConversionKernel(model.order, model.epsilonA, scale * tMax);
  const rate = new Float64Array(BLOCK_POINTS);
  for (let from = 0; from < t.length; from += BLOCK_POINTS) {
    const to = Math.min(t.length, from + BLOCK_POINTS);
    kernel.fill(scale, t, from, to, X.subarray(from, to), rate, null);
  }
}
