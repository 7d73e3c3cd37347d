import { ANCHOR_EVERY, ExponentialVolume } from "./exponentialVolumes.js";
import { finishSums, keep, LARGEST, LoopSums, unboxed, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";
import { GRID_TAU_TOLERANCE, type RegularGrid } from "./regularGrid.js";

/**
 * Fused passes for orders 0 and 1 when the times lie on a regular grid t_i = t0 + i·h, as a
 * logger's do: the exponential is then carried from point to point by one constant factor
 * e^(rate·h), with no series per point. A checked pass proves the grid (and the guard) for
 * every point first; the passes after it at nearby k rely on that proof.
 */

export type GridPassOutcome = "complete" | "outside guard" | "off grid";

/**
 * One pass at setup.scale on the grid. Without `residuals` it is the checked pass: it stops at
 * the first point off the grid or outside the guard and says which. With `residuals` it writes
 * them and fills sums.sst, trusting an earlier checked pass.
 */
export function gridPass(setup: PassSetup, grid: RegularGrid, residuals: Float64Array | null, sums: PassSums, guard: PointGuard): GridPassOutcome {
  if (setup.order === 2) throw new Error("gridPass: orders 0 and 1 only");
  const out = new LoopSums();
  const model = new ExponentialVolume(setup.order, setup.scale, setup.V0, setup.epsilonA);
  let outcome: GridPassOutcome = "complete";
  if (residuals === null) outcome = checkedLoop(setup, grid, model, guard, out);
  else residualLoop(setup, grid, model, residuals, out);
  finishSums(setup, out, residuals !== null, sums);
  return outcome;
}

/*
 * Both loops start each ANCHOR_EVERY points from an exact exponential at the grid time, which
 * bounds the rounding the factor carries; past full conversion (order 0) the model is flat.
 */

function checkedLoop(s: PassSetup, grid: RegularGrid, model: ExponentialVolume, guard: PointGuard, out: LoopSums): GridPassOutcome {
  const { t, V } = s;
  const n = t.length;
  const rate = unboxed(model.rate), base = unboxed(model.base), offset = unboxed(model.offset), full = unboxed(model.full);
  const direction = unboxed(model.direction), flatAt = unboxed(model.flatAt);
  const t0 = unboxed(grid.t0);
  const h = unboxed(grid.h);
  const tolerance = GRID_TAU_TOLERANCE / s.scale;
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  const factor = Math.exp(rate * h);
  let ssr = 0, gg = 0, gr = 0;
  // A time within the tolerance of its grid time is finite; with t[0] ≥ 0, t0 ≥ 0 and steps wider
  // than twice the tolerance, none is negative: so only the volumes need the guard at each point.
  if (!(t0 >= 0 && t0 <= LARGEST && (n === 0 || t[0] >= 0))) return "outside guard";
  if (!(h > 2 * tolerance)) return "off grid";
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const anchor = t0 + from * h;
    let q = base * Math.exp(rate * anchor);
    let steps = 0;
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const off = ti - (anchor + steps * h);
      if (!(off <= tolerance && off >= -tolerance)) return "off grid";
      if (!(v > lowV && v < highV)) return "outside guard";
      if (direction * q >= flatAt) {
        const r = v - full;
        ssr += r * r;
      } else {
        const r = v - offset - q;
        const g = q * ti;
        ssr += r * r;
        gg += g * g;
        gr += g * r;
      }
      q *= factor;
      steps++;
    }
  }
  const slope = model.slope;
  keep(out, ssr, slope * slope * gg, slope * gr, 0, 0);
  return "complete";
}

function residualLoop(s: PassSetup, grid: RegularGrid, model: ExponentialVolume, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const rate = unboxed(model.rate), base = unboxed(model.base), offset = unboxed(model.offset), full = unboxed(model.full);
  const direction = unboxed(model.direction), flatAt = unboxed(model.flatAt);
  const t0 = unboxed(grid.t0);
  const h = unboxed(grid.h);
  const factor = Math.exp(rate * h);
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let q = base * Math.exp(rate * (t0 + from * h));
    for (let i = from; i < to; i++) {
      const v = V[i];
      if (direction * q >= flatAt) {
        const r = v - full;
        residuals[i] = r;
        ssr += r * r;
      } else {
        const r = v - offset - q;
        const g = q * t[i];
        residuals[i] = r;
        ssr += r * r;
        gg += g * g;
        gr += g * r;
      }
      const d = v - shift;
      sum += d;
      squares += d * d;
      q *= factor;
    }
  }
  const slope = model.slope;
  keep(out, ssr, slope * slope * gg, slope * gr, sum, squares);
}
