import type { ConversionKernel } from "./conversionKernel.js";
import { integrateDormandPrince } from "./dormandPrince.js";
import { GrowableFloat64 } from "./growableFloat64.js";
import { cubicHermite, quinticHermite } from "./hermite.js";

/** Conversion and its derivatives at one value of the transformed state w. */
interface PointState {
  X: number;
  u: number;
  /** (1 − X)^n */
  uPowN: number;
  /** q = (1 + εA·X)^(1−n) */
  q: number;
  /** ∂q/∂X */
  qX: number;
  /** ∂ln(1 − X)/∂a at fixed w, a = 1 − n */
  lnUByA: number;
}

/**
 * Any order n ≥ 0. With u = 1 − X and w = (u^(1−n) − 1)/(1 − n) (w = ln u at n = 1), the rate
 * law dX/dτ = (1 − X)^n/(1 + εA·X)^(n−1) becomes dw/dτ = −(1 + εA·X)^(1−n): bounded and smooth
 * at full conversion for every n, so an explicit integrator stays accurate there. S = ∂w/∂n is
 * carried alongside for the order sensitivity.
 */
export class GeneralOrderKernel implements ConversionKernel {
  private readonly a: number;
  private readonly nodeTau = new GrowableFloat64(256);
  private readonly nodeW = new GrowableFloat64(256);
  private readonly nodeDw = new GrowableFloat64(256);
  private readonly nodeD2w = new GrowableFloat64(256);
  private readonly nodeS = new GrowableFloat64(256);
  private readonly nodeDs = new GrowableFloat64(256);
  private tauEnd = 0;
  /** Views on the node arrays, refreshed after each extension (taking views per point is slow). */
  private views: Record<"tau" | "w" | "dw" | "d2w" | "s" | "ds", Float64Array> = {
    tau: new Float64Array(0), w: new Float64Array(0), dw: new Float64Array(0),
    d2w: new Float64Array(0), s: new Float64Array(0), ds: new Float64Array(0),
  };
  private cursor = 0;
  private readonly state: PointState = { X: 0, u: 1, uPowN: 1, q: 1, qX: 0, lnUByA: 0 };

  constructor(
    readonly order: number,
    readonly epsilonA: number,
    tauMax: number,
    private readonly tolerance = 1e-12,
  ) {
    this.a = 1 - order;
    this.extendTo(Math.max(tauMax, 1e-6));
  }

  fill(
    scale: number,
    t: ArrayLike<number>,
    from: number,
    to: number,
    X: Float64Array,
    rate: Float64Array,
    dXdn: Float64Array | null,
  ): void {
    for (let i = from; i < to; i++) {
      const p = this.at(scale * t[i]);
      X[i - from] = p.X;
      rate[i - from] = p.uPowN * p.q;
      if (dXdn !== null) dXdn[i - from] = -p.uPowN * this.lastS + p.u * p.lnUByA;
    }
  }

  private lastS = 0;

  /** State at τ by interpolation between integration nodes. */
  private at(tau: number): PointState {
    if (tau > this.tauEnd) this.extendTo(Math.max(tau, 2 * this.tauEnd));
    const { tau: taus, w: W, dw: Dw, d2w: D2w, s: S, ds: Ds } = this.views;
    const last = taus.length - 1;
    let j = this.cursor;
    if (tau < taus[j]) j = findInterval(taus, tau);
    else while (j < last - 1 && tau > taus[j + 1]) j++;
    this.cursor = j;
    const t0 = taus[j];
    const h = taus[j + 1] - t0;
    const s = h > 0 ? Math.max(0, (tau - t0) / h) : 0;
    const w = quinticHermite(s, h, W[j], Dw[j], D2w[j], W[j + 1], Dw[j + 1], D2w[j + 1]);
    this.lastS = cubicHermite(s, h, S[j], Ds[j], S[j + 1], Ds[j + 1]);
    return this.evaluate(w);
  }

  private extendTo(tauTarget: number): void {
    const startTau = this.tauEnd;
    const start = this.nodeTau.length === 0 ? [0, 0] : [this.nodeW.view()[this.nodeW.length - 1], this.nodeS.view()[this.nodeS.length - 1]];
    const skipFirst = this.nodeTau.length > 0;
    let first = true;
    integrateDormandPrince(
      (_tau, y, dy) => this.rightSide(y, dy),
      startTau,
      start,
      tauTarget,
      (tau, y, dy) => {
        if (first && skipFirst) {
          first = false;
          return;
        }
        first = false;
        const p = this.evaluate(y[0]);
        this.nodeTau.push(tau);
        this.nodeW.push(y[0]);
        this.nodeDw.push(dy[0]);
        this.nodeD2w.push(-p.qX * p.uPowN * p.q);
        this.nodeS.push(y[1]);
        this.nodeDs.push(dy[1]);
      },
      { relativeTolerance: this.tolerance, absoluteTolerance: this.tolerance * 1e-3 },
    );
    this.views = {
      tau: this.nodeTau.view(), w: this.nodeW.view(), dw: this.nodeDw.view(),
      d2w: this.nodeD2w.view(), s: this.nodeS.view(), ds: this.nodeDs.view(),
    };
    this.tauEnd = this.views.tau[this.views.tau.length - 1];
  }

  private rightSide(y: Float64Array, dy: Float64Array): void {
    const p = this.evaluate(y[0]);
    dy[0] = -p.q;
    const dXdnAtW = p.u * p.lnUByA;
    dy[1] = -(p.qX * (-p.uPowN * y[1] + dXdnAtW) - Math.log1p(this.epsilonA * p.X) * p.q);
  }

  private evaluate(w: number): PointState {
    const a = this.a;
    const eps = this.epsilonA;
    const st = this.state;
    const aw = a * w;
    if (a !== 0 && 1 + aw <= 0) {
      st.X = 1;
      st.u = 0;
      st.uPowN = 0;
      st.lnUByA = 0;
    } else {
      const lnU = a === 0 ? w : Math.log1p(aw) / a;
      st.X = -Math.expm1(lnU);
      st.u = st.X < 0.5 ? 1 - st.X : Math.exp(lnU);
      // u^n = u·u^(−a) and u^a = 1 + a·w.
      st.uPowN = a === 0 ? st.u : st.u / (1 + aw);
      st.lnUByA = Math.abs(aw) < 1e-4
        ? w * w * (-0.5 + aw * (2 / 3 - aw * (0.75 - 0.8 * aw)))
        : w / (a * (1 + aw)) - Math.log1p(aw) / (a * a);
    }
    const base = 1 + eps * st.X;
    st.q = Math.exp(a * Math.log(base));
    st.qX = (a * eps * st.q) / base;
    return st;
  }
}

function findInterval(taus: Float64Array, tau: number): number {
  let lo = 0;
  let hi = taus.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (taus[mid] <= tau) lo = mid;
    else hi = mid;
  }
  return lo;
}
