import { KineticsInputError } from "./kineticsInputError.js";
import { volumeRange } from "./checkReasons.js";
import { orderLabel, rateConstantUnit, type FitResult } from "./fitResult.js";
import type { ChargeSetup } from "./fitSetup.js";
import { fitLinearised } from "./linearisedFit.js";
import type { Trace } from "./trace.js";
import { fitVolumes } from "./volumeFit.js";

/** Orders tried by order "auto", besides the free-n fit. */
export const AUTO_ORDERS = [0, 0.5, 1, 1.5, 2] as const;
/** An integer order is preferred when its residual RMS is within this factor of the best. */
const SIMPLER_ORDER_MARGIN = 1.05;
/**
 * Residual RMS below this fraction of the largest volume is rounding, so fits that reach it are
 * equally good whatever their RMS ratio: on a noise-free trace the tried order then wins over the
 * free n (which would report n = 6e−15 for a zero-order trace).
 */
const ROUNDING_RMS = 1e-10;

export interface OrderTrial {
  label: string;
  order: number;
  orderFitted: boolean;
  k: number;
  kUnit: string;
  residualRms: number;
  r2: number;
  converged: boolean;
}

export interface IntegralFitOptions extends ChargeSetup {
  order: number | "auto";
  /** "volume" (default): nonlinear least squares on V; "linearised": straight line through the origin. */
  method?: "volume" | "linearised";
  /** With a numeric order and method "volume": also fit n. */
  fitOrder?: boolean;
  initialK?: number;
}

export interface IntegralFitResult extends FitResult {
  /** Every order tried, when order was "auto". */
  orderTrials?: OrderTrial[];
}

/** Integral-method fit of k at a given order, or of the best order when order is "auto". */
export function fitIntegral(trace: Trace, options: IntegralFitOptions): IntegralFitResult {
  if (options.order === "auto") return fitAutoOrder(trace, options);
  if (options.method === "linearised") return fitLinearised(trace, { ...options, order: options.order });
  return fitVolumes(trace, { ...options, order: options.order });
}

/**
 * Fits orders 0, 0.5, 1, 1.5, 2 and a free n on the volumes; returns the lowest residual RMS,
 * except that an integer order within 5 % of the best is preferred.
 */
export function fitAutoOrder(trace: Trace, setup: ChargeSetup): IntegralFitResult {
  if (!(setup.cA0 !== undefined && setup.cA0 > 0)) {
    throw new KineticsInputError("cA0", 'Order "auto" tries orders other than 1, so an initial concentration cA0 > 0 (mol/L) is needed.');
  }
  const fits = AUTO_ORDERS.map((order) => fitVolumes(trace, { ...setup, order }));
  const usable = fits.filter((f) => f.converged && Number.isFinite(f.residualRms));
  const startOrder = lowestRms(usable)?.order ?? 1;
  fits.push(fitVolumes(trace, { ...setup, order: startOrder, fitOrder: true }));
  const candidates = fits.filter((f) => f.converged && Number.isFinite(f.residualRms));
  const trials = fits.map(toTrial);
  if (candidates.length === 0) {
    const fallback = fits[2];
    return { ...fallback, warnings: [...fallback.warnings, "did not converge at any order tried."], orderTrials: trials };
  }
  const best = lowestRms(candidates) as FitResult;
  const range = volumeRange(trace.V);
  const rounding = ROUNDING_RMS * Math.max(Math.abs(range.largest), Math.abs(range.smallest));
  const fixed = candidates.filter((f) => !f.orderFitted);
  const integer = lowestRms(fixed.filter((f) => Number.isInteger(f.order) && f.residualRms <= Math.max(SIMPLER_ORDER_MARGIN * best.residualRms, rounding)));
  const tried = lowestRms(fixed.filter((f) => f.residualRms <= Math.max(best.residualRms, rounding)));
  const chosen = integer ?? tried ?? best;
  return { ...chosen, orderTrials: trials };
}

/** The fit of least residual RMS (the first of equals); undefined for none. */
function lowestRms(fits: FitResult[]): FitResult | undefined {
  return fits.reduce<FitResult | undefined>((a, b) => (a === undefined || b.residualRms < a.residualRms ? b : a), undefined);
}

function toTrial(fit: FitResult): OrderTrial {
  return {
    label: orderLabel(fit.order, fit.orderFitted),
    order: fit.order,
    orderFitted: fit.orderFitted,
    k: fit.k,
    kUnit: fit.orderFitted ? rateConstantUnit(fit.order) : fit.kUnit,
    residualRms: fit.residualRms,
    r2: fit.r2,
    converged: fit.converged,
  };
}
