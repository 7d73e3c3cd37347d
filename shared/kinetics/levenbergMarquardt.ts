import { choleskyFactor, choleskySolve, invertSymmetric } from "./smallLinearAlgebra.js";

/**
 * A least-squares model that accumulates its own normal equations, so a fit over a million
 * points never stores the Jacobian.
 */
export interface NormalEquationsModel {
  readonly parameterCount: number;
  readonly pointCount: number;
  /**
   * Returns the sum of squared residuals at `params` (NaN or Infinity when the parameters are
   * outside the model's domain). When `jtj` and `jtr` are given, fills JᵀJ (row-major, J the
   * Jacobian of the predictions) and Jᵀr (r = observed − predicted).
   */
  accumulate(params: Float64Array, jtj: Float64Array | null, jtr: Float64Array | null): number;
}

export interface LevenbergMarquardtOptions {
  initial: ArrayLike<number>;
  lower?: ArrayLike<number>;
  upper?: ArrayLike<number>;
  maxIterations?: number;
  /** Stop when every step is below this fraction of its parameter. */
  stepTolerance?: number;
  /**
   * Marquardt's λ for the first step (default 1e−3). A start already fitted to a thinned copy
   * of the data is close, and a small λ lets the first step be nearly Gauss–Newton.
   */
  initialDamping?: number;
}

export interface LevenbergMarquardtResult {
  params: Float64Array;
  /** After a final Gauss–Newton step taken without re-evaluation, the quadratic model's value. */
  residualSumSquares: number;
  iterations: number;
  converged: boolean;
  /** (JᵀJ)⁻¹ at the solution, row-major; multiply by s² for the covariance. Undefined if singular. */
  inverseNormalMatrix: Float64Array | undefined;
  message: string;
}

