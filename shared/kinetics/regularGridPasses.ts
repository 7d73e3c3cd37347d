import { finishSums, keep, LoopSums, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";

/**
 * Fused passes for orders 0 and 1 when the times lie on a regular grid t_i = t0 + i·h, as a
 * logger's do: the exponential is then carried from point to point by one constant factor
 * e^(∓scale·h), with no series per point. A checked pass proves the grid (and the guard) for
 * every point first; the passes after it at nearby k rely on that proof.
 */

/** Times t_i = t0 + i·h. */
export interface RegularGrid {
  t0: number;
  h: number;
}

export type GridPassOutcome = "complete" | "outside guard" | "off grid";

/**
 * Largest distance from the grid allowed for a point, in reduced time: the model's exponent is
 * then off by at most this much, about the rounding the factor carries over ANCHOR_EVERY steps.
 */
export const GRID_TAU_TOLERANCE = 1e-14;
/** Points between exact exponentials, bounding the rounding carried by the constant factor. */
const ANCHOR_EVERY = 128;
const LARGEST = 1.7976931348623157e308;

/**
 * The grid the times seem to lie on, judged from the first, last and every stride-th point at
 * this scale; undefined when they clearly do not. The checked pass still proves every point.
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

/**
 * One pass at setup.scale on the grid (orders 0 and 1). Without `residuals` it is the checked
 * pass: it stops at the first point off the grid or outside the guard and says which. With
 * `residuals` it writes them and fills sums.sst, trusting an earlier checked pass.
 */
export function gridPass(setup: PassSetup, grid: RegularGrid, residuals: Float64Array | null, sums: PassSums, guard: PointGuard): GridPassOutcome {
  if (setup.order === 2) throw new Error("gridPass: orders 0 and 1 only");
  const out = new LoopSums();
  let outcome: GridPassOutcome = "complete";
  if (setup.order === 1) {
    if (residuals === null) outcome = firstOrderChecked(setup, grid, guard, out);
    else firstOrderResiduals(setup, grid, residuals, out);
  } else if (residuals === null) outcome = zeroOrderChecked(setup, grid, guard, out);
  else zeroOrderResiduals(setup, grid, residuals, out);
  finishSums(setup, out, residuals !== null, sums);
  return outcome;
}

/*
 * First order: V = V0(1 + εA) − c with c = V0·εA·e^(−τ), carried by e^(−scale·h); V0·εA·dX/dτ
 * is c. An exact exponential at every ANCHOR_EVERY-th grid time bounds the rounding.
 */

function firstOrderChecked(s: PassSetup, grid: RegularGrid, guard: PointGuard, out: LoopSums): GridPassOutcome {
  const { t, V } = s;
  const n = t.length;
  const scale = s.scale + 0;
  const t0 = grid.t0 + 0;
  const h = grid.h + 0;
  const tolerance = GRID_TAU_TOLERANCE / scale;
  const lowV = guard.lowV + 0;
  const highV = guard.highV + 0;
  const amplitude = s.V0 * s.epsilonA;
  const full = s.V0 + amplitude;
  const factor = Math.exp(-scale * h);
  let ssr = 0, gg = 0, gr = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const anchor = t0 + from * h;
    let c = amplitude * Math.exp(-scale * anchor);
    let steps = 0;
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return "outside guard";
      const off = ti - (anchor + steps * h);
      if (!(off <= tolerance && off >= -tolerance)) return "off grid";
      const r = v - full + c;
      const g = c * ti;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      c *= factor;
      steps++;
    }
  }
  keep(out, ssr, gg, gr, 0, 0);
  return "complete";
}

function firstOrderResiduals(s: PassSetup, grid: RegularGrid, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const scale = s.scale + 0;
  const t0 = grid.t0 + 0;
  const h = grid.h + 0;
  const amplitude = s.V0 * s.epsilonA;
  const full = s.V0 + amplitude;
  const factor = Math.exp(-scale * h);
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let c = amplitude * Math.exp(-scale * (t0 + from * h));
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const r = v - full + c;
      const g = c * ti;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
      c *= factor;
    }
  }
  keep(out, ssr, gg, gr, sum, squares);
}

/*
 * Zero order: V = m = V0·e^(εA·τ), carried by e^(εA·scale·h), until it reaches full conversion
 * V0(1 + εA) (from below, or from above for εA < 0); flat after. V0·εA·dX/dτ is εA·m.
 */

function zeroOrderChecked(s: PassSetup, grid: RegularGrid, guard: PointGuard, out: LoopSums): GridPassOutcome {
  const { t, V } = s;
  const n = t.length;
  const scale = s.scale + 0;
  const t0 = grid.t0 + 0;
  const h = grid.h + 0;
  const tolerance = GRID_TAU_TOLERANCE / scale;
  const lowV = guard.lowV + 0;
  const highV = guard.highV + 0;
  const V0 = s.V0 + 0;
  const eps = s.epsilonA + 0;
  const full = V0 * (1 + eps);
  const rising = eps > 0;
  const factor = Math.exp(eps * scale * h);
  let ssr = 0, gg = 0, gr = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const anchor = t0 + from * h;
    let m = V0 * Math.exp(eps * scale * anchor);
    let steps = 0;
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return "outside guard";
      const off = ti - (anchor + steps * h);
      if (!(off <= tolerance && off >= -tolerance)) return "off grid";
      const reacting = rising ? m < full : m > full;
      const r = v - (reacting ? m : full);
      const g = reacting ? eps * m * ti : 0;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      m *= factor;
      steps++;
    }
  }
  keep(out, ssr, gg, gr, 0, 0);
  return "complete";
}

function zeroOrderResiduals(s: PassSetup, grid: RegularGrid, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const scale = s.scale + 0;
  const t0 = grid.t0 + 0;
  const h = grid.h + 0;
  const V0 = s.V0 + 0;
  const eps = s.epsilonA + 0;
  const full = V0 * (1 + eps);
  const rising = eps > 0;
  const factor = Math.exp(eps * scale * h);
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    let m = V0 * Math.exp(eps * scale * (t0 + from * h));
    for (let i = from; i < to; i++) {
      const ti = t[i];
      const v = V[i];
      const reacting = rising ? m < full : m > full;
      const r = v - (reacting ? m : full);
      const g = reacting ? eps * m * ti : 0;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
      m *= factor;
    }
  }
  keep(out, ssr, gg, gr, sum, squares);
}
