import { fromSI } from "../units/index.js";
import { arrheniusRateConstant } from "./arrhenius.js";
import { findExcursions, highestConversion, show, volumeDirectionFaults, volumeRange, type CheckReason } from "./checkReasons.js";
import { initialConcentrationGas } from "./conversion.js";
import type { FitResult } from "./fitResult.js";
import { KineticsInputError } from "./kineticsInputError.js";
import { linearisedIntegral } from "./linearisedFit.js";
import { predictVolume } from "./prediction.js";
import type { Trace } from "./trace.js";
import { fitVolumes } from "./volumeFit.js";

export interface ApprovedRateModel {
  order: number;
  /** k at TRef, (mol/L)^(1−n)/s. */
  kRef: number;
  /** K */
  TRef: number;
  /** J/mol */
  Ea: number;
  epsilonA: number;
  /** Allowed |kObserved − kModel|/kModel, %. */
  tolerancePct: number;
  /** Largest acceptable residual RMS of the fit, L; also the noise allowed on the volume limits. */
  residualRmsMax: number;
  /** Allowed half-width of the temperature band, K. */
  temperatureBandK: number;
  /** Allowed half-width of the pressure band, % of the set pressure. */
  pressureBandPct: number;
  /** Fewest usable points (default 10). */
  minPoints?: number;
  /** Lowest acceptable maximum conversion (default 0.1). */
  minConversion?: number;
}

export interface BatchConditions {
  /** Set temperature, K. */
  T: number;
  /** Set pressure, Pa (absolute). */
  P: number;
  /** Gas volume at t = 0, L. */
  V0: number;
  /** Initial concentration of A, mol/L. */
  cA0?: number;
  /** Mole fraction of A in a gaseous charge; gives cA0 = yA0·P/(R·T) when cA0 is not given. */
  yA0?: number;
}

/** The check's verdict with its reasons and the fit behind them. */
export interface KineticsVerdict {
  verdict: "within" | "outside";
  reasons: CheckReason[];
  kObserved: number;
  kObservedCI95: [number, number];
  kModel: number;
  kUnit: string;
  deviationPct: number;
  residualRms: number;
  points: number;
  maxConversion: number;
  cA0: number | undefined;
  fit: FitResult | null;
  /** Facts worth showing that are not reasons, e.g. a band that could not be checked. */
  notes: string[];
  notice: string;
}

/** The verdict with the series its charts draw. */
export interface KineticsCheckResult extends KineticsVerdict {
  /** Model volume at every trace time at kModel, L. */
  predicted: Float64Array;
  linearised: { x: Float64Array; y: Float64Array; slope: number; modelSlope: number } | null;
}

/** What the check compares. */
export interface KineticsCheckInput {
  model: ApprovedRateModel;
  conditions: BatchConditions;
  trace: Trace;
}

/** Shown with every check result. */
export const KINETICS_CHECK_NOTICE =
  "This check compares the volume trace with the approved rate model only. It does not replace the batch " +
  "review, the vessel's pressure and temperature limits or release by the responsible person under your " +
  "site's procedures and local codes.";

/** Compares an observed volume trace with the approved rate model at the batch conditions, with the series for its charts. */
export function checkTrace(input: KineticsCheckInput): KineticsCheckResult {
  const verdict = checkVerdict(input);
  return { ...verdict, ...chartSeries(input, verdict) };
}

/**
 * The verdict alone, for callers that draw nothing: the chart series (the prediction at every
 * time and the linearised plot, a logarithm per point) cost more than the fit behind the verdict.
 */
