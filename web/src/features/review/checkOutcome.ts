import { selectFitPoints, volumeFitRules } from "../../../../shared/kinetics/traceSelection";
import type { ParsedTrace } from "../../../../shared/kinetics/traceCsvParser";
import { rateConstantUnit } from "../../../../shared/schemas/rateModels";
import type { BatchTraceView, BatchView } from "../batches/types";
import type { AnalysisOutcome } from "../kinetics/runAnalysis";
import type { ReviewCheckView } from "./types";

/** The batch's combined trace in the shape the kinetics charts take. */
export function traceForCharts(trace: BatchTraceView["trace"]): ParsedTrace {
  return { t: Float64Array.from(trace.t), V: Float64Array.from(trace.V) };
}

/**
 * The stored check as the kinetics charts and figures show it: the prediction from the batch's
 * trace, and the residuals placed at the times the fit used (the same selection the server made).
 */
export function checkOutcome(check: ReviewCheckView, view: BatchView, trace: BatchTraceView): AnalysisOutcome {
  const V0 = view.batch.v0L;
  const epsilonA = view.rateModel.epsilonA;
  // Library 1.1.0 on keeps points read past full conversion; a check stored by 1.0.0 dropped them,
  // and its residuals belong to the points those rules kept.
  const rules = check.libraryVersion === "1.0.0" ? { V0, epsilonA } : volumeFitRules(V0, epsilonA);
  const used = selectFitPoints(traceForCharts(trace.trace), rules);
  const { result } = check;
  return {
    where: "server",
    verdict: check.verdict,
    reasons: check.reasons,
    kObserved: check.kObserved,
    kObservedCI95: check.kObservedCI95,
    kModel: check.kModel,
    kUnit: result.kUnit || rateConstantUnit(view.rateModel.content.order),
    deviationPct: check.deviationPct,
    residualRms: check.residualRms,
    residualRmsMax: (view.rateModel.content.residualRmsMaxPctOfV0 / 100) * V0,
    points: check.points,
    maxConversion: check.maxConversion,
    V0,
    notes: result.notes ?? [],
    notice: result.notice,
    predicted: trace.predicted,
    residualTimes: used.t,
    residuals: result.fit?.residuals ?? [],
    linearised: result.linearised,
  };
}