/** Levenberg–Marquardt with Marquardt's diagonal scaling and simple bounds. */
export function levenbergMarquardt(
  model: NormalEquationsModel,
  options: LevenbergMarquardtOptions,
): LevenbergMarquardtResult {
  const p = model.parameterCount;
  const maxIterations = options.maxIterations ?? 200;
  const stepTolerance = options.stepTolerance ?? 1e-10;
  const lower = options.lower ?? new Array<number>(p).fill(Number.NEGATIVE_INFINITY);
  const upper = options.upper ?? new Array<number>(p).fill(Number.POSITIVE_INFINITY);
  let params = Float64Array.from(options.initial);
  let jtj = new Float64Array(p * p);
  let jtr = new Float64Array(p);
  let trialJtj = new Float64Array(p * p);
  let trialJtr = new Float64Array(p);
  let ssr = model.accumulate(params, jtj, jtr);
  if (!Number.isFinite(ssr)) return finish(params, ssr, 0, false, jtj, "the starting values give no finite prediction");
  let lambda = options.initialDamping ?? 1e-3;
  let previousStep = Number.POSITIVE_INFINITY;
  const damped = new Float64Array(p * p);
  // One parameter: the curvature of the residual sum from the last two gradients (a secant).
  let curvature = Number.NaN;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    if (ssr === 0) return finish(params, ssr, iteration - 1, true, jtj, "exact fit");
    // A parameter the prediction does not depend on here cannot be fitted from here (no step would be "small enough" honestly).
    for (let j = 0; j < p; j++) if (!(jtj[j * p + j] > 0)) return finish(params, ssr, iteration - 1, false, jtj, "the prediction does not change with the parameters here");
    let accepted = false;
    let smallStep = false;
    while (!accepted) {
      damped.set(jtj);
      if (curvature > 0) damped[0] = curvature;
      for (let j = 0; j < p; j++) damped[j * p + j] += lambda * Math.max(jtj[j * p + j], 1e-300);
      const factor = choleskyFactor(damped, p);
      if (factor === undefined) {
        lambda *= 10;
        if (lambda > 1e20) return finish(params, ssr, iteration, false, jtj, "normal equations are singular");
        continue;
      }
      const step = choleskySolve(factor, jtr, p);
      const trial = new Float64Array(p);
      let relativeStep = 0;
      for (let j = 0; j < p; j++) {
        trial[j] = Math.min(upper[j], Math.max(lower[j], params[j] + step[j]));
        relativeStep = Math.max(relativeStep, Math.abs(trial[j] - params[j]) / Math.abs(params[j]));
      }
      smallStep = relativeStep <= stepTolerance;
      const nearlyUndamped = lambda <= 1e-2;
      // A nearly undamped step this small means the current point already is the solution.
      if (smallStep && nearlyUndamped) return finish(params, ssr, iteration, true, jtj, "step below tolerance");
      // Converging faster than linearly with a tiny step: the step's own error is of its square
      // (of the step times the one before, after a secant step), so take it without paying for
      // one more pass over the data, whose residual sum could not tell so small a gain from rounding.
      const closeEnough = !(curvature > 0) || relativeStep * previousStep * 10 <= stepTolerance;
      if (closeEnough && nearlyUndamped && Number.isFinite(previousStep) && relativeStep <= 1e-6 && relativeStep <= 1e-2 * previousStep) {
        let predictedDrop = 0;
        for (let j = 0; j < p; j++) predictedDrop += (trial[j] - params[j]) * jtr[j];
        return finish(trial, Math.max(0, ssr - predictedDrop), iteration, true, jtj, "final Gauss–Newton step taken");
      }
      const trialSsr = model.accumulate(trial, trialJtj, trialJtr);
      if (Number.isFinite(trialSsr) && trialSsr <= ssr) {
        accepted = true;
        curvature = p === 1 ? secantCurvature(params[0], trial[0], jtr[0], trialJtr[0], trialJtj[0], relativeStep) : Number.NaN;
        previousStep = relativeStep;
        params = trial;
        ssr = trialSsr;
        [jtj, trialJtj] = [trialJtj, jtj];
        [jtr, trialJtr] = [trialJtr, jtr];
        lambda = Math.max(lambda / 10, 1e-15);
      } else {
        if (smallStep) return finish(params, ssr, iteration, true, jtj, "no further reduction possible");
        lambda *= 10;
        if (lambda > 1e20) return finish(params, ssr, iteration, false, jtj, "no step reduces the residuals");
      }
    }
    if (smallStep) return finish(params, ssr, iteration, true, jtj, "step below tolerance");
  }
  return finish(params, ssr, maxIterations, false, jtj, "iteration limit reached");

  function finish(
    x: Float64Array,
    sum: number,
    iterations: number,
    converged: boolean,
    normal: Float64Array,
    message: string,
  ): LevenbergMarquardtResult {
    return { params: x, residualSumSquares: sum, iterations, converged, inverseNormalMatrix: invertSymmetric(normal, p), message };
  }
}

/**
 * With large residuals (a model of the wrong order, say) Gauss–Newton's JᵀJ misses the part of
 * the residual sum's curvature that the residuals carry, and it closes in only linearly (an
 * order-0.5 fit of a first-order trace took 7 passes over 10⁶ points). The change of Jᵀr over
 * the step just taken measures the whole curvature. Used only while the step is small enough for
 * the curvature to change little across it (far from the solution Gauss–Newton did better on
 * plateau traces) and large enough to measure it above rounding, and while it agrees with JᵀJ
 * within a factor of ten; else NaN (JᵀJ).
 */
function secantCurvature(from: number, to: number, jtrFrom: number, jtrTo: number, jtjTo: number, relativeStep: number): number {
  if (!(relativeStep >= 1e-7 && relativeStep <= 1e-2)) return Number.NaN;
  const curvature = (jtrFrom - jtrTo) / (to - from);
  return curvature >= 0.1 * jtjTo && curvature <= 10 * jtjTo ? curvature : Number.NaN;
}
