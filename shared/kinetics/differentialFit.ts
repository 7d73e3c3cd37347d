import { rateConstantUnit } from "./fitResult.js";
import { KineticsInputError } from "./kineticsInputError.js";
import { fitLine } from "./lineFit.js";
import { smoothedDerivative, type SmoothingOptions } from "./savitzkyGolay.js";
import type { Trace } from "./trace.js";
import { selectFitPoints } from "./traceSelection.js";

export interface DifferentialOptions extends SmoothingOptions {
  V0: number;
  epsilonA: number;
  /** Initial concentration of A, mol/L. */
  cA0: number;
  /** Drop the first and last half-window of points, where the smoothing is one-sided (default true). */
  trimEdges?: boolean;
}

export interface DifferentialResult {
  order: number;
  orderStdError: number;
  orderCI95: [number, number];
  k: number;
  kUnit: string;
  kCI95: [number, number];
  lnK: number;
  lnKStdError: number;
  lnKCI95: [number, number];
  r2: number;
  points: number;
  /** ln CA (mol/L) and ln(−rA) (mol/(L·s)) at the points used, for the plot. */
  lnConcentration: Float64Array;
  lnRate: Float64Array;
  warnings: string[];
}

/**
 * Differential method: −rA = (cA0/εA)·d(ln V)/dt from a smoothed derivative, then n and k from
 * the straight line ln(−rA) = ln k + n·ln CA.
 */
export function fitDifferential(trace: Trace, options: DifferentialOptions): DifferentialResult {
  const { V0, epsilonA, cA0 } = options;
  if (!(V0 > 0)) throw new KineticsInputError("V0", `V0 must be a positive volume in L (got ${V0}).`);
  if (!Number.isFinite(epsilonA) || epsilonA === 0 || !(epsilonA > -1)) {
    throw new KineticsInputError("epsilonA", "εA must be non-zero and above −1 to read a rate from the volume.");
  }
  if (!(cA0 > 0)) throw new KineticsInputError("cA0", `cA0 must be a positive concentration in mol/L (got ${cA0}).`);
  const selected = selectFitPoints(trace, { V0, epsilonA, maxConversion: 0.99 });
  const warnings = [...selected.warnings];
  const n = selected.t.length;
  const lnV = new Float64Array(n);
  for (let i = 0; i < n; i++) lnV[i] = Math.log(selected.V[i]);
  const slope = smoothedDerivative(selected.t, lnV, options);
  const window = options.window ?? 11;
  const skip = options.trimEdges === false ? 0 : Math.floor(window / 2);
  const lnC = new Float64Array(n);
  const lnR = new Float64Array(n);
  let kept = 0;
  let dropped = 0;
  for (let i = skip; i < n - skip; i++) {
    const X = (selected.V[i] - V0) / (epsilonA * V0);
    const cA = (cA0 * (1 - X)) / (1 + epsilonA * X);
    const rate = (cA0 / epsilonA) * slope[i];
    if (!(rate > 0) || !(cA > 0) || !Number.isFinite(rate)) {
      dropped++;
      continue;
    }
    lnC[kept] = Math.log(cA);
    lnR[kept++] = Math.log(rate);
  }
  if (dropped > 0) warnings.push(`${dropped} point(s) with a non-positive rate or concentration excluded.`);
  if (kept < 5) warnings.push(`too few points: ${kept} usable for the rate line.`);
  const line = fitLine(lnC.subarray(0, kept), lnR.subarray(0, kept));
  return {
    order: line.slope,
    orderStdError: line.slopeStdError,
    orderCI95: line.slopeCI95,
    k: Math.exp(line.intercept),
    kUnit: rateConstantUnit(line.slope),
    kCI95: [Math.exp(line.interceptCI95[0]), Math.exp(line.interceptCI95[1])],
    lnK: line.intercept,
    lnKStdError: line.interceptStdError,
    lnKCI95: line.interceptCI95,
    r2: line.r2,
    points: kept,
    lnConcentration: lnC.slice(0, kept),
    lnRate: lnR.slice(0, kept),
    warnings,
  };
}