export function checkVerdict(input: KineticsCheckInput): KineticsVerdict {
  const { model, conditions, trace } = input;
  validate(model, conditions, trace);
  const reasons: CheckReason[] = [];
  const notes: string[] = [];
  const kModel = arrheniusRateConstant(model, conditions.T);
  const cA0 = conditions.cA0 ?? (conditions.yA0 !== undefined ? initialConcentrationGas(conditions.yA0, conditions.P, conditions.T) : undefined);
  if (cA0 === undefined && model.order !== 1) {
    throw new KineticsInputError("conditions.cA0", `cA0 (mol/L) or yA0 is needed to check an order-${model.order} model.`);
  }
  checkBands(model, conditions, trace, reasons, notes);
  const { V0 } = conditions;
  const eps = model.epsilonA;
  const base = { kModel, kUnit: "", cA0, notes, notice: KINETICS_CHECK_NOTICE };
  if (eps === 0) {
    reasons.unshift({
      code: "no-volume-change-expected",
      message: "The approved model has εA = 0: the gas volume does not change with conversion, so this trace cannot show the reaction's progress. Use another measure of conversion.",
    });
    return {
      ...base, verdict: "outside", reasons, kObserved: Number.NaN, kObservedCI95: [Number.NaN, Number.NaN],
      deviationPct: Number.NaN, residualRms: Number.NaN, points: trace.t.length, maxConversion: Number.NaN, fit: null,
    };
  }
  const allowance = model.residualRmsMax;
  const range = volumeRange(trace.V);
  const faults = volumeDirectionFaults(trace.V, V0, eps, allowance, range);
  const full = V0 * (1 + eps);
  if (faults.pastFull > 0) {
    reasons.push({
      code: "volume-past-full-conversion",
      message: `${faults.pastFull} point(s) lie beyond the full-conversion volume ${show(full)} L by more than ${show(allowance)} L (furthest ${show(faults.extremeV)} L): check for a leak or a meter fault.`,
    });
  }
  if (faults.against > 0) {
    reasons.push({
      code: "volume-against-epsilon",
      message: `${faults.against} point(s) move the volume ${eps > 0 ? "below" : "above"} V0 = ${show(V0)} L by more than ${show(allowance)} L (furthest ${show(faults.againstV)} L), against the sign of εA = ${show(eps)}.`,
    });
  }
  const maxConversion = highestConversion(trace.V, V0, eps, range);
  const minConversion = model.minConversion ?? 0.1;
  if (!(maxConversion >= minConversion)) {
    reasons.push({
      code: "conversion-too-low",
      message: `The highest conversion read from the volume is ${show(maxConversion, 3)}, below the ${show(minConversion, 3)} needed for a meaningful fit.`,
    });
  }
  // The trace alone gives the start: a start at the model's k could leave a batch far from the
  // model stranded on the plateau (every point past full conversion at that k) and report a k
  // close to the model's.
  const fit = fitVolumes(trace, { order: model.order, V0, epsilonA: eps, cA0 });
  const minPoints = model.minPoints ?? 10;
  if (fit.points < minPoints) {
    reasons.push({ code: "too-few-points", message: `Only ${fit.points} usable point(s); the model asks for at least ${minPoints}.` });
  }
  const deviationPct = (100 * (fit.k - kModel)) / kModel;
  if (!Number.isFinite(fit.k) || !fit.converged) {
    reasons.push({ code: "fit-failed", message: `The rate constant could not be fitted to this trace (${fit.warnings.join(" ") || "no result"}).` });
  } else if (Math.abs(deviationPct) > model.tolerancePct) {
    reasons.push({
      code: "k-outside-tolerance",
      message: `Observed k = ${show(fit.k, 6)} ${fit.kUnit} (95 % interval ${show(fit.kCI95[0], 6)} to ${show(fit.kCI95[1], 6)}) differs from the model's ${show(kModel, 6)} ${fit.kUnit} at ${show(conditions.T, 6)} K by ${show(deviationPct, 3)} %, outside ±${show(model.tolerancePct)} %.`,
    });
  }
  if (fit.residualRms > model.residualRmsMax) {
    reasons.push({
      code: "residuals-too-large",
      message: `Residual RMS of the fit is ${show(fit.residualRms)} L (${show(fit.residualRms * 1000)} mL), above the ${show(model.residualRmsMax)} L allowed: the trace does not follow an order-${show(model.order)} ${eps < 0 ? "fall" : "rise"} in volume.`,
    });
  }
  return {
    ...base, kUnit: fit.kUnit, verdict: reasons.length === 0 ? "within" : "outside", reasons, kObserved: fit.k,
    kObservedCI95: fit.kCI95, deviationPct, residualRms: fit.residualRms, points: fit.points, maxConversion, fit,
  };
}

