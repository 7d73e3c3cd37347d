import { LARGEST, LoopSums, unboxed, type PassSetup, type PointGuard } from "./passBasics.js";
import { SECOND_ORDER_DEGREE, secondOrderCoefficients, secondOrderConversion, secondOrderReach, secondOrderSingularity, type SecondOrderSingularity } from "./secondOrderSeries.js";

/*
 * Second order: the model volume m from a Taylor polynomial about the latest anchor, whose
 * conversion is solved exactly, placed wherever a point falls outside the polynomial's reach.
 * The rate law gives the slope without a second polynomial: with u = V0(1 + εA) − m,
 * dX/dτ = (1 − X)²/(1 + εA·X) makes V0·εA·dX/dτ = u²/(εA·m).
 */

/** The anchor's Taylor coefficients of the model volume, and where it sits and reaches. */
export class SecondOrderAnchor {
  private readonly a = new Float64Array(SECOND_ORDER_DEGREE + 1);
  /** V0 + V0·εA·a[0], then V0·εA·a[j]. */
  readonly volume = new Float64Array(SECOND_ORDER_DEGREE + 1);
  tau = Number.NaN;
  reach = 0;
  private readonly singularity: SecondOrderSingularity;

  constructor(private readonly V0: number, private readonly eps: number) {
    this.singularity = secondOrderSingularity(eps);
  }

  /**
   * Moves the anchor to τ. The exact solve starts from the present polynomial's conversion
   * when τ lies a little ahead of the present anchor (within twice its reach), else afresh.
   */
  moveTo(tau: number): void {
    const { V0, eps, a } = this;
    const d = tau - this.tau;
    const estimate = d > 0 && d <= 2 * this.reach ? a[0] + d * (a[1] + d * (a[2] + d * (a[3] + d * (a[4] + d * (a[5] + d * a[6]))))) : -1;
    secondOrderCoefficients(secondOrderConversion(tau, eps, estimate), eps, a);
    for (let j = 0; j <= SECOND_ORDER_DEGREE; j++) this.volume[j] = V0 * eps * a[j];
    this.volume[0] += V0;
    this.tau = tau;
    this.reach = secondOrderReach(tau, this.singularity);
  }
}

/*
 * Each pass moves the anchor to the first point out of reach and hands the points within reach
 * to a span function with its sums in locals: the same loop with the anchor's move inside it ran
 * about an eighth slower (measured).
 */

export function secondOrderSums(s: PassSetup, guard: PointGuard, out: LoopSums): boolean {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  const anchor = new SecondOrderAnchor(V0, eps);
  let i = 0;
  while (i < n) {
    const ti = t[i];
    if (!(ti >= 0 && ti <= LARGEST)) return false;
    anchor.moveTo(scale * ti);
    i = sumsWithinReach(t, V, i, scale, anchor, full, lowV, highV, out);
    if (i < 0) return false;
  }
  return true;
}

/** Sums over the points from `from` on within the anchor's reach; the index after them, or −1 at a point outside the guard. */
function sumsWithinReach(t: Float64Array, V: Float64Array, from: number, scale: number, anchor: SecondOrderAnchor, full: number, lowV: number, highV: number, sums: LoopSums): number {
  const n = t.length;
  const c = anchor.volume;
  const c0 = c[0], c1 = c[1], c2 = c[2], c3 = c[3], c4 = c[4], c5 = c[5], c6 = c[6];
  const anchorTau = unboxed(anchor.tau), reach = unboxed(anchor.reach);
  let ssr = 0, gg = 0, gr = 0;
  let i = from;
  for (; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return -1;
    const d = scale * ti - anchorTau;
    // The first point always passes (d = 0), so every call moves on.
    if (!(d >= 0 && d <= reach) && i > from) break;
    const d2 = d * d;
    const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
    const r = v - m;
    const u = full - m;
    const g = (u * u * ti) / m;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
  }
  sums.add(ssr, gg, gr);
  return i;
}

export function secondOrderResiduals(s: PassSetup, residuals: Float64Array, out: LoopSums): void {
  const { t } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const shift = n > 0 ? s.V[0] : 0;
  const anchor = new SecondOrderAnchor(V0, eps);
  let i = 0;
  while (i < n) {
    anchor.moveTo(scale * t[i]);
    i = residualsWithinReach(t, s.V, residuals, i, scale, anchor, full, shift, out);
  }
}

/** Residuals and sums over the points from `from` on within the anchor's reach; the index after them. */
function residualsWithinReach(t: Float64Array, V: Float64Array, residuals: Float64Array, from: number, scale: number, anchor: SecondOrderAnchor, full: number, shift: number, sums: LoopSums): number {
  const n = t.length;
  const c = anchor.volume;
  const c0 = c[0], c1 = c[1], c2 = c[2], c3 = c[3], c4 = c[4], c5 = c[5], c6 = c[6];
  const anchorTau = unboxed(anchor.tau), reach = unboxed(anchor.reach);
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  let i = from;
  for (; i < n; i++) {
    const ti = t[i];
    const d = scale * ti - anchorTau;
    // The first point always passes (d = 0), so every call moves on.
    if (!(d >= 0 && d <= reach) && i > from) break;
    const v = V[i];
    const d2 = d * d;
    const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
    const r = v - m;
    const u = full - m;
    const g = (u * u * ti) / m;
    residuals[i] = r;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
    const dv = v - shift;
    sum += dv;
    squares += dv * dv;
  }
  sums.add(ssr, gg, gr, sum, squares);
  return i;
}

/**
 * Model volumes V0(1 + εA·X) at second order for times in any order (fastest ascending), from the
 * anchored polynomial the passes use; `out` receives one per time.
 */
export function secondOrderVolumes(V0: number, epsilonA: number, scale: number, t: ArrayLike<number>, out: Float64Array): void {
  const n = t.length;
  const anchor = new SecondOrderAnchor(V0, epsilonA);
  const c = anchor.volume;
  let anchorTau = Number.NaN, reach = 0;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
  for (let i = 0; i < n; i++) {
    const tau = scale * t[i];
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      anchor.moveTo(tau);
      c0 = c[0]; c1 = c[1]; c2 = c[2]; c3 = c[3]; c4 = c[4]; c5 = c[5]; c6 = c[6];
      anchorTau = tau;
      reach = anchor.reach;
      d = 0;
    }
    const d2 = d * d;
    out[i] = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
  }
}
