import { keep, LARGEST, unboxed, type LoopSums, type PassSetup, type PointGuard } from "./passBasics.js";
import { SECOND_ORDER_DEGREE, secondOrderCoefficients, secondOrderConversion, secondOrderReach } from "./secondOrderSeries.js";

/*
 * Second order: the model volume m from a Taylor polynomial about the latest anchor, whose
 * conversion is solved exactly, placed wherever a point falls outside the polynomial's reach.
 * The rate law gives the slope without a second polynomial: with u = V0(1 + εA) − m,
 * dX/dτ = (1 − X)²/(1 + εA·X) makes V0·εA·dX/dτ = u²/(εA·m).
 */

/** The anchor's Taylor coefficients of the model volume, and where it sits and reaches. */
class SecondOrderAnchor {
  private readonly a = new Float64Array(SECOND_ORDER_DEGREE + 1);
  /** V0 + V0·εA·a[0], then V0·εA·a[j]. */
  readonly volume = new Float64Array(SECOND_ORDER_DEGREE + 1);
  tau = Number.NaN;
  reach = 0;

  /** Moves the anchor to τ, warm-starting the exact solve from the polynomial's volume m. */
  moveTo(tau: number, V0: number, eps: number, m: number): void {
    const estimate = (m - V0) / (V0 * eps);
    secondOrderCoefficients(secondOrderConversion(tau, eps, Number.isFinite(m) ? estimate : -1), eps, this.a);
    for (let j = 0; j <= SECOND_ORDER_DEGREE; j++) this.volume[j] = V0 * eps * this.a[j];
    this.volume[0] += V0;
    this.tau = tau;
    this.reach = secondOrderReach(tau, eps);
  }
}

export function secondOrderSums(s: PassSetup, guard: PointGuard, out: LoopSums): boolean {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const lowV = unboxed(guard.lowV);
  const highV = unboxed(guard.highV);
  const anchor = new SecondOrderAnchor();
  const c = anchor.volume;
  let anchorTau = Number.NaN, reach = 0;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
  let ssr = 0, gg = 0, gr = 0;
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
    const tau = scale * ti;
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      anchor.moveTo(tau, V0, eps, d > 0 && d <= 2 * reach ? c0 + d * (c1 + d * (c2 + d * (c3 + d * (c4 + d * (c5 + d * c6))))) : Number.NaN);
      c0 = c[0]; c1 = c[1]; c2 = c[2]; c3 = c[3]; c4 = c[4]; c5 = c[5]; c6 = c[6];
      anchorTau = tau;
      reach = anchor.reach;
      d = 0;
    }
    const d2 = d * d;
    const m = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
    const r = v - m;
    const u = full - m;
    const g = (u * u * ti) / m;
    ssr += r * r;
    gg += g * g;
    gr += g * r;
  }
  return keep(out, ssr, gg / (eps * eps), gr / eps, 0, 0);
}

export function secondOrderResiduals(s: PassSetup, residuals: Float64Array, out: LoopSums): void {
  const { t, V } = s;
  const n = t.length;
  const V0 = unboxed(s.V0);
  const scale = unboxed(s.scale);
  const eps = unboxed(s.epsilonA);
  const full = V0 * (1 + eps);
  const shift = n > 0 ? V[0] : 0;
  const anchor = new SecondOrderAnchor();
  const c = anchor.volume;
  let anchorTau = Number.NaN, reach = 0;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
  let ssr = 0, gg = 0, gr = 0, sum = 0, squares = 0;
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    const tau = scale * ti;
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      anchor.moveTo(tau, V0, eps, d > 0 && d <= 2 * reach ? c0 + d * (c1 + d * (c2 + d * (c3 + d * (c4 + d * (c5 + d * c6))))) : Number.NaN);
      c0 = c[0]; c1 = c[1]; c2 = c[2]; c3 = c[3]; c4 = c[4]; c5 = c[5]; c6 = c[6];
      anchorTau = tau;
      reach = anchor.reach;
      d = 0;
    }
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
  keep(out, ssr, gg / (eps * eps), gr / eps, sum, squares);
}

/**
 * Model volumes V0(1 + εA·X) at second order for times in any order (fastest ascending), from the
 * anchored polynomial the passes use; `out` receives one per time.
 */
export function secondOrderVolumes(V0: number, epsilonA: number, scale: number, t: ArrayLike<number>, out: Float64Array): void {
  const n = t.length;
  const anchor = new SecondOrderAnchor();
  const c = anchor.volume;
  let anchorTau = Number.NaN, reach = 0;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
  for (let i = 0; i < n; i++) {
    const tau = scale * t[i];
    let d = tau - anchorTau;
    if (!(d >= 0 && d <= reach)) {
      const d2 = d * d;
      anchor.moveTo(tau, V0, epsilonA, d > 0 && d <= 2 * reach ? c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6)) : Number.NaN);
      c0 = c[0]; c1 = c[1]; c2 = c[2]; c3 = c[3]; c4 = c[4]; c5 = c[5]; c6 = c[6];
      anchorTau = tau;
      reach = anchor.reach;
      d = 0;
    }
    const d2 = d * d;
    out[i] = c0 + d * c1 + d2 * (c2 + d * c3 + d2 * (c4 + d * c5 + d2 * c6));
  }
}
