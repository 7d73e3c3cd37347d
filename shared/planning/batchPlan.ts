import { toSI, fromSI } from "../units/index.js";
import { initialConcentrationGas, volumeFromConversion } from "../kinetics/conversion.js";
import type { BatchPlanInput, BatchPlanResult, PlanProblem, ScaledCharge } from "../schemas/campaigns.js";
import type { MasterRecordContent } from "../schemas/masterRecords.js";

export interface PlanVessel {
  tag: string;
  status: "in-service" | "out-of-service";
  mawpPa: number;
  reliefSetPa: number;
  minVolumeL: number;
  maxVolumeL: number;
}

export interface PlanModel {
  epsilonA: number;
  yA0: number;
}

const bar = (pa: number) => `${fromSI(pa, "bar(a)").toFixed(2)} bar(a)`;
const litres = (l: number) => `${l.toPrecision(4)} L`;

/**
 * Works out a batch plan: the final volume V0(1 + εA·Xmax), CA0 at the planned P and T, the
 * charges scaled from per-litre-of-V0 quantities, and every reason the plan is not safe to run.
 */
export function planBatch(input: Pick<BatchPlanInput, "v0" | "temperature" | "pressure">, vessel: PlanVessel, model: PlanModel, record: Pick<MasterRecordContent, "maxConversion" | "phases">): BatchPlanResult {
  const v0L = toSI(input.v0.value, input.v0.unit);
  const temperatureK = toSI(input.temperature.value, input.temperature.unit);
  const pressurePa = toSI(input.pressure.value, input.pressure.unit);
  const maxConversion = record.maxConversion;
  const finalVolumeL = volumeFromConversion(maxConversion, v0L, model.epsilonA);
  const problems: PlanProblem[] = [];
  const physical = temperatureK > 0 && pressurePa > 0;
  if (temperatureK <= 0) problems.push({ code: "temperature-not-physical", field: "temperature", message: "The temperature must be above absolute zero." });
  if (pressurePa <= 0) problems.push({ code: "pressure-not-physical", field: "pressure", message: "The pressure must be above zero absolute." });
  if (vessel.status !== "in-service") problems.push({ code: "vessel-out-of-service", field: "vesselId", message: `Vessel ${vessel.tag} is out of service and cannot take a new batch.` });
  if (v0L < vessel.minVolumeL || v0L > vessel.maxVolumeL)
    problems.push({ code: "v0-outside-rated-range", field: "v0", message: `V0 of ${litres(v0L)} is outside ${vessel.tag}'s rated working volume, ${litres(vessel.minVolumeL)} to ${litres(vessel.maxVolumeL)}.` });
  if (model.epsilonA > 0 && finalVolumeL > vessel.maxVolumeL)
    problems.push({ code: "final-volume-above-rated-max", field: "v0", message: `At conversion ${maxConversion} the volume reaches ${litres(finalVolumeL)}, above ${vessel.tag}'s rated maximum of ${litres(vessel.maxVolumeL)}. Plan a smaller V0 (at most ${litres(vessel.maxVolumeL / (1 + model.epsilonA * maxConversion))}).` });
  if (model.epsilonA < 0 && finalVolumeL < vessel.minVolumeL)
    problems.push({ code: "final-volume-below-rated-min", field: "v0", message: `At conversion ${maxConversion} the volume falls to ${litres(finalVolumeL)}, below ${vessel.tag}'s rated minimum of ${litres(vessel.minVolumeL)}. Plan a larger V0.` });
  if (pressurePa > vessel.mawpPa) problems.push({ code: "pressure-above-mawp", field: "pressure", message: `The planned pressure ${bar(pressurePa)} is above ${vessel.tag}'s MAWP of ${bar(vessel.mawpPa)}.` });
  else if (pressurePa >= vessel.reliefSetPa) problems.push({ code: "pressure-at-or-above-relief", field: "pressure", message: `The planned pressure ${bar(pressurePa)} is at or above the relief set pressure of ${bar(vessel.reliefSetPa)}; the relief would lift.` });
  const charges: ScaledCharge[] = [];
  for (const step of record.phases.charge) {
    for (const field of step.fields) {
      if (field.kind !== "number" || !field.perLitreV0) continue;
      const scale = (v: number | null) => (v === null ? null : v * v0L);
      charges.push({ stepKey: step.key, stepTitle: step.title, fieldKey: field.key, label: field.label, unit: field.unit, perLitre: { low: field.low, high: field.high }, scaled: { low: scale(field.low), high: scale(field.high) } });
    }
  }
  return { epsilonA: model.epsilonA, v0L, temperatureK, pressurePa, maxConversion, finalVolumeL, cA0MolPerL: physical ? initialConcentrationGas(model.yA0, pressurePa, temperatureK) : NaN, charges, problems };
}
