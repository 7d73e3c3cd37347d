import { SECOND_ORDER_REACH, SERIES_REACH, expm1Series, log1pSeries, solveSecondOrder } from "./closedFormSeries.js";

/**
 * Conversion of A as a function of reduced time τ = scale·t, with scale = k·cA0^(n−1).
 * Kernels fill whole blocks of points so the hot loops stay monomorphic; ascending times (trace
 * order) are served from an anchored Taylor series instead of a fresh transcendental per point.
 */
export interface ConversionKernel {
  /**
   * For points from..to−1 writes X, rate = dX/dτ and, when asked and supported, ∂X/∂n at fixed τ
   * into index i − from of the outputs.
   */
  fill(
    scale: number,
    t: ArrayLike<number>,
    from: number,
    to: number,
    X: Float64Array,
    rate: Float64Array,
    dXdn: Float64Array | null,
  ): void;
}

/** First order: X = 1 − e^(−τ). */
export class FirstOrderKernel implements ConversionKernel {
  fill(scale: number, t: ArrayLike<number>, from: number, to: number, X: Float64Array, rate: Float64Array, _dXdn?: Float64Array | null): void {
    let anchor = Number.NaN;
    let anchorDecay = 1;
    let anchorX = 0;
    for (let i = from; i < to; i++) {
      const tau = scale * t[i];
      const d = tau - anchor;
      if (!(d >= 0 && d <= SERIES_REACH)) {
        anchor = tau;
        anchorDecay = Math.exp(-tau);
        anchorX = -Math.expm1(-tau);
        X[i - from] = anchorX;
        rate[i - from] = anchorDecay;
        continue;
      }
      const m = anchorDecay * expm1Series(-d);
      X[i - from] = anchorX - m;
      rate[i - from] = anchorDecay + m;
    }
  }
}

/** Zero order: (1/εA)·ln(1 + εA·X) = τ, so X = (e^(εA·τ) − 1)/εA, capped at full conversion. */
export class ZeroOrderKernel implements ConversionKernel {
  constructor(private readonly epsilonA: number) {}

  fill(scale: number, t: ArrayLike<number>, from: number, to: number, X: Float64Array, rate: Float64Array, _dXdn?: Float64Array | null): void {
    const eps = this.epsilonA;
    let anchor = Number.NaN;
    let anchorGrowthM1 = 0;
    for (let i = from; i < to; i++) {
      const tau = scale * t[i];
      let x: number;
      let r: number;
      if (eps === 0) {
        x = tau;
        r = 1;
      } else {
        const d = eps * (tau - anchor);
        let growthM1: number;
        if (tau >= anchor && Math.abs(d) <= SERIES_REACH) {
          growthM1 = anchorGrowthM1 + (1 + anchorGrowthM1) * expm1Series(d);
        } else {
          anchor = tau;
          growthM1 = anchorGrowthM1 = Math.expm1(eps * tau);
        }
        x = growthM1 / eps;
        r = 1 + growthM1;
      }
      if (x >= 1) {
        x = 1;
        r = 0;
      }
      X[i - from] = x;
      rate[i - from] = r;
    }
  }
}

/**
 * Second order: (1 + εA)·X/(1 − X) + εA·ln(1 − X) = τ, solved for y = X/(1 − X), which is
 * monotone in τ for εA > −1. Anchors are solved by Newton to convergence; points within reach of
 * an anchor take one Newton step from a second-order Taylor predictor, with ln(1 + y) from a
 * series about the anchor, so no transcendental call and no loop-carried dependence per point.
 */
export class SecondOrderKernel implements ConversionKernel {
  constructor(private readonly epsilonA: number) {}

  fill(scale: number, t: ArrayLike<number>, from: number, to: number, X: Float64Array, rate: Float64Array, _dXdn?: Float64Array | null): void {
    const eps = this.epsilonA;
    let anchorTau = Number.NaN;
    let yA = 0;
    let lnA = 0;
    let inv1pA = 1;
    let gA = 1;
    let curveA = 0;
    for (let i = from; i < to; i++) {
      const tau = scale * t[i];
      const d = tau - anchorTau;
      let y: number;
      if (d >= 0 && d <= SECOND_ORDER_REACH) {
        const guess = yA + d * gA + 0.5 * d * d * curveA;
        const z = (guess - yA) * inv1pA;
        const lnGuess = lnA + log1pSeries(z);
        const slope = 1 + (eps * guess) / (1 + guess);
        y = guess - ((1 + eps) * guess - eps * lnGuess - tau) / slope;
      } else {
        y = solveSecondOrder(tau, eps, anchorTau >= 0 && tau > anchorTau ? yA + (tau - anchorTau) * gA : tau);
        anchorTau = tau;
        yA = y;
        lnA = Math.log1p(y);
        inv1pA = 1 / (1 + y);
        const s = 1 + (1 + eps) * y;
        gA = (1 + y) / s;
        curveA = (-eps / (s * s)) * gA;
      }
      const oneMinusX = 1 / (1 + y);
      const x = y * oneMinusX;
      X[i - from] = x;
      rate[i - from] = (oneMinusX * oneMinusX) / (1 + eps * x);
    }
  }
}
