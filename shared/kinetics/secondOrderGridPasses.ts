import { keep, unboxed, type LoopSums, type PassSetup, type PointGuard } from "./passBasics.js";
import { GRID_TAU_TOLERANCE, gridStartRefusal, offGrid, type GridPassOutcome, type RegularGrid } from "./regularGrid.js";
import { SecondOrderAnchor } from "./secondOrderPasses.js";

/*
 * Second-order passes when the times lie on a regular grid t_i = t0 + i·h: each anchor sits on a
 * grid time and serves the next ⌊reach/(scale·h)⌋ + 1 points, so no point needs its own test of
 * the reach, and d = τ − τa is a whole number of grid steps. As at orders 0 and 1, the checked
 * pass proves every time lies on the grid (and every volume within the guard); the residual
 * pass after it takes the grid times and reads only the volumes. The polynomial, its reach and
 * the slope u²/m are those of secondOrderPasses.ts.
 */

/** Points one anchor serves: at least one, whatever the reach (NaN included). */
function pointsWithinReach(reach: number, tauStep: number): number {
  const steps = reach / tauStep;
  return steps >= 1 ? Math.floor(steps) + 1 : 1;
}

/** The checked pass: sums (gg and gr without the factor 1/εA) without residuals, stopping at the first point off the grid or outside the guard. */
export function secondOrderGridSums(s: PassSetup, grid: RegularGrid, guard: PointGuard, out: LoopSums): GridPassOutcome {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0), scale = unboxed(s.scale), eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const t0 = unboxed(grid.t0), h = unboxed(grid.h);
  const tauStep = scale * h;
  const tolerance = GRID_TAU_TOLERANCE / scale;
  const tolerance2 = tolerance * tolerance;
  const lowV = unboxed(guard.lowV), highV = unboxed(guard.highV);
  const refusal = gridStartRefusal(t, grid, tolerance);
  if (refusal !== undefined) return refusal;
  const anchor = new SecondOrderAnchor(V0, eps);
  const c = anchor.volume;
  let ssr = 0, gg = 0, gr = 0;
  for (let from = 0; from < n; ) {
    const anchorTime = t0 + from * h;
    anchor.moveTo(scale * anchorTime);
    const to = Math.min(n, from + pointsWithinReach(anchor.reach, tauStep));
    const c0 = c[0], c1 = c[1], c2 = c[2], c3 = c[3], c4 = c[4], c5 = c[5], c6 = c[6];
    for (let i = from; i < to; i++) {
      const ti = t[i], v = V[i];
      const steps = i - from;
      const off = ti - (anchorTime + steps * h);
      // One test per point, as explained in regularGridPasses.ts.
      if (!(off * off <= tolerance2 && (v - lowV) * (highV - v) > 0)) return offGrid(ti, anchorTime + steps * h, tolerance) ? "off grid" : "outside guard";
      const d = steps * tauStep;
      const d2 = d * d;
      const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
      const r = v - m;
      const u = full - m;
      const g = (u * u * ti) / m;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
    from = to;
    keep(out, ssr, gg, gr, 0, 0);
  }
  return "complete";
}

/** The residual pass, after a checked pass has proved the grid: residuals, sums (as the checked pass's) and the sums for sst. */
export function secondOrderGridResiduals(s: PassSetup, grid: RegularGrid, residuals: Float64Array, out: LoopSums): void {
  const { V } = s;
  const n = s.t.length;
  const V0 = unboxed(s.V0), scale = unboxed(s.scale), eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const t0 = unboxed(grid.t0), h = unboxed(grid.h);
  const tauStep = scale * h;
  const shift = n > 0 ? V[0] : 0;
  const anchor = new SecondOrderAnchor(V0, eps);
  const c = anchor.volume;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; ) {
    const anchorTime = t0 + from * h;
    anchor.moveTo(scale * anchorTime);
    const to = Math.min(n, from + pointsWithinReach(anchor.reach, tauStep));
    const c0 = c[0], c1 = c[1], c2 = c[2], c3 = c[3], c4 = c[4], c5 = c[5], c6 = c[6];
    let time = anchorTime;
    let d = 0;
    for (let i = from; i < to; i++) {
      const v = V[i];
      const d2 = d * d;
      const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
      const r = v - m;
      const u = full - m;
      const g = (u * u * time) / m;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const dv = v - shift;
      sum += dv;
      squares += dv * dv;
      time += h;
      d += tauStep;
    }
    from = to;
    keep(out, ssr, gg, gr, sum, squares);
  }
}