/** The model's volume at every trace time and, where εA ≠ 0, the linearised plot with both slopes. */
function chartSeries({ model, conditions, trace }: KineticsCheckInput, verdict: KineticsVerdict): Pick<KineticsCheckResult, "predicted" | "linearised"> {
  const { V0 } = conditions;
  const { kModel, cA0 } = verdict;
  const eps = model.epsilonA;
  if (eps === 0) return { predicted: new Float64Array(trace.t.length).fill(V0), linearised: null };
  const points = linearisedIntegral(trace, { order: model.order, V0, epsilonA: eps, cA0 });
  return {
    predicted: predictVolume({ order: model.order, k: kModel, epsilonA: eps, V0, cA0 }, trace.t),
    linearised: { x: points.x, y: points.y, slope: verdict.kObserved * points.slopePerK, modelSlope: kModel * points.slopePerK },
  };
}

function checkBands(model: ApprovedRateModel, conditions: BatchConditions, trace: Trace, reasons: CheckReason[], notes: string[]): void {
  if (trace.T === undefined) notes.push("The trace has no temperature column; the temperature band was not checked.");
  else {
    const band = findExcursions(trace.t, trace.T, conditions.T, model.temperatureBandK);
    if (band !== undefined) {
      reasons.push({
        code: "temperature-outside-band",
        message: `Temperature left the band ${show(conditions.T, 6)} ± ${show(model.temperatureBandK)} K at ${band.count} of ${band.of} points (furthest ${show(band.worstValue, 6)} K, ${show(fromSI(band.worstValue, "°C"))} °C, at t = ${show(band.worstTime)} s).`,
      });
    }
  }
  if (trace.P === undefined) notes.push("The trace has no pressure column; the pressure band was not checked.");
  else {
    const halfWidth = (conditions.P * model.pressureBandPct) / 100;
    const band = findExcursions(trace.t, trace.P, conditions.P, halfWidth);
    if (band !== undefined) {
      reasons.push({
        code: "pressure-outside-band",
        message: `Pressure left the band ${show(fromSI(conditions.P, "bar(a)"))} bar(a) ± ${show(model.pressureBandPct)} % at ${band.count} of ${band.of} points (furthest ${show(fromSI(band.worstValue, "bar(a)"))} bar(a) at t = ${show(band.worstTime)} s).`,
      });
    }
  }
}

function validate(model: ApprovedRateModel, conditions: BatchConditions, trace: Trace): void {
  const positive: [string, number][] = [
    ["model.kRef", model.kRef], ["model.TRef", model.TRef], ["conditions.T", conditions.T],
    ["conditions.P", conditions.P], ["conditions.V0", conditions.V0],
  ];
  for (const [field, value] of positive) {
    if (!(value > 0) || !Number.isFinite(value)) throw new KineticsInputError(field, `${field} must be a positive number (got ${value}).`);
  }
  const nonNegative: [string, number][] = [
    ["model.order", model.order], ["model.Ea", model.Ea], ["model.tolerancePct", model.tolerancePct],
    ["model.residualRmsMax", model.residualRmsMax], ["model.temperatureBandK", model.temperatureBandK],
    ["model.pressureBandPct", model.pressureBandPct],
  ];
  for (const [field, value] of nonNegative) {
    if (!(value >= 0) || !Number.isFinite(value)) throw new KineticsInputError(field, `${field} must be zero or positive (got ${value}).`);
  }
  if (!Number.isFinite(model.epsilonA) || !(model.epsilonA > -1)) {
    throw new KineticsInputError("model.epsilonA", `εA must be a number above −1 (got ${model.epsilonA}).`);
  }
  if (trace.t.length !== trace.V.length) throw new KineticsInputError("trace.V", "trace.t and trace.V differ in length.");
  if (trace.T !== undefined && trace.T.length !== trace.t.length) throw new KineticsInputError("trace.T", "trace.T and trace.t differ in length.");
  if (trace.P !== undefined && trace.P.length !== trace.t.length) throw new KineticsInputError("trace.P", "trace.P and trace.t differ in length.");
}
