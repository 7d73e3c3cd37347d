import { SECOND_ORDER_DEGREE, secondOrderCoefficients, secondOrderConversion, secondOrderReach } from "./secondOrderSeries.js";

/**
 * One fused pass over the data for a closed-form order: the model volume, the residual and the
 * sums of the normal equations for k in a single loop, with no intermediate arrays and no
 * transcendental call per point.
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

/** Points per block: each pass function runs over one block at a time, carrying its state. */
const PASS_BLOCK = 8192;

/** Loop state carried from one block to the next. */
class PassState {
  ssr = 0;
  /** Σ(g·t)² and Σ(g·t)·r with g = dX/dτ; kFactor is applied once at the end. */
  gg = 0;
  gr = 0;
  /** Σ(V − V[0]) and Σ(V − V[0])², kept only when residuals are written. */
  sum = 0;
  squares = 0;
  /** e^(−τ) (first order), e^(εA·τ) (zero order) or the anchor τ (second order). */
  carried = Number.NaN;
  previousTau = Number.NaN;
  steps = 0;
  reach = 0;
  readonly coefficients = new Float64Array(SECOND_ORDER_DEGREE + 1);
}

type BlockPass = (s: PassSetup, from: number, to: number, residuals: Float64Array | null, state: PassState) => void;

/**
 * Fills `sums` from one pass at setup.scale. With `residuals`, also writes observed − model into
 * it and fills sums.sst; without, sums.sst is NaN.
 */
export function closedFormPass(setup: PassSetup, residuals: Float64Array | null, sums: PassSums): void {
  const block: BlockPass = setup.order === 1 ? firstOrderBlock : setup.order === 0 ? zeroOrderBlock : secondOrderBlock;
  const n = setup.t.length;
  const state = new PassState();
  for (let from = 0; from < n; from += PASS_BLOCK) block(setup, from, Math.min(n, from + PASS_BLOCK), residuals, state);
  sums.ssr = state.ssr;
  sums.jtj = setup.kFactor * setup.kFactor * state.gg;
  sums.jtr = setup.kFactor * state.gr;
  sums.sst = residuals === null ? Number.NaN : state.squares - (state.sum * state.sum) / n;
}

/** Largest step in the exponent served by the short series; its remainder is below 5e−18. */
const STEP_REACH = 1e-4;
/** Steps between exact exponentials, bounding the rounding carried along the recurrence. */
const STEPS_PER_ANCHOR = 128;

/** e^x for |x| ≤ STEP_REACH. */
function expSmall(x: number): number {
  return 1 + x * (1 + x * (0.5 + x * (1 / 6)));
}

/** X = 1 − e^(−τ); e^(−τ) carried from point to point by e^(−Δτ). */
function firstOrderBlock(s: PassSetup, from: number, to: number, residuals: Float64Array | null, state: PassState): void {
  const { t, V } = s;
  const scale = unboxed(s.scale);
  const amplitude = unboxed(s.V0 * s.epsilonA);
  const full = unboxed(s.V0 + amplitude);
  const shift = V[0];
  let decay = state.carried;
  let previousTau = state.previousTau;
  let steps = state.steps;
  let ssr = state.ssr, gg = state.gg, gr = state.gr, sum = state.sum, squares = state.squares;
  for (let i = from; i < to; i++) {
    const ti = t[i];
    const tau = scale * ti;
    const step = previousTau - tau;
    if (step <= 0 && step >= -STEP_REACH && steps < STEPS_PER_ANCHOR) {
      decay *= expSmall(step);
      steps++;
    } else {
      decay = Math.exp(-tau);
      steps = 0;
    }
    previousTau = tau;
    const v = V[i];
    const r = v - full + amplitude * decay;
    const g = decay * ti;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
    if (residuals !== null) {
      residuals[i] = r;
      sum += v - shift;
      squares += (v - shift) * (v - shift);
    }
  }
  state.carried = decay;
  state.previousTau = previousTau;
  state.steps = steps;
  keep(state, ssr, gg, gr, sum, squares);
}

