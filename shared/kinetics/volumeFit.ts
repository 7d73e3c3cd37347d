import { rateConstantUnit, type FitResult } from "./fitResult.js";
import { assertFittable, type ChargeSetup } from "./fitSetup.js";
import { refineClosedForm, type ClosedFormSolution } from "./closedFormRefinement.js";
import { levenbergMarquardt } from "./levenbergMarquardt.js";
import { residualsAt } from "./residuals.js";
import { t95 } from "./studentT.js";
import type { Trace } from "./trace.js";
import { countPastFull, pastFullKeptWarning, selectFitPoints, shortOfFullGuard, thinPoints, volumeFitRules } from "./traceSelection.js";
import { createVolumeModel } from "./volumeModel.js";
import { OPEN_GUARD, type PointGuard } from "./passBasics.js";
import { closedFormReducedTime } from "./reducedTime.js";
import { SelectionBuffers } from "./selectionBuffers.js";

export interface VolumeFitOptions extends ChargeSetup {
  order: number;
  /** Also fit the order n (starting from `order`). */
  fitOrder?: boolean;
  /** Starting k; estimated from the trace when omitted. */
  initialK?: number;
}

const MAX_FITTED_ORDER = 6;
/**
 * Above this many points a thinned copy is fitted first to get close cheaply. At twice the
 * thinned size rather than 20 000, fits of 3 000 to 19 000 points took about half the time at
 * orders 2 and 1.5 and with the order fitted, and no longer at orders 0 and 1 (measured).
 */
const THIN_ABOVE = 2_000;
/**
 * Points of the thinned copy. On 10⁶-point traces of orders 0, 1 and 2 with noise of 0.2, 2 and
 * 20 mL on 2 L, a start from 1 000 points needed as many full passes as one from 4 000, at a
 * quarter of the cost, most of it at order 2, whose general model solves each point (measured).
 */
const THIN_TARGET = 1_000;
/**
 * Points at the end of the trace read for volumes past full conversion before the checked pass
 * is given a guard short of it: they gather on the plateau, where a thinned copy can miss a few,
 * and a pass that stops there has cost a whole pass.
 */
const TAIL_CHECKED = 20_000;
/** Marquardt's first λ from a start fitted to a thinned copy: the first step is nearly Gauss–Newton. */
const FITTED_START_DAMPING = 1e-6;
/** Converged when a full Gauss–Newton step is at most this fraction of k (as in the LM fit). */
const STEP_TOLERANCE = 1e-10;

/** Nonlinear least-squares fit of k (and optionally n) to the observed volumes. */
export function fitVolumes(trace: Trace, options: VolumeFitOptions): FitResult {
  const fitOrder = options.fitOrder ?? false;
  assertFittable(options, options.order, fitOrder);
  return fitClearTrace(trace, options, fitOrder) ?? fitSelectedPoints(trace, options, fitOrder);
}

/**
 * Many points at a fixed closed-form order: start from a thinned copy and refine on every point,
 * the first full pass also checking that each point is valid (finite, t ≥ 0), which the volume
 * fit's rules ask of a point, and no more. Undefined when a point is not (the selection drops it).
 */
function fitClearTrace(trace: Trace, options: VolumeFitOptions, fitOrder: boolean): FitResult | undefined {
  const order = closedFormOrder(options, fitOrder);
  if (order === undefined) return undefined;
  if (!(trace.t instanceof Float64Array && trace.V instanceof Float64Array)) return undefined;
  const n = Math.min(trace.t.length, trace.V.length);
  const rules = volumeFitRules(options.V0, options.epsilonA);
  if (n <= THIN_ABOVE) return undefined;
  const t = trace.t.subarray(0, n);
  const V = trace.V.subarray(0, n);
  const coarse = selectFitPoints(thinPoints(t, V, THIN_TARGET), rules);
  // A thinned copy that already loses points means the full pass would stop partway.
  if (coarse.excluded > 0 || coarse.t.length < 2) return undefined;
  const start = startingParams(coarse, options, false);
  const { V0, epsilonA, cA0 } = options;
  const refine = (guard: PointGuard) => refineClosedForm({ order, t, V, V0, epsilonA, cA0, guard }, start[0], STEP_TOLERANCE);
  // When neither the thinned copy nor the last points read past full conversion, the checked
  // pass takes a guard that admits only volumes short of it: if it completes, none is past, with
  // no count. Else (or if a point past full turns up after all) the open guard, which is all the
  // rules ask (every finite volume), and one read of the volumes counts those past full.
  const shortOfFull = countPastFull(coarse.V, rules) === 0 && countPastFull(V.subarray(Math.max(0, n - TAIL_CHECKED)), rules) === 0 ? shortOfFullGuard(rules) : undefined;
  let refined = shortOfFull === undefined ? undefined : refine(shortOfFull);
  const noneAtFull = refined !== undefined && refined.outcome !== "points need selection";
  if (!noneAtFull) refined = refine(OPEN_GUARD);
  if (refined === undefined || refined.outcome === "points need selection") return undefined;
  const pastFull = noneAtFull ? 0 : countPastFull(V, rules);
  const warnings = pastFull > 0 ? [pastFullKeptWarning(pastFull)] : [];
  const solution = refined.outcome === "converged" ? closedFormSolution(refined) : fitByLevenbergMarquardt({ t, V, setup: options, fitOrder }, start, warnings, true);
  return summarise(solution, options, fitOrder, 0, warnings);
}

