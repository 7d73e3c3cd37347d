import { rateConstantUnit, type FitResult } from "./fitResult.js";
import { assertFittable, type ChargeSetup } from "./fitSetup.js";
import { fitLineThroughOrigin } from "./lineFit.js";
import { predictVolume } from "./prediction.js";
import { reducedTimeAtConversion } from "./reducedTime.js";
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
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const V = new Float64Array(n);
  let kept = 0;
  for (let i = 0; i < n; i++) {
    const X = (selected.V[i] - V0) / (epsilonA * V0);
    let value: number;
    if (order === 0) value = (cA0 / epsilonA) * Math.log1p(epsilonA * X);
    else if (order === 1) value = -Math.log1p(-X);
    else if (order === 2) value = ((1 + epsilonA) * X) / (1 - X) + epsilonA * Math.log1p(-X);
    else value = reducedTimeAtConversion(X, order, epsilonA) * Math.pow(cA0, 1 - order);
    if (!Number.isFinite(value)) continue;
    x[kept] = selected.t[i];
    y[kept] = value;
    V[kept++] = selected.V[i];
  }
  if (kept < n) warnings.push(`${n - kept} point(s) with a non-finite linearised value excluded.`);
  return {
    x: x.subarray(0, kept),
    y: y.subarray(0, kept),
    V: V.subarray(0, kept),
    slopePerK: order === 2 ? cA0 : 1,
    excluded: selected.excluded + (n - kept),
    warnings,
  };
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
  const predicted = n > 0 ? predictVolume({ order: options.order, k, epsilonA: options.epsilonA, V0: options.V0, cA0: options.cA0 }, points.x) : new Float64Array(0);
  const residuals = new Float64Array(n);
  let ssr = 0;
  for (let i = 0; i < n; i++) {
    residuals[i] = points.V[i] - predicted[i];
    ssr += residuals[i] * residuals[i];
  }
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
    converged: Number.isFinite(k),
    iterations: 0,
    warnings,
  };
}
