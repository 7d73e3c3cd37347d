import { LARGEST } from "./passBasics.js";

/**
 * Times on a regular grid t_i = t0 + i·h, as a logger writes them: on such a grid an exponential
 * in time is carried from point to point by one constant factor.
 */

/** Times t_i = t0 + i·h. */
export interface RegularGrid {
  t0: number;
  h: number;
}

/**
 * Largest distance from the grid allowed for a point, in reduced time: the model's exponent is
 * then off by at most this much, about the rounding the factor carries over an anchor's span.
 */
export const GRID_TAU_TOLERANCE = 1e-14;

/** How a checked pass on the grid ended. */
export type GridPassOutcome = "complete" | "outside guard" | "off grid";

/**
 * What a checked grid pass must establish before its loop, or undefined when it may start. A
 * time within the tolerance of its grid time is finite; with t[0] ≥ 0, t0 ≥ 0 and steps wider
 * than twice the tolerance, none is negative: so only the volumes need the guard at each point.
 */
export function gridStartRefusal(t: Float64Array, grid: RegularGrid, tolerance: number): GridPassOutcome | undefined {
  if (!(grid.t0 >= 0 && grid.t0 <= LARGEST && (t.length === 0 || t[0] >= 0))) return "outside guard";
  if (!(grid.h > 2 * tolerance)) return "off grid";
  return undefined;
}

/** True when `time` is further than the tolerance from its grid time (or NaN). */
export function offGrid(time: number, gridTime: number, tolerance: number): boolean {
  const off = time - gridTime;
  return !(off <= tolerance && off >= -tolerance);
}

/**
 * The grid the times seem to lie on, judged from the first, last and every stride-th point at
 * this scale; undefined when they clearly do not. Whoever relies on it still checks every point.
 */
export function likelyGrid(t: Float64Array, scale: number, samples = 4000): RegularGrid | undefined {
  const n = t.length;
  if (n < 3) return undefined;
  const t0 = t[0];
  const h = (t[n - 1] - t0) / (n - 1);
  if (!(h > 0 && Number.isFinite(h) && scale > 0 && Number.isFinite(scale))) return undefined;
  const tolerance = GRID_TAU_TOLERANCE / scale;
  const stride = Math.max(1, Math.floor(n / samples));
  for (let i = 0; i < n; i += stride) {
    if (!(Math.abs(t[i] - (t0 + i * h)) <= tolerance)) return undefined;
  }
  return { t0, h };
}
