import { finishSums, keep, LARGEST, LoopSums, OPEN_GUARD, unboxed, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";
import { secondOrderResiduals, secondOrderSums } from "./secondOrderPasses.js";

export { OPEN_GUARD, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";

/**
 * One fused pass over the data for a closed-form order: the model volume, the residual and the
 * sums of the normal equations for k in a single loop, with no intermediate arrays and no
 * transcendental call per point. Each order has two loops: one that only adds up the sums (and
 * may check each point against a guard), one that also writes the residuals and the total sum of
 * squares. Keeping them apart keeps both loops short enough for the optimiser.
 */

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
  let i = 0;
  while (i < n) {
    const to = Math.min(n, i + ANCHOR_EVERY);
    let previousTau = scale * t[i];
    let model = V0 * Math.exp(eps * previousTau);
    let flatFrom = Number.NaN;
    for (; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
      const tau = scale * ti;
      const step = eps * (tau - previousTau);
      if (tau >= previousTau && step <= STEP_REACH && step >= -STEP_REACH) model *= expSmall(step);
      else model = V0 * Math.exp(eps * tau);
      previousTau = tau;
      // Full conversion is where V0·G reaches V0(1 + εA), from below or, for εA < 0, from above.
      if (eps > 0 ? model >= full : model <= full) {
        flatFrom = ti;
        break;
      }
      const r = v - model;
      const g = eps * model * ti;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
    // Past full conversion the model is flat: while the times do not step back, a point adds
    // only (V − full)² and nothing to the slope.
    for (; i < n; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= flatFrom)) break;
      if (!(ti <= LARGEST && v > lowV && v < highV)) return false;
      const r = v - full;
      ssr += r * r;
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
  let i = 0;
  while (i < n) {
    const to = Math.min(n, i + ANCHOR_EVERY);
    let previousTau = scale * t[i];
    let model = V0 * Math.exp(eps * previousTau);
    let flatFrom = Number.NaN;
    for (; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const tau = scale * ti;
      const step = eps * (tau - previousTau);
      if (tau >= previousTau && step <= STEP_REACH && step >= -STEP_REACH) model *= expSmall(step);
      else model = V0 * Math.exp(eps * tau);
      previousTau = tau;
      if (eps > 0 ? model >= full : model <= full) {
        flatFrom = ti;
        break;
      }
      const r = v - model;
      const g = eps * model * ti;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
    }
    for (; i < n; i++) {
      const ti = t[i];
      if (!(ti >= flatFrom)) break;
      const v = V[i];
      const r = v - full;
      residuals[i] = r;
      ssr += r * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
    }
  }
  keep(out, ssr, gg, gr, sum, squares);
}