/** X = (G − 1)/εA with G = e^(εA·τ) carried like the first-order decay, capped at full conversion. */
function zeroOrderBlock(s: PassSetup, from: number, to: number, residuals: Float64Array | null, state: PassState): void {
  const { t, V } = s;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const inverseEps = 1 / eps;
  const full = V0 * (1 + eps);
  const shift = V[0];
  let growth = state.carried;
  let previousTau = state.previousTau;
  let steps = state.steps;
  let ssr = state.ssr, gg = state.gg, gr = state.gr, sum = state.sum, squares = state.squares;
  for (let i = from; i < to; i++) {
    const ti = t[i];
    const tau = scale * ti;
    const step = eps * (tau - previousTau);
    if (tau >= previousTau && Math.abs(step) <= STEP_REACH && steps < STEPS_PER_ANCHOR) {
      growth *= expSmall(step);
      steps++;
    } else {
      growth = Math.exp(eps * tau);
      steps = 0;
    }
    previousTau = tau;
    const v = V[i];
    let r: number;
    let g: number;
    if ((growth - 1) * inverseEps < 1) {
      // Below full conversion V0·(1 + εA·X) is V0·G, and dX/dτ is G.
      r = v - V0 * growth;
      g = growth * ti;
    } else {
      r = v - full;
      g = 0;
    }
    ssr += r * r;
    gg += g * g;
    gr += g * r;
    if (residuals !== null) {
      residuals[i] = r;
      sum += v - shift;
      squares += (v - shift) * (v - shift);
    }
  }
  state.carried = growth;
  state.previousTau = previousTau;
  state.steps = steps;
  keep(state, ssr, gg, gr, sum, squares);
}

/** X and dX/dτ from the Taylor polynomial about the latest anchor; anchors solved exactly. */
function secondOrderBlock(s: PassSetup, from: number, to: number, residuals: Float64Array | null, state: PassState): void {
  const { t, V } = s;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const amplitude = V0 * eps;
  const shift = V[0];
  const a = state.coefficients;
  let anchorTau = state.carried;
  let reach = state.reach;
  let a0 = a[0], a1 = a[1], a2 = a[2], a3 = a[3], a4 = a[4], a5 = a[5], a6 = a[6];
  let ssr = state.ssr, gg = state.gg, gr = state.gr, sum = state.sum, squares = state.squares;
  for (let i = from; i < to; i++) {
    const ti = t[i];
    const tau = scale * ti;
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      const estimate = d > 0 && d <= 2 * reach ? a0 + d * (a1 + d * (a2 + d * (a3 + d * (a4 + d * (a5 + d * a6))))) : -1;
      secondOrderCoefficients(secondOrderConversion(tau, eps, estimate), eps, a);
      a0 = a[0]; a1 = a[1]; a2 = a[2]; a3 = a[3]; a4 = a[4]; a5 = a[5]; a6 = a[6];
      anchorTau = tau;
      reach = secondOrderReach(tau, eps);
      d = 0;
    }
    const x = a0 + d * (a1 + d * (a2 + d * (a3 + d * (a4 + d * (a5 + d * a6)))));
    const rate = a1 + d * (2 * a2 + d * (3 * a3 + d * (4 * a4 + d * (5 * a5 + d * (6 * a6)))));
    const v = V[i];
    const r = v - V0 - amplitude * x;
    const g = rate * ti;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
    if (residuals !== null) {
      residuals[i] = r;
      sum += v - shift;
      squares += (v - shift) * (v - shift);
    }
  }
  state.carried = anchorTau;
  state.reach = reach;
  keep(state, ssr, gg, gr, sum, squares);
}

/**
 * The value passed through arithmetic, so an optimised loop holds it as a plain double instead
 * of re-checking the boxed number at every point (about 20 % of a pass, measured).
 */
function unboxed(x: number): number {
  return x + 0;
}

function keep(state: PassState, ssr: number, gg: number, gr: number, sum: number, squares: number): void {
  state.ssr = ssr;
  state.gg = gg;
  state.gr = gr;
  state.sum = sum;
  state.squares = squares;
}
