import { rateConstantUnit, type FitResult } from "./fitResult.js";
import { assertFittable, type ChargeSetup } from "./fitSetup.js";
import { fitLineThroughOrigin } from "./lineFit.js";
import { predictVolume } from "./prediction.js";
import { closedFormReducedTime, reducedTimeAtConversion } from "./reducedTime.js";
import type { Trace } from "./trace.js";
import { selectFitPoints } from "./traceSelection.js";

export interface LinearisedOptions extends ChargeSetup {
  order: number;
  /** Points above this conversion are left out of the straight line (default 0.99). */
  maxConversion?: number;
}

export interface LinearisedPoints {
  /** Time, s. */
  x: Float64Array;
  /** The linearised integral quantity; a straight line through the origin of slope k·kPerSlope. */
  y: Float64Array;
  /** Observed volumes at the kept points, L. */
  V: Float64Array;
  /** slope = k · slopePerK (cA0 for n = 2, 1 otherwise). */
  slopePerK: number;
  excluded: number;
  warnings: string[];
}

/**
 * The integral-method straight line: n = 0: (cA0/εA)·ln(V/V0); n = 1: −ln(1 − ΔV/(εA·V0));
 * n = 2: (1 + εA)·XA/(1 − XA) + εA·ln(1 − XA) (slope k·cA0); other n: τ(XA)·cA0^(1−n).
 */
export function linearisedIntegral(trace: Trace, options: LinearisedOptions): LinearisedPoints {
  assertFittable(options, options.order, false);
  const { V0, epsilonA, order } = options;
  const cA0 = options.cA0 ?? Number.NaN;
  const cap = options.maxConversion ?? 0.99;
  const selected = selectFitPoints(trace, { V0, epsilonA, maxConversion: cap });
  const warnings = [...selected.warnings];
  const n = selected.t.length;
  const y = new Float64Array(n);
  linearise(selected.V, { V0, epsilonA, order, cA0 }, y);
  const slopePerK = order === 2 ? cA0 : 1;
  // Usually every value is finite and the selected arrays serve as they are.
  const kept = finiteCount(y);
  if (kept === n) return { x: selected.t, y, V: selected.V, slopePerK, excluded: selected.excluded, warnings };
  const x = new Float64Array(kept);
  const V = new Float64Array(kept);
  const finite = new Float64Array(kept);
  for (let i = 0, j = 0; i < n; i++) {
    if (!Number.isFinite(y[i])) continue;
    x[j] = selected.t[i];
    V[j] = selected.V[i];
    finite[j++] = y[i];
  }
  warnings.push(`${n - kept} point(s) with a non-finite linearised value excluded.`);
  return { x, y: finite, V, slopePerK, excluded: selected.excluded + (n - kept), warnings };
}

/** How many values are finite (x − x is 0 for a finite x, NaN for ±∞ and NaN). */
function finiteCount(values: Float64Array): number {
  const n = values.length;
  let count = 0;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    if (v - v === 0) count++;
  }
  return count;
}

/**
 * The linearised quantity of each volume into y: τ(XA) in closed form at orders 0, 1 and 2
 * (times cA0 at order 0; order 2 keeps τ, its slope being k·cA0), τ(XA)·cA0^(1−n) otherwise.
 */
function linearise(volumes: Float64Array, model: { V0: number; epsilonA: number; order: number; cA0: number }, y: Float64Array): void {
  const { V0, epsilonA, order, cA0 } = model;
  const n = volumes.length;
  const perVolume = 1 / (epsilonA * V0);
  // One loop per closed form, each calling it with a constant order (one loop for all ran slower).
  if (order === 0) {
    for (let i = 0; i < n; i++) y[i] = cA0 * closedFormReducedTime((volumes[i] - V0) * perVolume, 0, epsilonA);
  } else if (order === 1) {
    for (let i = 0; i < n; i++) y[i] = closedFormReducedTime((volumes[i] - V0) * perVolume, 1, epsilonA);
  } else if (order === 2) {
    for (let i = 0; i < n; i++) y[i] = closedFormReducedTime((volumes[i] - V0) * perVolume, 2, epsilonA);
  } else {
    const factor = Math.pow(cA0, 1 - order);
    for (let i = 0; i < n; i++) y[i] = reducedTimeAtConversion((volumes[i] - V0) * perVolume, order, epsilonA) * factor;
  }
}

/** Writes observed − model over the model volumes; the residual sum of squares. */
function subtractFrom(observed: Float64Array, model: Float64Array): number {
  const n = model.length;
  let ssr = 0;
  for (let i = 0; i < n; i++) {
    const r = observed[i] - model[i];
    model[i] = r;
    ssr += r * r;
  }
  return ssr;
}

/** k from the straight line through the origin of the linearised integral quantity against t. */
export function fitLinearised(trace: Trace, options: LinearisedOptions): FitResult {
  const points = linearisedIntegral(trace, options);
  const warnings = [...points.warnings];
  const n = points.x.length;
  if (n < 3) warnings.push(`too few points: ${n} usable.`);
  const line = fitLineThroughOrigin(points.x, points.y);
  const k = line.slope / points.slopePerK;
  const kStdError = line.slopeStdError / points.slopePerK;
  // No model to predict from without a positive k: too few points, or volumes that moved against
  // the sign of εA (a falling line); the residuals are then unknown.
  const usable = k > 0 && Number.isFinite(k);
  if (n >= 2 && !usable) warnings.push(`no positive k: the straight line's slope is ${line.slope}; the volumes may move against the sign of εA.`);
  // Observed minus predicted, written over the prediction.
  const residuals = !usable ? new Float64Array(n).fill(Number.NaN) : predictVolume({ order: options.order, k, epsilonA: options.epsilonA, V0: options.V0, cA0: options.cA0 }, points.x);
  const ssr = subtractFrom(points.V, residuals);
  return {
    method: "linearised",
    order: options.order,
    orderFitted: false,
    k,
    kUnit: rateConstantUnit(options.order),
    kStdError,
    kCI95: [line.slopeCI95[0] / points.slopePerK, line.slopeCI95[1] / points.slopePerK],
    r2: line.r2,
    residuals,
    residualRms: Math.sqrt(ssr / n),
    points: n,
    excludedPoints: points.excluded,
    converged: usable,
    iterations: 0,
    warnings,
  };
}
