import type { ConversionKernel } from "./conversionKernel.js";
import { GeneralOrderKernel } from "./generalOrderKernel.js";
import { BLOCK_POINTS, createConversionKernel, hasClosedForm } from "./kernelFactory.js";
import type { NormalEquationsModel } from "./levenbergMarquardt.js";

export interface VolumeModelSetup {
  t: ArrayLike<number>;
  V: ArrayLike<number>;
  V0: number;
  epsilonA: number;
  /** mol/L; needed unless the order is fixed at 1. */
  cA0?: number;
  /** The order when it is fixed; the starting order when it is fitted. */
  order: number;
  /** Fit n as a second parameter (params [k, n]); else params [k]. */
  fitOrder: boolean;
}

/** Gas volume V = V0(1 + εA·X(k·cA0^(n−1)·t)) against the observed volumes, for the fitter. */
export function createVolumeModel(setup: VolumeModelSetup): NormalEquationsModel {
  const { t, V, V0, epsilonA, fitOrder } = setup;
  const logC = Math.log(setup.cA0 ?? Number.NaN);
  const tMax = t.length > 0 ? t[t.length - 1] : 0;
  const X = new Float64Array(BLOCK_POINTS);
  const rate = new Float64Array(BLOCK_POINTS);
  const dXdn = fitOrder ? new Float64Array(BLOCK_POINTS) : null;
  let cached: GeneralOrderKernel | undefined;

  const kernelFor = (order: number, tauMax: number): ConversionKernel => {
    if (!fitOrder && hasClosedForm(order)) return createConversionKernel(order, epsilonA, tauMax);
    if (cached === undefined || cached.order !== order) cached = new GeneralOrderKernel(order, epsilonA, tauMax);
    return cached;
  };

  return {
    parameterCount: fitOrder ? 2 : 1,
    pointCount: t.length,
    accumulate(params, jtj, jtr) {
      const k = params[0];
      const order = fitOrder ? params[1] : setup.order;
      if (!(k >= 0) || !(order >= 0)) return Number.NaN;
      const dScaleDk = order === 1 ? 1 : Math.exp((order - 1) * logC);
      const scale = k * dScaleDk;
      if (!Number.isFinite(scale)) return Number.NaN;
      const kernel = kernelFor(order, scale * tMax);
      const amplitude = V0 * epsilonA;
      const sums = new Float64Array(6);
      if (dXdn === null) accumulateFixedOrder(t, V, V0, amplitude, scale, dScaleDk, kernel, X, rate, jtj !== null, sums);
      else accumulateFreeOrder(t, V, V0, amplitude, scale, dScaleDk, logC, kernel, X, rate, dXdn, sums);
      const [ssr, jkk, rk, jkn, jnn, rn] = sums;
      if (jtj !== null && jtr !== null) {
        if (fitOrder) {
          jtj[0] = jkk; jtj[1] = jkn; jtj[2] = jkn; jtj[3] = jnn;
          jtr[0] = rk; jtr[1] = rn;
        } else {
          jtj[0] = jkk;
          jtr[0] = rk;
        }
      }
      return ssr;
    },
  };
}

/** Sums for params [k]: out = [SSR, JᵀJ, Jᵀr]. Kept separate from the free-order loop for speed. */
function accumulateFixedOrder(
  t: ArrayLike<number>, V: ArrayLike<number>, V0: number, amplitude: number, scale: number, dScaleDk: number,
  kernel: ConversionKernel, X: Float64Array, rate: Float64Array, wantJacobian: boolean, out: Float64Array,
): void {
  const gkFactor = amplitude * dScaleDk;
  let ssr = 0;
  let jkk = 0;
  let rk = 0;
  for (let from = 0; from < t.length; from += BLOCK_POINTS) {
    const to = Math.min(t.length, from + BLOCK_POINTS);
    kernel.fill(scale, t, from, to, X, rate, null);
    if (wantJacobian) {
      for (let i = from, b = 0; i < to; i++, b++) {
        const r = V[i] - (V0 + amplitude * X[b]);
        const gk = gkFactor * rate[b] * t[i];
        ssr += r * r;
        jkk += gk * gk;
        rk += gk * r;
      }
    } else {
      for (let i = from, b = 0; i < to; i++, b++) {
        const r = V[i] - (V0 + amplitude * X[b]);
        ssr += r * r;
      }
    }
  }
  out[0] = ssr;
  out[1] = jkk;
  out[2] = rk;
}

/** Sums for params [k, n]: out = [SSR, J_kk, J_k·r, J_kn, J_nn, J_n·r]. */
function accumulateFreeOrder(
  t: ArrayLike<number>, V: ArrayLike<number>, V0: number, amplitude: number, scale: number, dScaleDk: number,
  logC: number, kernel: ConversionKernel, X: Float64Array, rate: Float64Array, dXdn: Float64Array, out: Float64Array,
): void {
  const gkFactor = amplitude * dScaleDk;
  let ssr = 0;
  let jkk = 0;
  let rk = 0;
  let jkn = 0;
  let jnn = 0;
  let rn = 0;
  for (let from = 0; from < t.length; from += BLOCK_POINTS) {
    const to = Math.min(t.length, from + BLOCK_POINTS);
    kernel.fill(scale, t, from, to, X, rate, dXdn);
    for (let i = from, b = 0; i < to; i++, b++) {
      const r = V[i] - (V0 + amplitude * X[b]);
      const gk = gkFactor * rate[b] * t[i];
      const gn = amplitude * (dXdn[b] + rate[b] * scale * t[i] * logC);
      ssr += r * r;
      jkk += gk * gk;
      rk += gk * r;
      jkn += gk * gn;
      jnn += gn * gn;
      rn += gn * r;
    }
  }
  out.set([ssr, jkk, rk, jkn, jnn, rn]);
}
