import { arrheniusRateConstant } from "../kinetics/arrhenius.js";
import { initialConcentrationGas } from "../kinetics/conversion.js";
import type { ApprovedRateModel, BatchConditions } from "../kinetics/checkTrace.js";
import type { RateModelContent } from "../schemas/rateModels.js";

export interface BatchOperatingPoint {
  v0L: number;
  temperatureK: number;
  pressurePa: number;
}

/** The approved model as the kinetics check takes it, with the residual limit at this batch's scale. */
export function checkModelFor(content: RateModelContent, epsilonA: number, v0L: number): ApprovedRateModel {
  return {
    order: content.order,
    kRef: content.kRef,
    TRef: content.TRefK,
    Ea: content.EaJPerMol,
    epsilonA,
    tolerancePct: content.tolerancePct,
    residualRmsMax: (content.residualRmsMaxPctOfV0 / 100) * v0L,
    temperatureBandK: content.temperatureBandK,
    pressureBandPct: content.pressureBandPct,
  };
}

/** The batch's planned conditions as the check takes them. */
export function checkConditionsFor(point: BatchOperatingPoint, yA0: number): BatchConditions {
  return { T: point.temperatureK, P: point.pressurePa, V0: point.v0L, yA0, cA0: initialConcentrationGas(yA0, point.pressurePa, point.temperatureK) };
}

/** The model's k at the batch temperature (Arrhenius). */
export function modelKAt(content: RateModelContent, temperatureK: number): number {
  return arrheniusRateConstant({ kRef: content.kRef, TRef: content.TRefK, Ea: content.EaJPerMol }, temperatureK);
}
