import { KINETICS_LIBRARY_VERSION, type IntegralFitResult, type KineticsCheckResult, type KineticsVerdict, type OrderTrial } from "../../../shared/kinetics/index.js";
import type { CheckResponse, FitResponse, OrderTrialView } from "../../../shared/schemas/kinetics.js";

/** A number for JSON: NaN and ±Infinity become null (JSON has no spelling for them). */
const num = (value: number): number | null => (Number.isFinite(value) ? value : null);

/** A typed (or plain) array as a plain JSON array. */
export function plainArray(values: ArrayLike<number>): (number | null)[] {
  const out = new Array<number | null>(values.length);
  for (let i = 0; i < values.length; i++) out[i] = num(values[i]);
  return out;
}

const pair = (p: [number, number]): [number | null, number | null] => [num(p[0]), num(p[1])];

function presentTrial(trial: OrderTrial): OrderTrialView {
  return { ...trial, k: num(trial.k), residualRms: num(trial.residualRms), r2: num(trial.r2) };
}

/** The API's view of a fit: typed arrays made plain, non-finite numbers made null. */
export function presentFit(fit: IntegralFitResult, V0: number, includeSeries: boolean): FitResponse {
  const body: FitResponse = {
    method: fit.method,
    order: fit.order,
    orderFitted: fit.orderFitted,
    k: num(fit.k),
    kUnit: fit.kUnit,
    kStdError: num(fit.kStdError),
    kCI95: pair(fit.kCI95),
    r2: num(fit.r2),
    residualRms: num(fit.residualRms),
    points: fit.points,
    excludedPoints: fit.excludedPoints,
    converged: fit.converged,
    iterations: fit.iterations,
    warnings: fit.warnings,
    V0,
    libraryVersion: KINETICS_LIBRARY_VERSION,
  };
  if (fit.orderStdError !== undefined) body.orderStdError = num(fit.orderStdError);
  if (fit.orderCI95 !== undefined) body.orderCI95 = pair(fit.orderCI95);
  if (includeSeries) body.residuals = plainArray(fit.residuals);
  if (fit.orderTrials !== undefined) body.orders = fit.orderTrials.map(presentTrial);
  return body;
}

/** The API's view of a check against the approved model; the series come with a full check only. */
export function presentCheck(check: KineticsVerdict | KineticsCheckResult): CheckResponse {
  const body: CheckResponse = {
    verdict: check.verdict,
    reasons: check.reasons,
    kObserved: num(check.kObserved),
    kObservedCI95: pair(check.kObservedCI95),
    kModel: check.kModel,
    kUnit: check.kUnit,
    deviationPct: num(check.deviationPct),
    residualRms: num(check.residualRms),
    points: check.points,
    maxConversion: num(check.maxConversion),
    cA0: check.cA0 === undefined ? null : num(check.cA0),
    notes: check.notes,
    notice: check.notice,
    libraryVersion: KINETICS_LIBRARY_VERSION,
  };
  if ("predicted" in check) {
    body.predicted = plainArray(check.predicted);
    body.residuals = check.fit === null ? [] : plainArray(check.fit.residuals);
    const lin = check.linearised;
    body.linearised = lin === null ? null : { x: plainArray(lin.x), y: plainArray(lin.y), slope: num(lin.slope), modelSlope: num(lin.modelSlope) };
  }
  return body;
}
