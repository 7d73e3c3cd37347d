import { ANCHOR_EVERY, expSmall, ExponentialVolume, STEP_REACH } from "./exponentialVolumes.js";
import { finishSums, keep, LARGEST, LoopSums, OPEN_GUARD, unboxed, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";
import { secondOrderResiduals, secondOrderSums } from "./secondOrderPasses.js";

/**
 * One fused pass over the data for a closed-form order: the model volume, the residual and the
 * sums of the normal equations for k in a single loop, with no intermediate arrays and no
 * transcendental call per point. Orders 0 and 1 share their loops (one exponential), order 2 has
 * its own (secondOrderPasses.ts). Each comes as a pair: one loop that only adds up the sums (and
 * checks each point against a guard), one that also writes the residuals and the total sum of
 * squares; apart, both stay short enough for the optimiser.
 */

/**
 * Fills `sums` from one pass at setup.scale. With `residuals`, also writes observed − model into
 * it and fills sums.sst. Without, sums.sst is NaN and every point is checked against `guard`:
 * the pass stops and returns false at the first point outside it (its sums are then partial).
 */
export function closedFormPass(setup: PassSetup, residuals: Float64Array | null, sums: PassSums, guard: PointGuard = OPEN_GUARD): boolean {
  const out = new LoopSums();
  let complete = true;
  let loopFactor: number;
  if (setup.order === 2) {
    if (residuals === null) complete = secondOrderSums(setup, guard, out);
    else secondOrderResiduals(setup, residuals, out);
    loopFactor = 1 / setup.epsilonA;
  } else {
    const model = new ExponentialVolume(setup.order, setup.scale, setup.V0, setup.epsilonA);
    if (residuals === null) complete = exponentialSums(setup, model, guard, out);
    else exponentialResiduals(setup, model, residuals, out);
    loopFactor = model.slope;
  }
  finishSums(setup, out, residuals !== null, sums, loopFactor);
  return complete;
}

/*
 * Orders 0 and 1: the exponential q of ExponentialVolume is carried from point to point by
 * e^(rate·Δt) from a short series, with an exact exponential at every ANCHOR_EVERY-th point and
 * wherever the times step back or jump further than the series reaches. Past full conversion
 * (order 0), while the times do not step back, a point adds only (V − full)² and nothing to the
 * slope.
 */

function exponentialSums(s: PassSetup, model: ExponentialVolume, guard: PointGuard, out: LoopSums): boolean {
  const { t, V } = s;
  const n = t.length;
  const rate = unboxed(model.rate), base = unboxed(model.base), offset = unboxed(model.offset), full = unboxed(model.full);
  const direction = unboxed(model.direction), flatAt = unboxed(model.flatAt);
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  let ssr = 0, gg = 0, gr = 0;
  let i = 0;
  while (i < n) {
    const to = Math.min(n, i + ANCHOR_EVERY);
    let previous = t[i];
    let q = base * Math.exp(rate * previous);
    let flatFrom = Number.NaN;
    for (; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
      const step = rate * (ti - previous);
      if (ti >= previous && step <= STEP_REACH && step >= -STEP_REACH) q *= expSmall(step);
      else q = base * Math.exp(rate * ti);
      previous = ti;
      if (direction * q >= flatAt) {
        flatFrom = ti;
        break;
      }
      const r = v - offset - q;
      const g = q * ti;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
    for (; i < n; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= flatFrom)) break;
      if (!(ti <= LARGEST && v > lowV && v < highV)) return false;
      const r = v - full;
      ssr += r * r;
    }
    keep(out, ssr, gg, gr, 0, 0);
  }
  return true;
}

function exponentialResiduals(s: PassSetup, model: ExponentialVolume, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const rate = unboxed(model.rate), base = unboxed(model.base), offset = unboxed(model.offset), full = unboxed(model.full);
  const direction = unboxed(model.direction), flatAt = unboxed(model.flatAt);
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  let i = 0;
  while (i < n) {
    const to = Math.min(n, i + ANCHOR_EVERY);
    let previous = t[i];
    let q = base * Math.exp(rate * previous);
    let flatFrom = Number.NaN;
    for (; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const step = rate * (ti - previous);
      if (ti >= previous && step <= STEP_REACH && step >= -STEP_REACH) q *= expSmall(step);
      else q = base * Math.exp(rate * ti);
      previous = ti;
      if (direction * q >= flatAt) {
        flatFrom = ti;
        break;
      }
      const r = v - offset - q;
      const g = q * ti;
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
    keep(out, ssr, gg, gr, sum, squares);
  }
}