/** The selected copy of the trace lives only within one fit (the result holds new arrays). */
const selectionBuffers = new SelectionBuffers();

/** The fit on the points the selection rules keep. */
function fitSelectedPoints(trace: Trace, options: VolumeFitOptions, fitOrder: boolean): FitResult {
  const selected = selectFitPoints(trace, volumeFitRules(options.V0, options.epsilonA), selectionBuffers);
  const warnings = [...selected.warnings];
  const parameterCount = fitOrder ? 2 : 1;
  const n = selected.t.length;
  if (n <= parameterCount) {
    warnings.push(`too few points: ${n} usable, at least ${parameterCount + 1} needed.`);
    return emptyResult(options.order, fitOrder, n, selected.excluded, warnings);
  }
  if (n < 5) warnings.push(`too few points: only ${n} usable.`);
  const problem: VolumeProblem = { t: selected.t, V: selected.V, setup: options, fitOrder, leadingRun: selected.leadingRun };
  const start = n > THIN_ABOVE ? startingParams(thinPoints(problem.t, problem.V, THIN_TARGET), options, fitOrder) : firstGuess(problem.t, problem.V, options, fitOrder);
  const solution = (n > THIN_ABOVE ? refineDirectly(problem, start) : undefined) ?? fitByLevenbergMarquardt(problem, start, warnings, n > THIN_ABOVE);
  return summarise(solution, options, fitOrder, selected.excluded, warnings);
}

/** The usable points and what is fitted to them. */
interface VolumeProblem {
  t: Float64Array;
  V: Float64Array;
  setup: VolumeFitOptions;
  fitOrder: boolean;
  /** Points from the first that the selection kept one after another (see ClosedFormData). */
  leadingRun?: number;
}

/** A converged (or last) point of either fitting route with its residuals. */
interface VolumeSolution {
  params: ArrayLike<number>;
  residuals: Float64Array;
  ssr: number;
  sst: number;
  /** (JᵀJ)⁻¹, row-major; undefined when singular. */
  inverse: Float64Array | undefined;
  converged: boolean;
  iterations: number;
}

function bounds(fitOrder: boolean): { lower: number[]; upper: number[] } {
  return fitOrder
    ? { lower: [0, 0], upper: [Number.POSITIVE_INFINITY, MAX_FITTED_ORDER] }
    : { lower: [0], upper: [Number.POSITIVE_INFINITY] };
}

/** [k] or [k, n] to start from, estimated from the trace. */
function firstGuess(t: Float64Array, V: Float64Array, setup: VolumeFitOptions, fitOrder: boolean): number[] {
  const k0 = offThePlateau(t, V, setup, setup.initialK ?? estimateInitialK(t, V, setup));
  return fitOrder ? [k0, setup.order] : [k0];
}

/** For many points: the first guess fitted to a thinned copy of the usable points. */
function startingParams(coarse: { t: Float64Array; V: Float64Array }, setup: VolumeFitOptions, fitOrder: boolean): number[] {
  const start = firstGuess(coarse.t, coarse.V, setup, fitOrder);
  const model = createVolumeModel({ t: coarse.t, V: coarse.V, V0: setup.V0, epsilonA: setup.epsilonA, cA0: setup.cA0, order: setup.order, fitOrder });
  const rough = levenbergMarquardt(model, { initial: start, ...bounds(fitOrder), stepTolerance: 1e-8 });
  return rough.params.every(Number.isFinite) ? Array.from(rough.params) : start;
}

/**
 * For a closed-form order at fixed n: Gauss–Newton on the full data from the thinned fit, one
 * fused pass per step; undefined (so the full LM runs) when a step fails to lower the residuals.
 */
function refineDirectly({ t, V, setup, fitOrder, leadingRun }: VolumeProblem, start: number[]): VolumeSolution | undefined {
  const order = closedFormOrder(setup, fitOrder);
  if (order === undefined) return undefined;
  const fast = refineClosedForm({ order, t, V, V0: setup.V0, epsilonA: setup.epsilonA, cA0: setup.cA0, leadingRun }, start[0], STEP_TOLERANCE);
  return fast.outcome === "converged" ? closedFormSolution(fast) : undefined;
}

/** The order when it is 0, 1 or 2 and fixed: the orders the closed-form refinement serves. */
function closedFormOrder(setup: VolumeFitOptions, fitOrder: boolean): 0 | 1 | 2 | undefined {
  const order = setup.order;
  return !fitOrder && (order === 0 || order === 1 || order === 2) ? order : undefined;
}

