import { SECOND_ORDER_DEGREE, secondOrderCoefficients, secondOrderConversion, secondOrderReach } from "./secondOrderSeries.js";

/**
 * One fused pass over the data for a closed-form order: the model volume, the residual and the
 * sums of the normal equations for k in a single loop, with no intermediate arrays and no
 * transcendental call per point. Each order has two loops: one that only adds up the sums (and
 * may check each point against a guard), one that also writes the residuals and the total sum of
 * squares. Keeping them apart keeps both loops short enough for the optimiser.
 */

/** The data and the model at one k. */
export interface PassSetup {
  order: 0 | 1 | 2;
  t: Float64Array;
  V: Float64Array;
  V0: number;
  epsilonA: number;
  /** τ = scale·t, scale = k·cA0^(n−1). */
  scale: number;
  /** ∂V/∂k = kFactor·(dX/dτ)·t, kFactor = V0·εA·cA0^(n−1). */
  kFactor: number;
}

/** What a pass adds up; sst is about V[0], which leaves it unchanged. */
export interface PassSums {
  ssr: number;
  jtj: number;
  jtr: number;
  sst: number;
}

/** Open volume limits a point must lie strictly within, besides 0 ≤ t < ∞. */
export interface PointGuard {
  lowV: number;
  highV: number;
}

/** Largest finite double: `x <= LARGEST` is false for NaN and +∞. */
const LARGEST = 1.7976931348623157e308;
/** Lets every point with a finite, non-negative time through. */
export const OPEN_GUARD: PointGuard = { lowV: Number.NEGATIVE_INFINITY, highV: Number.POSITIVE_INFINITY };

/** Sums of one loop before the factors of k are applied. */
export class LoopSums {
  ssr = 0;
  /** Σ(g·t)² and Σ(g·t)·r with g = dX/dτ times V0·εA; the rest of ∂V/∂k is applied once at the end. */
  gg = 0;
  gr = 0;
  /** Σ(V − V[0]) and Σ(V − V[0])², kept only when residuals are written. */
  sum = 0;
  squares = 0;
}

type SumsLoop = (s: PassSetup, guard: PointGuard, out: LoopSums) => boolean;
type ResidualsLoop = (s: PassSetup, residuals: Float64Array, out: LoopSums) => void;

/**
 * Fills `sums` from one pass at setup.scale. With `residuals`, also writes observed − model into
 * it and fills sums.sst. Without, sums.sst is NaN and every point is checked against `guard`:
 * the pass stops and returns false at the first point outside it (its sums are then partial).
 */
export function closedFormPass(setup: PassSetup, residuals: Float64Array | null, sums: PassSums, guard: PointGuard = OPEN_GUARD): boolean {
  const out = new LoopSums();
  let complete = true;
  if (residuals === null) {
    const loop: SumsLoop = setup.order === 1 ? firstOrderSums : setup.order === 0 ? zeroOrderSums : secondOrderSums;
    complete = loop(setup, guard, out);
  } else {
    const loop: ResidualsLoop = setup.order === 1 ? firstOrderResiduals : setup.order === 0 ? zeroOrderResiduals : secondOrderResiduals;
    loop(setup, residuals, out);
  }
  finishSums(setup, out, residuals !== null, sums);
  return complete;
}

/** Fills `sums` from a loop's sums: applies the factors of k, and gives sst when residuals were written. */
export function finishSums(setup: PassSetup, out: LoopSums, wroteResiduals: boolean, sums: PassSums): void {
  const gFactor = setup.kFactor / (setup.V0 * setup.epsilonA);
  sums.ssr = out.ssr;
  sums.jtj = gFactor * gFactor * out.gg;
  sums.jtr = gFactor * out.gr;
  sums.sst = wroteResiduals ? out.squares - (out.sum * out.sum) / setup.t.length : Number.NaN;
}

