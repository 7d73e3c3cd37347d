import { GRID_TAU_TOLERANCE, type RegularGrid } from "./regularGridPasses.js";

/**
 * Model volumes at orders 0 and 1 for many times, with the exponential carried from point to
 * point instead of taken afresh: by one constant factor on a regular grid, else by a short series.
 */

/**
 * Both orders as one exponential m = base·e^(rate·t): V = offset + sign·m. Order 1 has
 * m = V0·εA·e^(−τ) and V = V0(1 + εA) − m; order 0 has V = m = V0·e^(εA·τ) until it reaches
 * full conversion V0(1 + εA) (from below, or from above for εA < 0), flat after.
 */
class ExponentialVolume {
  readonly rate: number;
  readonly base: number;
  readonly sign: number;
  readonly offset: number;
  readonly full: number;
  readonly capped: boolean;
  readonly rising: boolean;

  constructor(order: 0 | 1, scale: number, V0: number, epsilonA: number) {
    this.full = V0 * (1 + epsilonA);
    this.rate = order === 1 ? -scale : epsilonA * scale;
    this.base = order === 1 ? V0 * epsilonA : V0;
    this.sign = order === 1 ? -1 : 1;
    this.offset = order === 1 ? this.full : 0;
    this.capped = order === 0;
    this.rising = epsilonA > 0;
  }
}

/** Points between exact exponentials, bounding the rounding carried along. */
const ANCHOR_EVERY = 128;
/** Largest step in the exponent served by the short series; its remainder is below 5e−18. */
const STEP_REACH = 1e-4;

/**
 * Model volumes at orders 0 and 1 on the grid, written to `out` from the first point on, each
 * point's time checked against the grid. Returns how many were written: all of them, or up to
 * the first point off the grid (the caller computes the rest another way).
 */
export function gridVolumes(order: 0 | 1, scale: number, V0: number, epsilonA: number, t: Float64Array, grid: RegularGrid, out: Float64Array): number {
  const n = t.length;
  const t0 = grid.t0 + 0;
  const h = grid.h + 0;
  const tolerance = GRID_TAU_TOLERANCE / scale;
  const model = new ExponentialVolume(order, scale, V0, epsilonA);
  // Plain doubles in locals (x + 0): a field read or a boxed number at every point costs half the loop.
  const rate = model.rate + 0, base = model.base + 0, sign = model.sign + 0, offset = model.offset + 0, full = model.full + 0;
  const { capped, rising } = model;
  const factor = Math.exp(rate * h);
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const anchor = t0 + from * h;
    let m = base * Math.exp(rate * anchor);
    let steps = 0;
    for (let i = from; i < to; i++) {
      const off = t[i] - (anchor + steps * h);
      if (!(off <= tolerance && off >= -tolerance)) return i;
      const v = offset + sign * m;
      out[i] = capped && (rising ? v > full : v < full) ? full : v;
      m *= factor;
      steps++;
    }
  }
  return n;
}

/**
 * Volumes at orders 0 and 1 for t[start…], the exponential carried from point to point by
 * e^(±Δτ) from a short series while the times ascend in small steps, else taken afresh.
 */
export function carriedVolumes(order: 0 | 1, scale: number, V0: number, epsilonA: number, t: Float64Array, start: number, out: Float64Array): void {
  const n = t.length;
  const model = new ExponentialVolume(order, scale, V0, epsilonA);
  // Plain doubles in locals (x + 0): a field read or a boxed number at every point costs half the loop.
  const rate = model.rate + 0, base = model.base + 0, sign = model.sign + 0, offset = model.offset + 0, full = model.full + 0;
  const { capped, rising } = model;
  for (let from = start; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let previous = t[from];
    let m = base * Math.exp(rate * previous);
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const step = rate * (ti - previous);
      if (ti >= previous && step <= STEP_REACH && step >= -STEP_REACH) m *= 1 + step * (1 + step * (0.5 + step * (1 / 6)));
      else m = base * Math.exp(rate * ti);
      previous = ti;
      const v = offset + sign * m;
      out[i] = capped && (rising ? v > full : v < full) ? full : v;
    }
  }
}
