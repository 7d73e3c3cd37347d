import { KineticsInputError } from "./kineticsInputError.js";
import { fitLine } from "./lineFit.js";
import { GAS_CONSTANT } from "./version.js";

export interface ArrheniusParameters {
  /** k at the reference temperature, in the rate law's unit. */
  kRef: number;
  /** Reference temperature, K. */
  TRef: number;
  /** Activation energy, J/mol. */
  Ea: number;
}

export interface RateAtTemperature {
  /** K */
  T: number;
  k: number;
  /** Standard error of k; used as weight when every point has one and weighting is asked for. */
  kStdError?: number;
}

export interface ArrheniusFit extends ArrheniusParameters {
  kRefStdError: number;
  kRefCI95: [number, number];
  EaStdError: number;
  EaCI95: [number, number];
  lnKRef: number;
  lnKRefStdError: number;
  r2: number;
  points: number;
  weighted: boolean;
  warnings: string[];
}

/** k(T) = kRef·exp(−Ea/R·(1/T − 1/TRef)). */
export function arrheniusRateConstant(parameters: ArrheniusParameters, T: number): number {
  return parameters.kRef * Math.exp((-parameters.Ea / GAS_CONSTANT) * (1 / T - 1 / parameters.TRef));
}

/**
 * kRef and Ea from k at several temperatures: least squares on ln k against (1/T − 1/TRef),
 * weighted by (k/σk)² when `weighted` and every point has a standard error.
 */
export function fitArrhenius(points: RateAtTemperature[], TRef: number, weighted = false): ArrheniusFit {
  if (!(TRef > 0)) throw new KineticsInputError("TRef", `TRef must be a positive temperature in K (got ${TRef}).`);
  points.forEach((p, i) => {
    if (!(p.T > 0)) throw new KineticsInputError(`points[${i}].T`, `Temperature must be positive in K (got ${p.T}).`);
    if (!(p.k > 0)) throw new KineticsInputError(`points[${i}].k`, `k must be positive (got ${p.k}).`);
  });
  if (points.length < 2) throw new KineticsInputError("points", "At least two temperatures are needed.");
  const warnings: string[] = [];
  const useWeights = weighted && points.every((p) => p.kStdError !== undefined && p.kStdError > 0);
  if (weighted && !useWeights) warnings.push("not every k has a standard error; the fit is unweighted.");
  if (points.length === 2) warnings.push("only two temperatures: no standard errors or intervals.");
  const x = points.map((p) => 1 / p.T - 1 / TRef);
  const y = points.map((p) => Math.log(p.k));
  const weights = useWeights ? points.map((p) => (p.k / (p.kStdError as number)) ** 2) : undefined;
  const line = fitLine(x, y, weights);
  const kRef = Math.exp(line.intercept);
  return {
    kRef,
    TRef,
    Ea: -line.slope * GAS_CONSTANT,
    kRefStdError: kRef * line.interceptStdError,
    kRefCI95: [Math.exp(line.interceptCI95[0]), Math.exp(line.interceptCI95[1])],
    EaStdError: line.slopeStdError * GAS_CONSTANT,
    EaCI95: [-line.slopeCI95[1] * GAS_CONSTANT, -line.slopeCI95[0] * GAS_CONSTANT],
    lnKRef: line.intercept,
    lnKRefStdError: line.interceptStdError,
    r2: line.r2,
    points: points.length,
    weighted: useWeights,
    warnings,
  };
}
