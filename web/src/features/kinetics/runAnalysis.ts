import { checkTrace, KINETICS_CHECK_NOTICE, type ApprovedRateModel, type BatchConditions } from "../../../../shared/kinetics/checkTrace";
import { initialConcentrationGas } from "../../../../shared/kinetics/conversion";
import { fitAutoOrder } from "../../../../shared/kinetics/integralFit";
import { KineticsInputError } from "../../../../shared/kinetics/kineticsInputError";
import { selectFitPoints, volumeFitRules } from "../../../../shared/kinetics/traceSelection";
import type { ParsedTrace } from "../../../../shared/kinetics/traceCsvParser";
import type { CheckResponse, FitResponse, OrderTrialView } from "../../../../shared/schemas/kinetics";
import type { AnalysisSetup } from "./analysisForm";
import type { CheckFigures } from "./CheckFigureList";
import { uploadTrace } from "./uploadTrace";

type Series = ArrayLike<number | null>;

/** One check result, from the browser or the server, in the shape the screen shows. */
export interface AnalysisOutcome extends CheckFigures, Pick<CheckResponse, "verdict" | "reasons" | "notes" | "notice"> {
  where: "browser" | "server";
  V0: number;
  /** Model volume at every trace time, L. */
  predicted: Series;
  /** Fit residuals (L) at the times the fit used. */
  residualTimes: ArrayLike<number>;
  residuals: Series;
  linearised: { x: Series; y: Series; slope: number | null; modelSlope: number | null } | null;
  orders?: { trials: OrderTrialView[]; chosen: { order: number; orderFitted: boolean } } | { error: string };
}

/** The check's inputs in SI with V0 settled (typed or the first volume) and the residual limit in L. */
export function checkInputs(setup: AnalysisSetup, trace: ParsedTrace): { model: ApprovedRateModel; conditions: BatchConditions } {
  const V0 = setup.conditions.V0 ?? trace.V[0];
  return {
    model: { ...setup.model, residualRmsMax: (setup.residualPctOfV0 / 100) * V0 },
    conditions: { T: setup.conditions.T, P: setup.conditions.P, V0, yA0: setup.conditions.yA0 },
  };
}

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

function ordersInBrowser(trace: ParsedTrace, model: ApprovedRateModel, conditions: BatchConditions): AnalysisOutcome["orders"] {
  if (conditions.yA0 === undefined) return { error: "Comparing orders needs yA0 (mole fraction of A) to work out cA0." };
  const cA0 = initialConcentrationGas(conditions.yA0, conditions.P, conditions.T);
  try {
    const fit = fitAutoOrder(trace, { V0: conditions.V0, epsilonA: model.epsilonA, cA0 });
    const trials = (fit.orderTrials ?? []).map((t) => ({ ...t, k: finiteOrNull(t.k), residualRms: finiteOrNull(t.residualRms), r2: finiteOrNull(t.r2) }));
    return { trials, chosen: { order: fit.order, orderFitted: fit.orderFitted } };
  } catch (error) {
    if (error instanceof KineticsInputError) return { error: error.message };
    throw error;
  }
}

/** Runs the check with the shared library in this browser (the same code the server runs). */
export function analyseInBrowser(setup: AnalysisSetup, trace: ParsedTrace): AnalysisOutcome {
  const { model, conditions } = checkInputs(setup, trace);
  const result = checkTrace({ model, conditions, trace });
  const used = selectFitPoints(trace, volumeFitRules(conditions.V0, model.epsilonA));
  return {
    where: "browser",
    verdict: result.verdict,
    reasons: result.reasons,
    kObserved: finiteOrNull(result.kObserved),
    kObservedCI95: [finiteOrNull(result.kObservedCI95[0]), finiteOrNull(result.kObservedCI95[1])],
    kModel: result.kModel,
    kUnit: result.kUnit,
    deviationPct: finiteOrNull(result.deviationPct),
    residualRms: finiteOrNull(result.residualRms),
    residualRmsMax: model.residualRmsMax,
    points: result.points,
    maxConversion: finiteOrNull(result.maxConversion),
    V0: conditions.V0,
    notes: result.notes,
    notice: result.notice,
    predicted: result.predicted,
    residualTimes: used.t,
    residuals: result.fit?.residuals ?? new Float64Array(0),
    linearised: result.linearised,
    orders: setup.compareOrders ? ordersInBrowser(trace, model, conditions) : undefined,
  };
}

/** Sends the trace file to POST /api/kinetics/check (and /fit with order "auto" when asked). */
export async function analyseOnServer(setup: AnalysisSetup, trace: ParsedTrace, file: Blob, fileName: string, onProgress: (stage: string, fraction: number) => void): Promise<AnalysisOutcome> {
  const { model, conditions } = checkInputs(setup, trace);
  const check = await uploadTrace<CheckResponse>("/api/kinetics/check", { model, conditions }, file, fileName, (f) => onProgress("Uploading the trace for the check", f));
  let orders: AnalysisOutcome["orders"];
  if (setup.compareOrders) {
    if (conditions.yA0 === undefined) orders = { error: "Comparing orders needs yA0 (mole fraction of A) to work out cA0." };
    else {
      const cA0 = initialConcentrationGas(conditions.yA0, conditions.P, conditions.T);
      const params = { V0: conditions.V0, epsilonA: model.epsilonA, cA0, order: "auto", includeSeries: false };
      const fit = await uploadTrace<FitResponse>("/api/kinetics/fit", params, file, fileName, (f) => onProgress("Uploading the trace to compare orders", f));
      orders = { trials: fit.orders ?? [], chosen: { order: fit.order, orderFitted: fit.orderFitted } };
    }
  }
  const used = selectFitPoints(trace, volumeFitRules(conditions.V0, model.epsilonA));
  return {
    where: "server",
    verdict: check.verdict,
    reasons: check.reasons,
    kObserved: check.kObserved,
    kObservedCI95: check.kObservedCI95,
    kModel: check.kModel,
    kUnit: check.kUnit,
    deviationPct: check.deviationPct,
    residualRms: check.residualRms,
    residualRmsMax: model.residualRmsMax,
    points: check.points,
    maxConversion: check.maxConversion,
    V0: conditions.V0,
    notes: check.notes,
    notice: check.notice || KINETICS_CHECK_NOTICE,
    predicted: check.predicted ?? [],
    residualTimes: used.t,
    residuals: check.residuals ?? [],
    linearised: check.linearised ?? null,
    orders,
  };
}