/** Largest step in the exponent served by the short series; its remainder is below 5e−18. */
const STEP_REACH = 1e-4;
/** Points between exact exponentials, bounding the rounding carried along the recurrence. */
const ANCHOR_EVERY = 128;

/** e^x for |x| ≤ STEP_REACH. */
function expSmall(x: number): number {
  return 1 + x * (1 + x * (0.5 + x * (1 / 6)));
}

/*
 * First order: V = V0 + V0·εA·(1 − e^(−τ)). The loops carry c = V0·εA·e^(−τ) from point to
 * point by e^(−Δτ), with an exact exponential every ANCHOR_EVERY points and wherever the times
 * step back or jump further than the short series reaches.
 */

function firstOrderSums(s: PassSetup, guard: PointGuard, out: LoopSums): boolean {
  const { t, V } = s;
  const n = t.length;
  const scale = unboxed(s.scale);
  const amplitude = unboxed(s.V0 * s.epsilonA);
  const full = unboxed(s.V0 + amplitude);
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  let ssr = 0, gg = 0, gr = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let previousTau = scale * t[from];
    let c = amplitude * Math.exp(-previousTau);
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
      const tau = scale * ti;
      const step = previousTau - tau;
      if (step <= 0 && step >= -STEP_REACH) c *= expSmall(step);
      else c = amplitude * Math.exp(-tau);
      previousTau = tau;
      const r = v - full + c;
      const g = c * ti;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
  }
  return keep(out, ssr, gg, gr, 0, 0);
}

function firstOrderResiduals(s: PassSetup, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const scale = unboxed(s.scale);
  const amplitude = unboxed(s.V0 * s.epsilonA);
  const full = unboxed(s.V0 + amplitude);
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let previousTau = scale * t[from];
    let c = amplitude * Math.exp(-previousTau);
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const tau = scale * ti;
      const step = previousTau - tau;
      if (step <= 0 && step >= -STEP_REACH) c *= expSmall(step);
      else c = amplitude * Math.exp(-tau);
      previousTau = tau;
      const r = v - full + c;
      const g = c * ti;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
    }
  }
  keep(out, ssr, gg, gr, sum, squares);
}

/*
 * Zero order: below full conversion V = V0·G with G = e^(εA·τ), carried like the first-order
 * exponential; dX/dτ is G, so V0·εA·dX/dτ is εA·V. Past full conversion V = V0(1 + εA), flat.
 */

function zeroOrderSums(s: PassSetup, guard: PointGuard, out: LoopSums): boolean {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  let ssr = 0, gg = 0, gr = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let previousTau = scale * t[from];
    let model = V0 * Math.exp(eps * previousTau);
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
      const tau = scale * ti;
      const step = eps * (tau - previousTau);
      if (tau >= previousTau && step <= STEP_REACH && step >= -STEP_REACH) model *= expSmall(step);
      else model = V0 * Math.exp(eps * tau);
      previousTau = tau;
      // Full conversion is where V0·G reaches V0(1 + εA), from below or, for εA < 0, from above.
      const reacting = eps > 0 ? model < full : model > full;
      const r = v - (reacting ? model : full);
      const g = reacting ? eps * model * ti : 0;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
  }
  return keep(out, ssr, gg, gr, 0, 0);
}

function zeroOrderResiduals(s: PassSetup, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let previousTau = scale * t[from];
    let model = V0 * Math.exp(eps * previousTau);
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const tau = scale * ti;
      const step = eps * (tau - previousTau);
      if (tau >= previousTau && step <= STEP_REACH && step >= -STEP_REACH) model *= expSmall(step);
      else model = V0 * Math.exp(eps * tau);
      previousTau = tau;
      const reacting = eps > 0 ? model < full : model > full;
      const r = v - (reacting ? model : full);
      const g = reacting ? eps * model * ti : 0;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
    }
  }
  keep(out, ssr, gg, gr, sum, squares);
}

