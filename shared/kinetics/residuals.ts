import { BLOCK_POINTS, createConversionKernel, reducedTimeScale } from "./kernelFactory.js";
import type { RateModelAtConditions } from "./prediction.js";

/** Observed minus model volume at each point, with the residual and total sums of squares. */
export function residualsAt(
  t: ArrayLike<number>,
  V: ArrayLike<number>,
  model: RateModelAtConditions,
): { residuals: Float64Array; ssr: number; sst: number } {
  const n = t.length;
  const residuals = new Float64Array(n);
  const sums = { ssr: 0, sum: 0, squares: 0 };
  writeResiduals(t, V, model, residuals, sums);
  return { residuals, ssr: sums.ssr, sst: sums.squares - (sums.sum * sums.sum) / n };
}

/**
 * The residuals into `residuals`, and their sums into `sums` at the end of each block: nothing
 * after the loop needs type feedback (see LoopSums in passBasics.ts).
 */
function writeResiduals(t: ArrayLike<number>, V: ArrayLike<number>, model: RateModelAtConditions, residuals: Float64Array, sums: { ssr: number; sum: number; squares: number }): void {
  const n = t.length;
  const scale = reducedTimeScale(model.k, model.order, model.cA0);
  const kernel = createConversionKernel(model.order, model.epsilonA, scale * (n > 0 ? t[n - 1] : 0));
  const X = new Float64Array(BLOCK_POINTS);
  const rate = new Float64Array(BLOCK_POINTS);
  const amplitude = model.V0 * model.epsilonA;
  const shift = n > 0 ? V[0] : 0;
  let ssr = 0;
  let sum = 0;
  let sumSquares = 0;
  for (let from = 0; from < n; from += BLOCK_POINTS) {
    const to = Math.min(n, from + BLOCK_POINTS);
    kernel.fill(scale, t, from, to, X, rate, null);
    for (let i = from, b = 0; i < to; i++, b++) {
      const r = V[i] - (model.V0 + amplitude * X[b]);
      residuals[i] = r;
      ssr += r * r;
      const d = V[i] - shift;
      sum += d;
      sumSquares += d * d;
    }
    sums.ssr = ssr;
    sums.sum = sum;
    sums.squares = sumSquares;
  }
}