function closedFormSolution({ k, residuals, ssr, sst, jtj, steps }: ClosedFormSolution): VolumeSolution {
  return { params: [k], residuals, ssr, sst, inverse: Float64Array.of(1 / jtj), converged: true, iterations: steps };
}

/** Levenberg–Marquardt over all points, then the residuals at the solution; `fittedStart` when the start was fitted to a thinned copy. */
function fitByLevenbergMarquardt({ t, V, setup, fitOrder }: VolumeProblem, start: number[], warnings: string[], fittedStart: boolean): VolumeSolution {
  const { V0, epsilonA, cA0 } = setup;
  const model = createVolumeModel({ t, V, V0, epsilonA, cA0, order: setup.order, fitOrder });
  const lm = levenbergMarquardt(model, { initial: start, ...bounds(fitOrder), stepTolerance: STEP_TOLERANCE, initialDamping: fittedStart ? FITTED_START_DAMPING : undefined });
  if (!lm.converged) warnings.push(`did not converge: ${lm.message}.`);
  const order = fitOrder ? lm.params[1] : setup.order;
  const { residuals, ssr, sst } = residualsAt(t, V, { order, k: lm.params[0], epsilonA, V0, cA0 });
  return { params: lm.params, residuals, ssr, sst, inverse: lm.inverseNormalMatrix, converged: lm.converged, iterations: lm.iterations };
}

function summarise(
  solution: VolumeSolution,
  setup: VolumeFitOptions,
  fitOrder: boolean,
  excluded: number,
  warnings: string[],
): FitResult {
  const { residuals, ssr, sst, inverse } = solution;
  const k = solution.params[0];
  const order = fitOrder ? solution.params[1] : setup.order;
  const n = residuals.length;
  const p = fitOrder ? 2 : 1;
  const dof = n - p;
  const variance = ssr / dof;
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
 * Starting k from the straight line through the origin of τ(XA) = k·cA0^(n−1)·t on a thinned
 * copy: at orders 0, 1 and 2 that of the order itself (closed form), at any other order the
 * first-order line, carried to order n by matching the initial rate (dXA/dt at t = 0 is
 * k·cA0^(n−1)). Starting on the order's own line saved Levenberg–Marquardt iterations at
 * orders 0 and 2, each a solve per point at order 2 (measured).
 */
function estimateInitialK(t: Float64Array, V: Float64Array, setup: VolumeFitOptions): number {
  const coarse = thinPoints(t, V, 2000);
  const order = setup.order;
  const lineOrder: 0 | 1 | 2 = order === 0 || order === 2 ? order : 1;
  let sty = 0;
  let stt = 0;
  for (let i = 0; i < coarse.t.length; i++) {
    const X = (coarse.V[i] - setup.V0) / (setup.epsilonA * setup.V0);
    if (X > 0 && X < 0.95) {
      sty += coarse.t[i] * closedFormReducedTime(X, lineOrder, setup.epsilonA);
      stt += coarse.t[i] * coarse.t[i];
    }
  }
  const tEnd = t[t.length - 1];
  // The line's slope is k·cA0^(n−1); with no usable point, a rate of one per trace length.
  let scale = sty / stt;
  if (!(scale > 0) || !Number.isFinite(scale)) scale = tEnd > 0 ? 1 / tEnd : 1;
  if (order === 1) return scale;
  return scale / Math.pow(setup.cA0 as number, order - 1);
}

/**
 * A start so fast that every point is past full conversion gives a prediction that no longer
 * depends on k, and no fit can move from it: halve k until some point does depend on it.
 */
function offThePlateau(t: Float64Array, V: Float64Array, setup: VolumeFitOptions, k0: number): number {
  const probe = createVolumeModel({ ...thinPoints(t, V, THIN_TARGET), V0: setup.V0, epsilonA: setup.epsilonA, cA0: setup.cA0, order: setup.order, fitOrder: false });
  const jtj = new Float64Array(1);
  const jtr = new Float64Array(1);
  let k = k0;
  for (let halvings = 0; halvings < 60; halvings++) {
    if (!Number.isFinite(probe.accumulate(Float64Array.of(k), jtj, jtr)) || jtj[0] > 0) return k;
    k /= 2;
  }
  return k0;
}

function emptyResult(order: number, fitOrder: boolean, points: number, excluded: number, warnings: string[]): FitResult {
  return {
    method: "volume-nonlinear", order, orderFitted: fitOrder, k: Number.NaN, kUnit: rateConstantUnit(order),
    kStdError: Number.NaN, kCI95: [Number.NaN, Number.NaN], r2: Number.NaN, residuals: new Float64Array(0),
    residualRms: Number.NaN, points, excludedPoints: excluded, converged: false, iterations: 0, warnings,
  };
}