/*
 * Second order: the model volume m from a Taylor polynomial about the latest anchor, whose
 * conversion is solved exactly, placed wherever a point falls outside the polynomial's reach.
 * The rate law gives the slope without a second polynomial: with u = V0(1 + εA) − m,
 * dX/dτ = (1 − X)²/(1 + εA·X) makes V0·εA·dX/dτ = u²/(εA·m).
 */

/** The anchor's Taylor coefficients of the model volume, and where it sits and reaches. */
class SecondOrderAnchor {
  private readonly a = new Float64Array(SECOND_ORDER_DEGREE + 1);
  /** V0 + V0·εA·a[0], then V0·εA·a[j]. */
  readonly volume = new Float64Array(SECOND_ORDER_DEGREE + 1);
  tau = Number.NaN;
  reach = 0;

  /** Moves the anchor to τ, warm-starting the exact solve from the polynomial's volume m. */
  moveTo(tau: number, V0: number, eps: number, m: number): void {
    const estimate = (m - V0) / (V0 * eps);
    secondOrderCoefficients(secondOrderConversion(tau, eps, Number.isFinite(m) ? estimate : -1), eps, this.a);
    for (let j = 0; j <= SECOND_ORDER_DEGREE; j++) this.volume[j] = V0 * eps * this.a[j];
    this.volume[0] += V0;
    this.tau = tau;
    this.reach = secondOrderReach(tau, eps);
  }
}

function secondOrderSums(s: PassSetup, guard: PointGuard, out: LoopSums): boolean {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  const anchor = new SecondOrderAnchor();
  const c = anchor.volume;
  let anchorTau = Number.NaN, reach = 0;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
  let ssr = 0, gg = 0, gr = 0;
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
    const tau = scale * ti;
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      anchor.moveTo(tau, V0, eps, d > 0 && d <= 2 * reach ? c0 + d * (c1 + d * (c2 + d * (c3 + d * (c4 + d * (c5 + d * c6))))) : Number.NaN);
      c0 = c[0]; c1 = c[1]; c2 = c[2]; c3 = c[3]; c4 = c[4]; c5 = c[5]; c6 = c[6];
      anchorTau = tau;
      reach = anchor.reach;
      d = 0;
    }
    const d2 = d * d;
    const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
    const r = v - m;
    const u = full - m;
    const g = (u * u * ti) / m;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
  }
  return keep(out, ssr, gg / (eps * eps), gr / eps, 0, 0);
}

function secondOrderResiduals(s: PassSetup, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const shift = n > 0 ? V[0] : 0;
  const anchor = new SecondOrderAnchor();
  const c = anchor.volume;
  let anchorTau = Number.NaN, reach = 0;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    const tau = scale * ti;
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      anchor.moveTo(tau, V0, eps, d > 0 && d <= 2 * reach ? c0 + d * (c1 + d * (c2 + d * (c3 + d * (c4 + d * (c5 + d * c6))))) : Number.NaN);
      c0 = c[0]; c1 = c[1]; c2 = c[2]; c3 = c[3]; c4 = c[4]; c5 = c[5]; c6 = c[6];
      anchorTau = tau;
      reach = anchor.reach;
      d = 0;
    }
    const d2 = d * d;
    const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
    const r = v - m;
    const u = full - m;
    const g = (u * u * ti) / m;
    residuals[i] = r;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
    const dv = v - shift;
    sum += dv;
    squares += dv * dv;
  }
  keep(out, ssr, gg / (eps * eps), gr / eps, sum, squares);
}

/**
 * The value passed through arithmetic, so an optimised loop holds it as a plain double instead
 * of re-checking the boxed number at every point (about 20 % of a pass, measured).
 */
function unboxed(x: number): number {
  return x + 0;
}

/** Stores a loop's running sums. */
export function keep(out: LoopSums, ssr: number, gg: number, gr: number, sum: number, squares: number): true {
  out.ssr = ssr;
  out.gg = gg;
  out.gr = gr;
  out.sum = sum;
  out.squares = squares;
  return true;
}
