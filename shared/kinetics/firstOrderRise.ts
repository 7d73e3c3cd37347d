import { FirstOrderKernel } from "./conversionKernel.js";
import { BLOCK_POINTS } from "./kernelFactory.js";
import type { NormalEquationsModel } from "./levenbergMarquardt.js";

/**
 * y = baseline + A·(1 − e^(−k·x)) with params [A, k]: the first-order volume rise
 * ΔV = εA·V0·(1 − e^(−k·t)) with the amplitude free, for fitting any data of that shape.
 */
export function createFirstOrderRiseModel(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  baseline = 0,
): NormalEquationsModel {
  const kernel = new FirstOrderKernel();
  const rise = new Float64Array(BLOCK_POINTS);
  const decay = new Float64Array(BLOCK_POINTS);
  return {
    parameterCount: 2,
    pointCount: x.length,
    accumulate(params, jtj, jtr) {
      const [A, k] = params;
      if (!Number.isFinite(A) || !Number.isFinite(k)) return Number.NaN;
      let ssr = 0;
      let jAA = 0;
      let jAk = 0;
      let jkk = 0;
      let rA = 0;
      let rk = 0;
      for (let from = 0; from < x.length; from += BLOCK_POINTS) {
        const to = Math.min(x.length, from + BLOCK_POINTS);
        kernel.fill(k, x, from, to, rise, decay, null);
        for (let i = from, b = 0; i < to; i++, b++) {
          const r = y[i] - (baseline + A * rise[b]);
          ssr += r * r;
          const gA = rise[b];
          const gk = A * x[i] * decay[b];
          jAA += gA * gA;
          jAk += gA * gk;
          jkk += gk * gk;
          rA += gA * r;
          rk += gk * r;
        }
      }
      if (jtj !== null && jtr !== null) {
        jtj[0] = jAA; jtj[1] = jAk; jtj[2] = jAk; jtj[3] = jkk;
        jtr[0] = rA; jtr[1] = rk;
      }
      return ssr;
    },
  };
}
