import { closedFormPass } from "./closedFormPasses.js";
import type { PassSums, PointGuard } from "./passBasics.js";
import { ClosedFormPassRunner } from "./closedFormPassRunner.js";
import { thinPoints } from "./traceSelection.js";

/** The data and charge for refining k at a closed-form order. */
export interface ClosedFormData {
  order: 0 | 1 | 2;
  t: Float64Array;
  V: Float64Array;
  V0: number;
  epsilonA: number;
  /** mol/L; needed unless the order is 1. */
  cA0?: number;
  /**
   * Limits every point must meet when the points have not been selected yet: the first pass
   * checks them and the refinement gives up ("points need selection") at the first that fails.
   */
  guard?: PointGuard;
  /**
   * How many points from the first follow one another as the trace had them, with none dropped
   * between (a selection's leading run): the passes may take the grid loops over that run alone.
   */
  leadingRun?: number;
}

export interface ClosedFormSolution {
  outcome: "converged";
  k: number;
  /** Observed minus model volume at k, one per point. */
  residuals: Float64Array;
  ssr: number;
  sst: number;
  /** JᵀJ for k at the solution (1×1 normal matrix). */
  jtj: number;
  /** Gauss–Newton steps taken. */
  steps: number;
}

/** Why the refinement handed over to Levenberg–Marquardt, with the last k and the one tried. */
export interface ClosedFormGiveUp {
  outcome: "points need selection" | "no finite prediction" | "k would not stay positive" | "residual sum rose" | "too many steps";
  k: number;
  triedK: number;
}

/** Steps allowed before handing over to the full Levenberg–Marquardt fit. */
const MAX_STEPS = 4;
/**
 * A rise of the residual sum below this fraction is rounding, not a worse fit: a sum of n squares
 * carries about √n·2⁻⁵³ relative error (3e−13 at 10⁷ points), and near the minimum a step of
 * 1e−9·k changes the sum by less than that.
 */
const ROUNDING_ALLOWANCE = 1e-12;

/**
 * Gauss–Newton on k from a close start, one fused pass over the data per step. A step is kept
 * only when it lowers the residual sum (within rounding). Converged when the next Gauss–Newton
 * step is at most stepTolerance·k, the criterion the Levenberg–Marquardt fit uses; the residuals
 * are then those of the last pass. Gives up when a step fails or the steps run out, so the
 * caller falls back to Levenberg–Marquardt.
 */
export function refineClosedForm(data: ClosedFormData, initialK: number, stepTolerance = 1e-10): ClosedFormSolution | ClosedFormGiveUp {
  const passes = new ClosedFormPassRunner(data);
  const sums: PassSums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
  const giveUp = (outcome: ClosedFormGiveUp["outcome"], k: number, triedK: number): ClosedFormGiveUp => ({ outcome, k, triedK });
  if (!(initialK > 0) || !passes.usable) return giveUp("no finite prediction", initialK, initialK);
  if (!passes.first(initialK, sums)) return giveUp("points need selection", initialK, initialK);
  if (!usable(sums)) return giveUp("no finite prediction", initialK, initialK);
  const residuals = new Float64Array(data.t.length);
  let k = initialK;
  let ssr = sums.ssr;
  let step = sums.jtr / sums.jtj;
  let residualsAtK = false;
  const bend = stepBend(data, passes, initialK);
  for (let steps = 0; steps <= MAX_STEPS; steps++) {
    if (Math.abs(step) <= stepTolerance * k) {
      if (!residualsAtK) passes.withResiduals(k, residuals, sums);
      return { outcome: "converged", k, residuals, ssr: sums.ssr, sst: sums.sst, jtj: sums.jtj, steps };
    }
    if (steps === MAX_STEPS) break;
    const next = k + step - bentPart(bend, step);
    if (!(next > 0)) return giveUp("k would not stay positive", k, next);
    passes.withResiduals(next, residuals, sums);
    if (!usable(sums)) return giveUp("no finite prediction", k, next);
    if (!(sums.ssr <= ssr * (1 + ROUNDING_ALLOWANCE))) return giveUp("residual sum rose", k, next);
    k = next;
    ssr = sums.ssr;
    step = sums.jtr / sums.jtj;
    residualsAtK = true;
  }
  return giveUp("too many steps", k, k + step);
}

/**
 * Points of the thinned copy used to estimate the bend of the Gauss–Newton step: a smooth sum
 * over the times, which 200 points give far closer than the correction needs (a step from 1e−5
 * away lands as close as with 4 000). At order 2 each point of a sparse copy costs an anchor of
 * its own, so fewer is cheaper (a pass over 4 000 points took 0.35 ms here, over 500 0.17 ms).
 */
const BEND_POINTS = 200;
/** Relative change of k for the central difference. */
const BEND_DELTA = 1e-3;

/**
 * A Gauss–Newton step from k0 lands at k* + ½·(ΣJ·∂J/∂k / ΣJ²)·(k0 − k*)² to second order; the
 * coefficient, ¼·d ln(ΣJ²)/dk, depends on the times only, so a thinned copy estimates it. With it
 * subtracted, a step from 1e−5 away on a noise-free trace landed 2e−15 off instead of 6e−11.
 */
function stepBend(data: ClosedFormData, passes: ClosedFormPassRunner, k: number): number {
  const coarse = thinPoints(data.t, data.V, BEND_POINTS);
  const sums: PassSums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
  const jtjAt = (kk: number) => {
    closedFormPass(passes.setupAt(kk, coarse.t, coarse.V), null, sums);
    return sums.jtj;
  };
  const bend = (0.25 * Math.log(jtjAt(k * (1 + BEND_DELTA)) / jtjAt(k * (1 - BEND_DELTA)))) / (2 * BEND_DELTA * k);
  return Number.isFinite(bend) ? bend : 0;
}

/** The second-order part of a step, used only while it is a small correction (far away it is not). */
function bentPart(bend: number, step: number): number {
  const part = bend * step * step;
  return Math.abs(part) <= 0.1 * Math.abs(step) ? part : 0;
}

function usable(sums: PassSums): boolean {
  return Number.isFinite(sums.ssr) && sums.jtj > 0 && Number.isFinite(sums.jtj) && Number.isFinite(sums.jtr);
}
