import { ANCHOR_EVERY, ExponentialVolume } from "./exponentialVolumes.js";
import { finishSums, keep, LoopSums, unboxed, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";
import { GRID_TAU_TOLERANCE, gridStartRefusal, offGrid, type GridPassOutcome, type RegularGrid } from "./regularGrid.js";
import { secondOrderGridResiduals, secondOrderGridSums } from "./secondOrderGridPasses.js";

/**
 * Fused passes when the times lie on a regular grid t_i = t0 + i·h, as a logger's do. At orders
 * 0 and 1 the exponential is then carried from point to point by one constant factor e^(rate·h),
 * with no series per point; order 2 has its own loops (secondOrderGridPasses.ts). A checked
 * pass proves the grid (and the guard) for every point first; the passes after it at nearby k
 * rely on that proof.
 */

export type { GridPassOutcome } from "./regularGrid.js";

/**
 * One pass at setup.scale on the grid. Without `residuals` it is the checked pass: it stops at
 * the first point off the grid or outside the guard and says which. With `residuals` it writes
 * them and fills sums.sst, trusting an earlier checked pass.
 */
export function gridPass(setup: PassSetup, grid: RegularGrid, residuals: Float64Array | null, sums: PassSums, guard: PointGuard): GridPassOutcome {
  const out = new LoopSums();
  let outcome: GridPassOutcome = "complete";
  let loopFactor: number;
  if (setup.order === 2) {
    if (residuals === null) outcome = secondOrderGridSums(setup, grid, guard, out);
    else secondOrderGridResiduals(setup, grid, residuals, out);
    loopFactor = 1 / setup.epsilonA;
  } else {
    const blocks = new GridBlocks(new ExponentialVolume(setup.order, setup.scale, setup.V0, setup.epsilonA), grid);
    if (residuals === null) outcome = checkedLoop(setup, blocks, guard, out);
    else residualLoop(setup, blocks, residuals, out);
    out.addAll(blocks.sums);
    loopFactor = blocks.model.slope;
  }
  finishSums(setup, out, residuals !== null, sums, loopFactor);
  return outcome;
}

/*
 * Both loops start each ANCHOR_EVERY points from an exact exponential at the grid time, which
 * bounds the rounding the factor carries. A block that ends before full conversion (every block
 * at order 1) runs in the pass's own loop, with no per-point branch on the model; a block that
 * reaches full conversion (order 0) goes to a loop that tests each point, flat after it. Since
 * direction·q only grows along the grid, a block is rising when its last q is below the flat,
 * judged from its first q and the factor over a whole block. Keeping the rising loop inline
 * rather than in a function per block made both passes about a tenth faster (measured).
 */

/** The model's constants per block, and the sums of the blocks that reach full conversion. */
class GridBlocks {
  readonly factor: number;
  /** factor^(ANCHOR_EVERY − 1): from a block's first q to its last (or beyond, for a short block). */
  readonly across: number;
  readonly sums = new LoopSums();

  constructor(readonly model: ExponentialVolume, readonly grid: RegularGrid) {
    this.factor = Math.exp(model.rate * grid.h);
    this.across = Math.exp(model.rate * grid.h * (ANCHOR_EVERY - 1));
  }

  /** q at the block starting at point `from`, taken afresh. */
  firstQ(from: number): number {
    return this.model.base * Math.exp(this.model.rate * (this.grid.t0 + from * this.grid.h));
  }

  rising(q: number): boolean {
    return this.model.direction * q * this.across < this.model.flatAt;
  }

  /** The whole block is past full conversion (order 0): q only moves further past it along the grid. */
  flat(q: number): boolean {
    return this.model.direction * q >= this.model.flatAt;
  }
}

/** The checked pass's rising blocks into `out` (the other blocks into blocks.sums); gg and gr without the slope. */
function checkedLoop(s: PassSetup, blocks: GridBlocks, guard: PointGuard, out: LoopSums): GridPassOutcome {
  const { t, V } = s;
  const { grid, model } = blocks;
  const n = t.length;
  const t0 = unboxed(grid.t0), h = unboxed(grid.h);
  const tolerance = GRID_TAU_TOLERANCE / s.scale;
  const refusal = gridStartRefusal(t, grid, tolerance);
  if (refusal !== undefined) return refusal;
  const offset = unboxed(model.offset), factor = unboxed(blocks.factor);
  const lowV = unboxed(guard.lowV), highV = unboxed(guard.highV);
  const tolerance2 = tolerance * tolerance;
  let ssr = 0, gg = 0, gr = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const anchor = t0 + from * h;
    const q = blocks.firstQ(from);
    let stop = to;
    if (blocks.flat(q)) stop = checkedFlatBlock(t, V, from, to, blocks, tolerance2, guard);
    else if (!blocks.rising(q)) stop = checkedBlock(t, V, from, to, q, blocks, tolerance, guard);
    else {
      let qi = q;
      for (let i = from; i < to; i++) {
        const ti = t[i], v = V[i];
        const off = ti - (anchor + (i - from) * h);
        if (!(off * off <= tolerance2 && (v - lowV) * (highV - v) > 0)) {
          stop = i;
          break;
        }
        const r = v - offset - qi, g = qi * ti;
        ssr += r * r;
        gg += g * g;
        gr += g * r;
        qi *= factor;
      }
    }
    if (stop < to) return offGrid(t[stop], anchor + (stop - from) * h, tolerance) ? "off grid" : "outside guard";
    keep(out, ssr, gg, gr, 0, 0);
  }
  return "complete";
}

