import { rateConstantUnit, type FitResult } from "./fitResult.js";
import { assertFittable, type ChargeSetup } from "./fitSetup.js";
import { levenbergMarquardt, type LevenbergMarquardtResult } from "./levenbergMarquardt.js";
import { residualsAt } from "./residuals.js";
import { t95 } from "./studentT.js";
import type { Trace } from "./trace.js";
import { selectFitPoints, thinPoints } from "./traceSelection.js";
import { createVolumeModel } from "./volumeModel.js";

export interface VolumeFitOptions extends ChargeSetup {
  order: number;
  /** Also fit the order n (starting from `order`). */
  fitOrder?: boolean;
  /** Starting k; estimated from the trace when omitted. */
  initialK?: number;
}

const MAX_FITTED_ORDER = 6;
/** Above this many points a thinned copy is fitted first to get close cheaply. */
const THIN_ABOVE = 20_000;
const THIN_TARGET = 4_000;

/** Nonlinear least-squares fit of k (and optionally n) to the observed volumes. */
export function fitVolumes(trace: Trace, options: VolumeFitOptions): FitResult {
  const fitOrder = options.fitOrder ?? false;
  assertFittable(options, options.order, fitOrder);
  const { V0, epsilonA, cA0 } = options;
  const selected = selectFitPoints(trace, { V0, epsilonA });
  const warnings = [...selected.warnings];
  const parameterCount = fitOrder ? 2 : 1;
  const n = selected.t.length;
  if (n <= parameterCount) {
    warnings.push(`too few points: ${n} usable, at least ${parameterCount + 1} needed.`);
    return emptyResult(options.order, fitOrder, n, selected.excluded, warnings);
  }
  if (n < 5) warnings.push(`too few points: only ${n} usable.`);
  const k0 = options.initialK ?? estimateInitialK(selected.t, selected.V, options);
  let start = fitOrder ? [k0, options.order] : [k0];
  const lower = fitOrder ? [0, 0] : [0];
  const upper = fitOrder ? [Number.POSITIVE_INFINITY, MAX_FITTED_ORDER] : [Number.POSITIVE_INFINITY];
  if (n > THIN_ABOVE) {
    const coarse = thinPoints(selected.t, selected.V, THIN_TARGET);
    const rough = levenbergMarquardt(createVolumeModel({ ...coarse, V0, epsilonA, cA0, order: options.order, fitOrder }), {
      initial: start, lower, upper, stepTolerance: 1e-8,
    });
    if (rough.params.every(Number.isFinite)) start = Array.from(rough.params);
  }
  const model = createVolumeModel({ t: selected.t, V: selected.V, V0, epsilonA, cA0, order: options.order, fitOrder });
  const solution = levenbergMarquardt(model, { initial: start, lower, upper });
  if (!solution.converged) warnings.push(`did not converge: ${solution.message}.`);
  return summarise(solution, selected.t, selected.V, options, fitOrder, selected.excluded, warnings);
}

function summarise(
  solution: LevenbergMarquardtResult,
  t: Float64Array,
  V: Float64Array,
  setup: VolumeFitOptions,
  fitOrder: boolean,
  excluded: number,
  warnings: string[],
): FitResult {
  const k = solution.params[0];
  const order = fitOrder ? solution.params[1] : setup.order;
  const n = t.length;
  const p = fitOrder ? 2 : 1;
  const { residuals, ssr, sst } = residualsAt(t, V, { order, k, epsilonA: setup.epsilonA, V0: setup.V0, cA0: setup.cA0 });
  const dof = n - p;
  const variance = ssr / dof;
  const inverse = solution.inverseNormalMatrix;
  const kStdError = inverse === undefined ? Number.NaN : Math.sqrt(variance * inverse[0]);
  const tq = t95(dof);
  const result: FitResult = {
    method: "volume-nonlinear",
    order,
    orderFitted: fitOrder,
    k,
    kUnit: rateConstantUnit(order),
    kStdError,
    kCI95: [k - tq * kStdError, k + tq * kStdError],
    r2: 1 - ssr / sst,
    residuals,
    residualRms: Math.sqrt(ssr / n),
    points: n,
    excludedPoints: excluded,
    converged: solution.converged,
    iterations: solution.iterations,
    warnings,
  };
  if (fitOrder) {
    const nStdError = inverse === undefined ? Number.NaN : Math.sqrt(variance * inverse[3]);
    result.orderStdError = nStdError;
    result.orderCI95 = [order - tq * nStdError, order + tq * nStdError];
  }
  return result;
}

/**
 * Starting k from the first-order straight line −ln(1 − XA) against t on a thinned copy,
 * carried to order n by matching the initial rate (dXA/dt at t = 0 is k·cA0^(n−1)).
 */
function estimateInitialK(t: Float64Array, V: Float64Array, setup: VolumeFitOptions): number {
  const coarse = thinPoints(t, V, 2000);
  let sty = 0;
  let stt = 0;
  for (let i = 0; i < coarse.t.length; i++) {
    const X = (coarse.V[i] - setup.V0) / (setup.epsilonA * setup.V0);
    if (X > 0 && X < 0.95) {
      sty += coarse.t[i] * -Math.log1p(-X);
      stt += coarse.t[i] * coarse.t[i];
    }
  }
  const tEnd = t[t.length - 1];
  let k1 = sty / stt;
  if (!(k1 > 0) || !Number.isFinite(k1)) k1 = tEnd > 0 ? 1 / tEnd : 1;
  if (setup.order === 1) return k1;
  return k1 / Math.pow(setup.cA0 as number, setup.order - 1);
}

function emptyResult(order: number, fitOrder: boolean, points: number, excluded: number, warnings: string[]): FitResult {
  return {
    method: "volume-nonlinear", order, orderFitted: fitOrder, k: Number.NaN, kUnit: rateConstantUnit(order),
    kStdError: Number.NaN, kCI95: [Number.NaN, Number.NaN], r2: Number.NaN, residuals: new Float64Array(0),
    residualRms: Number.NaN, points, excludedPoints: excluded, converged: false, iterations: 0, warnings,
  };
}
