import { t95 } from "./studentT.js";

export interface OriginLineFit {
  slope: number;
  slopeStdError: number;
  slopeCI95: [number, number];
  residualStdDev: number;
  /** Uncentred R² (1 − SSR/Σy²), the usual figure for a line forced through the origin. */
  r2: number;
  points: number;
}

export interface LineFit {
  slope: number;
  intercept: number;
  slopeStdError: number;
  interceptStdError: number;
  slopeCI95: [number, number];
  interceptCI95: [number, number];
  /** Covariance of slope and intercept. */
  covariance: number;
  residualStdDev: number;
  r2: number;
  points: number;
}

/** Least-squares straight line through the origin, y = b·x (optionally weighted). */
export function fitLineThroughOrigin(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  weights?: ArrayLike<number>,
): OriginLineFit {
  const n = x.length;
  const { sxx, slope, ssr, syy } = weights === undefined && x instanceof Float64Array && y instanceof Float64Array ? originSumsTyped(x, y) : originSums(x, y, weights);
  const dof = n - 1;
  const residualStdDev = dof > 0 ? Math.sqrt(ssr / dof) : Number.NaN;
  const slopeStdError = residualStdDev / Math.sqrt(sxx);
  const half = dof > 0 ? t95(dof) * slopeStdError : Number.NaN;
  return {
    slope,
    slopeStdError,
    slopeCI95: [slope - half, slope + half],
    residualStdDev,
    r2: 1 - ssr / syy,
    points: n,
  };
}

interface OriginSums {
  sxx: number;
  slope: number;
  ssr: number;
  syy: number;
}

/** Σw·x², the slope Σw·x·y/Σw·x², Σw·(y − slope·x)² and Σw·y², in two passes. */
function originSums(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number>): OriginSums {
  const n = x.length;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights === undefined ? 1 : weights[i];
    sxx += w * x[i] * x[i];
    sxy += w * x[i] * y[i];
  }
  const slope = sxy / sxx;
  let ssr = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights === undefined ? 1 : weights[i];
    const r = y[i] - slope * x[i];
    ssr += w * r * r;
    syy += w * y[i] * y[i];
  }
  return { sxx, slope, ssr, syy };
}

/**
 * The same sums, unweighted, over typed arrays: the loops a trace of a million points takes. Each
 * loop stores its sums into `sums` at the end of each block of points, so nothing after a loop
 * needs type feedback (see LoopSums in passBasics.ts).
 */
function originSumsTyped(x: Float64Array, y: Float64Array): OriginSums {
  const cross = { sxx: 0, sxy: 0 };
  crossSums(x, y, cross);
  const sums: OriginSums = { sxx: cross.sxx, slope: cross.sxy / cross.sxx, ssr: 0, syy: 0 };
  squaredSums(x, y, sums);
  return sums;
}

const SUM_BLOCK = 4096;

/** Σx² and Σx·y into `sums`. */
function crossSums(x: Float64Array, y: Float64Array, sums: { sxx: number; sxy: number }): void {
  const n = Math.min(x.length, y.length);
  let sxx = 0;
  let sxy = 0;
  for (let from = 0; from < n; from += SUM_BLOCK) {
    const to = Math.min(n, from + SUM_BLOCK);
    for (let i = from; i < to; i++) {
      const xi = x[i];
      sxx += xi * xi;
      sxy += xi * y[i];
    }
    sums.sxx = sxx;
    sums.sxy = sxy;
  }
}

/** Σ(y − slope·x)² into sums.ssr and Σy² into sums.syy. */
function squaredSums(x: Float64Array, y: Float64Array, sums: OriginSums): void {
  const n = Math.min(x.length, y.length);
  const slope = sums.slope + 0;
  let ssr = 0;
  let syy = 0;
  for (let from = 0; from < n; from += SUM_BLOCK) {
    const to = Math.min(n, from + SUM_BLOCK);
    for (let i = from; i < to; i++) {
      const yi = y[i];
      const r = yi - slope * x[i];
      ssr += r * r;
      syy += yi * yi;
    }
    sums.ssr = ssr;
    sums.syy = syy;
  }
}

/** Least-squares straight line y = a + b·x (optionally weighted), with 95 % intervals. */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number>): LineFit {
  const n = x.length;
  let sw = 0;
  let swx = 0;
  let swy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights === undefined ? 1 : weights[i];
    sw += w;
    swx += w * x[i];
    swy += w * y[i];
  }
  const mx = swx / sw;
  const my = swy / sw;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights === undefined ? 1 : weights[i];
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxx += w * dx * dx;
    sxy += w * dx * dy;
    syy += w * dy * dy;
  }
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  let ssr = 0;
  for (let i = 0; i < n; i++) {
    const w = weights === undefined ? 1 : weights[i];
    const r = y[i] - intercept - slope * x[i];
    ssr += w * r * r;
  }
  const dof = n - 2;
  const variance = dof > 0 ? ssr / dof : Number.NaN;
  const slopeStdError = Math.sqrt(variance / sxx);
  const interceptStdError = Math.sqrt(variance * (1 / sw + (mx * mx) / sxx));
  const t = dof > 0 ? t95(dof) : Number.NaN;
  return {
    slope,
    intercept,
    slopeStdError,
    interceptStdError,
    slopeCI95: [slope - t * slopeStdError, slope + t * slopeStdError],
    interceptCI95: [intercept - t * interceptStdError, intercept + t * interceptStdError],
    covariance: (-mx * variance) / sxx,
    residualStdDev: Math.sqrt(variance),
    r2: 1 - ssr / syy,
    points: n,
  };
}