/*
 * The checked pass tests each point of a rising block with one branch: off² ≤ tolerance² for the grid (false for
 * NaN), and (v − low)·(high − v) > 0 for the guard, which is false for NaN, ±∞ and anything
 * outside the open interval. The grid test agrees with |off| ≤ tolerance up to the rounding of
 * the squares; the guard test can only be stricter (a product that underflows), which sends the
 * trace to the exact route and never lets a bad point through.
 */

/**
 * The checked sums over a block wholly past full conversion (order 0): the model is the flat
 * volume, with no slope, so a point adds only (V − full)². A trace that runs onto its plateau
 * spends much of its length here.
 */
function checkedFlatBlock(t: Float64Array, V: Float64Array, from: number, to: number, blocks: GridBlocks, tolerance2: number, guard: PointGuard): number {
  const h = unboxed(blocks.grid.h);
  const anchor = unboxed(blocks.grid.t0) + from * h;
  const full = unboxed(blocks.model.full);
  const lowV = unboxed(guard.lowV), highV = unboxed(guard.highV);
  let ssr = 0;
  for (let i = from; i < to; i++) {
    const ti = t[i], v = V[i];
    const off = ti - (anchor + (i - from) * h);
    if (!(off * off <= tolerance2 && (v - lowV) * (highV - v) > 0)) {
      blocks.sums.add(ssr, 0, 0);
      return i;
    }
    const r = v - full;
    ssr += r * r;
  }
  blocks.sums.add(ssr, 0, 0);
  return to;
}

/** The checked sums over points from…to−1 of a block that reaches full conversion (order 0): flat from there on. */
function checkedBlock(t: Float64Array, V: Float64Array, from: number, to: number, q: number, blocks: GridBlocks, tolerance: number, guard: PointGuard): number {
  const { model } = blocks;
  const h = unboxed(blocks.grid.h), factor = unboxed(blocks.factor);
  const anchor = unboxed(blocks.grid.t0) + from * h;
  const offset = unboxed(model.offset), full = unboxed(model.full), direction = unboxed(model.direction), flatAt = unboxed(model.flatAt);
  const lowV = unboxed(guard.lowV), highV = unboxed(guard.highV);
  let ssr = 0, gg = 0, gr = 0;
  let qi = q + 0;
  for (let i = from; i < to; i++) {
    const ti = t[i];
    const v = V[i];
    if (offGrid(ti, anchor + (i - from) * h, tolerance) || !(v > lowV && v < highV)) return i;
    if (direction * qi >= flatAt) {
      const r = v - full;
      ssr += r * r;
    } else {
      const r = v - offset - qi;
      const g = qi * ti;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
    qi *= factor;
  }
  blocks.sums.add(ssr, gg, gr);
  return to;
}

/*
 * The residual loops follow a checked pass, so they take each point's time as its grid time
 * (within the tolerance the checked pass proved) and read only the volumes.
 */

/** The residual pass's rising blocks into `out` (the other blocks into blocks.sums); gg and gr without the slope. */
function residualLoop(s: PassSetup, blocks: GridBlocks, residuals: Float64Array, out: LoopSums): void {
  const { V } = s;
  const { grid, model } = blocks;
  const n = s.t.length;
  const shift = n > 0 ? V[0] : 0;
  const t0 = unboxed(grid.t0), h = unboxed(grid.h);
  const offset = unboxed(model.offset), factor = unboxed(blocks.factor);
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let from = 0; from < n; from += ANCHOR_EVERY) {
    const to = Math.min(n, from + ANCHOR_EVERY);
    const q = blocks.firstQ(from);
    if (blocks.flat(q)) {
      flatBlockResiduals(V, residuals, from, to, blocks, shift);
      continue;
    }
    if (!blocks.rising(q)) {
      blockResiduals(V, residuals, from, to, q, blocks, shift);
      continue;
    }
    let time = t0 + from * h;
    let qi = q;
    for (let i = from; i < to; i++) {
      const v = V[i];
      const r = v - offset - qi, g = qi * time;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
      const d = v - shift;
      sum += d;
      squares += d * d;
      qi *= factor;
      time += h;
    }
    keep(out, ssr, gg, gr, sum, squares);
  }
}

/** Residuals over a block wholly past full conversion (order 0). */
function flatBlockResiduals(V: Float64Array, residuals: Float64Array, from: number, to: number, blocks: GridBlocks, shift: number): void {
  const full = unboxed(blocks.model.full);
  let ssr = 0, sum = 0, squares = 0;
  for (let i = from; i < to; i++) {
    const v = V[i];
    const r = v - full;
    residuals[i] = r;
    ssr += r * r;
    const d = v - shift;
    sum += d;
    squares += d * d;
  }
  blocks.sums.add(ssr, 0, 0, sum, squares);
}

function blockResiduals(V: Float64Array, residuals: Float64Array, from: number, to: number, q: number, blocks: GridBlocks, shift: number): void {
  const { model } = blocks;
  const h = unboxed(blocks.grid.h), factor = unboxed(blocks.factor);
  const offset = unboxed(model.offset), full = unboxed(model.full), direction = unboxed(model.direction), flatAt = unboxed(model.flatAt);
  let time = unboxed(blocks.grid.t0) + from * h;
  let qi = q + 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let i = from; i < to; i++) {
    const v = V[i];
    if (direction * qi >= flatAt) {
      const r = v - full;
      residuals[i] = r;
      ssr += r * r;
    } else {
      const r = v - offset - qi;
      const g = qi * time;
      residuals[i] = r;
      ssr += r * r;
      gg += g * g;
      gr += g * r;
    }
    const d = v - shift;
    sum += d;
    squares += d * d;
    qi *= factor;
    time += h;
  }
  blocks.sums.add(ssr, gg, gr, sum, squares);
}
