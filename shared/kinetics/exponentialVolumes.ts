import { GRID_TAU_TOLERANCE, type RegularGrid } from "./regularGrid.js";

/**
 * Orders 0 and 1 as one exponential in time, q = base·e^(rate·t), with V = offset + q:
 * order 1 has q = −V0·εA·e^(−τ) and V = V0(1 + εA) + q; order 0 has q = V0·e^(εA·τ) and V = q
 * until it reaches full conversion V0(1 + εA) (from below, or from above for εA < 0), flat after.
 * The fits' passes and the predictions carry q from point to point instead of taking it afresh.
 */
export class ExponentialVolume {
  readonly rate: number;
  readonly base: number;
  readonly offset: number;
  /** V0(1 + εA), the volume at full conversion. */
  readonly full: number;
  /** V0·εA·(dX/dτ)·t = slope·q·t: the volume's sensitivity to k up to the factors of k. */
  readonly slope: number;
  /** q is past full conversion when direction·q ≥ flatAt (never at order 1). */
  readonly direction: number;
  readonly flatAt: number;

  constructor(order: 0 | 1, scale: number, V0: number, epsilonA: number) {
    this.full = V0 * (1 + epsilonA);
    if (order === 1) {
      this.rate = -scale;
      this.base = -V0 * epsilonA;
      this.offset = this.full;
      this.slope = -1;
      this.direction = 1;
      this.flatAt = Number.POSITIVE_INFINITY;
    } else {
      this.rate = epsilonA * scale;
      this.base = V0;
      this.offset = 0;
      this.slope = epsilonA;
      this.direction = epsilonA > 0 ? 1 : -1;
      this.flatAt = this.direction * this.full;
    }
  }
}

/** Points between exact exponentials, bounding the rounding carried along. */
export const ANCHOR_EVERY = 128;
/** Largest step in the exponent served by the short series; its remainder is below 5e−18. */
export const STEP_REACH = 1e-4;

/** e^x for |x| ≤ STEP_REACH. */
export function expSmall(x: number): number {
  return 1 + x * (1 + x * (0.5 + x * (1 / 6)));
}

/**
 * Model volumes at orders 0 and 1 on the grid, written to `out` from the first point on, each
 * point's time checked against the grid. Returns how many were written: all of them, or up to
 * the first point off the grid (the caller computes the rest another way).
 */
export function gridVolumes(order: 0 | 1, scale: number, V0: number, epsilonA: number, t: Float64Array, grid: RegularGrid, out: Float64Array): number {
  const n = t.length;
  const model = new ExponentialVolume(order, scale, V0, epsilonA);
  // Plain doubles in locals (x + 0): a field read or a boxed number at every point costs half the loop.
  const rate = model.rate + 0, base = model.base + 0, offset = model.offset + 0, full = model.full + 0;
  const direction = model.direction + 0, flatAt = model.flatAt + 0;
  const t0 = grid.t0 + 0;
  const h = grid.h + 0;
  const tolerance = GRID_TAU_TOLERANCE / scale;
  const factor = Math.exp(rate * h);
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const anchor = t0 + from * h;
    let q = base * Math.exp(rate * anchor);
    let steps = 0;
    for (let i = from; i < to; i++) {
      const off = t[i] - (anchor + steps * h);
      if (!(off <= tolerance && off >= -tolerance)) return i;
      out[i] = direction * q >= flatAt ? full : offset + q;
      q *= factor;
      steps++;
    }
  }
  return n;
}

/**
 * Volumes at orders 0 and 1 for t[start…], the exponential carried from point to point by
 * e^(rate·Δt) from a short series while the times ascend in small steps, else taken afresh.
 */
export function carriedVolumes(order: 0 | 1, scale: number, V0: number, epsilonA: number, t: Float64Array, start: number, out: Float64Array): void {
  const n = t.length;
  const model = new ExponentialVolume(order, scale, V0, epsilonA);
  const rate = model.rate + 0, base = model.base + 0, offset = model.offset + 0, full = model.full + 0;
  const direction = model.direction + 0, flatAt = model.flatAt + 0;
  for (let from = start; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let previous = t[from];
    let q = base * Math.exp(rate * previous);
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const step = rate * (ti - previous);
      if (ti >= previous && step <= STEP_REACH && step >= -STEP_REACH) q *= expSmall(step);
      else q = base * Math.exp(rate * ti);
      previous = ti;
      out[i] = direction * q >= flatAt ? full : offset + q;
    }
  }
}
