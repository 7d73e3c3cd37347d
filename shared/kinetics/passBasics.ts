/** What every fused pass shares: its setup, its sums and the checks on its points. */

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
  /** The mean volume, kept with sst so that two parts' sums can be joined (`joinSums`). */
  meanV?: number;
}

/** Open volume limits a point must lie strictly within, besides 0 ≤ t < ∞. */
export interface PointGuard {
  lowV: number;
  highV: number;
}

/** Largest finite double: `x <= LARGEST` is false for NaN and +∞. */
export const LARGEST = 1.7976931348623157e308;
/** Lets every point with a finite, non-negative time through. */
export const OPEN_GUARD: PointGuard = { lowV: Number.NEGATIVE_INFINITY, highV: Number.POSITIVE_INFINITY };

/**
 * Sums of one loop before the factors of k are applied. A pass's loop stores its running sums
 * here at the end of each outer round and leaves every finishing step to its caller, so nothing
 * after a long loop needs type feedback: code there has none when the loop is compiled while it
 * runs (on-stack replacement), and V8 then dropped out of that compiled loop at the same place
 * on later calls too; the passes ran 2–3× slower in such a process (measured).
 */
export class LoopSums {
  ssr = 0;
  /** Σ(g·t)² and Σ(g·t)·r with g = dX/dτ times V0·εA; the rest of ∂V/∂k is applied once at the end. */
  gg = 0;
  gr = 0;
  /** Σ(V − V[0]) and Σ(V − V[0])², kept only when residuals are written. */
  sum = 0;
  squares = 0;

  /** Adds another loop's sums. */
  addAll(other: LoopSums): void {
    this.add(other.ssr, other.gg, other.gr, other.sum, other.squares);
  }

  /** Adds one span's or block's sums (kept in the loop's locals while it ran). */
  add(ssr: number, gg: number, gr: number, sum = 0, squares = 0): void {
    this.ssr += ssr;
    this.gg += gg;
    this.gr += gr;
    this.sum += sum;
    this.squares += squares;
  }
}

/**
 * Fills `sums` from a loop's sums: applies the factors of k, and gives sst when residuals were
 * written. `loopFactor` is the part of g its loop left out (the model's slope at orders 0 and 1,
 * 1/εA at order 2).
 */
export function finishSums(setup: PassSetup, out: LoopSums, wroteResiduals: boolean, sums: PassSums, loopFactor: number): void {
  const gFactor = (setup.kFactor / (setup.V0 * setup.epsilonA)) * loopFactor;
  sums.ssr = out.ssr;
  sums.jtj = gFactor * gFactor * out.gg;
  sums.jtr = gFactor * out.gr;
  const n = setup.t.length;
  sums.sst = wroteResiduals ? out.squares - (out.sum * out.sum) / n : Number.NaN;
  sums.meanV = wroteResiduals && n > 0 ? setup.V[0] + out.sum / n : Number.NaN;
}

/**
 * The sums of a pass over `na` points followed by one over `nb` more (both parts non-empty), into
 * `a`. Sums of squares about each part's mean join through the difference of the means (the
 * pairwise update), as stable as either part.
 */
export function joinSums(a: PassSums, na: number, b: PassSums, nb: number): void {
  a.ssr += b.ssr;
  a.jtj += b.jtj;
  a.jtr += b.jtr;
  const gap = (b.meanV ?? Number.NaN) - (a.meanV ?? Number.NaN);
  a.sst += b.sst + (gap * gap * na * nb) / (na + nb);
  a.meanV = (a.meanV ?? Number.NaN) + (gap * nb) / (na + nb);
}

/**
 * The value passed through arithmetic, so an optimised loop holds it as a plain double instead
 * of re-checking the boxed number at every point (about 20 % of a pass, measured).
 */
export function unboxed(x: number): number {
  return x + 0;
}

/** Stores a loop's running sums. */
export function keep(out: LoopSums, ssr: number, gg: number, gr: number, sum: number, squares: number): true {
  out.ssr = ssr;
  out.gg = gg;
  out.gr = gr;
  out.sum = sum;
  out.squares = squares;
  return true;
}
