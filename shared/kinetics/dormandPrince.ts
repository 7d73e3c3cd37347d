/** Adaptive Dormand–Prince 5(4) integrator for small non-stiff systems y' = f(t, y). */

export type OdeRightSide = (t: number, y: Float64Array, dy: Float64Array) => void;

export interface DormandPrinceOptions {
  relativeTolerance?: number;
  absoluteTolerance?: number;
  initialStep?: number;
  maxSteps?: number;
}

export interface DormandPrinceOutcome {
  ok: boolean;
  steps: number;
  rejected: number;
}

const C = [0, 1 / 5, 3 / 10, 4 / 5, 8 / 9, 1, 1];
const A: number[][] = [
  [],
  [1 / 5],
  [3 / 40, 9 / 40],
  [44 / 45, -56 / 15, 32 / 9],
  [19372 / 6561, -25360 / 2187, 64448 / 6561, -212 / 729],
  [9017 / 3168, -355 / 33, 46732 / 5247, 49 / 176, -5103 / 18656],
  [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84],
];
const B5 = [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84, 0];
const B4 = [5179 / 57600, 0, 7571 / 16695, 393 / 640, -92097 / 339200, 187 / 2100, 1 / 40];
const E = B5.map((b, i) => b - B4[i]);

/**
 * Integrates from t0 to tEnd, calling `onNode(t, y, dy)` at the start and after every accepted
 * step (y and dy are reused buffers: copy what you keep).
 */
export function integrateDormandPrince(
  rhs: OdeRightSide,
  t0: number,
  y0: ArrayLike<number>,
  tEnd: number,
  onNode: (t: number, y: Float64Array, dy: Float64Array) => void,
  options: DormandPrinceOptions = {},
): DormandPrinceOutcome {
  const rtol = options.relativeTolerance ?? 1e-12;
  const atol = options.absoluteTolerance ?? 1e-15;
  const maxSteps = options.maxSteps ?? 1_000_000;
  const m = y0.length;
  const y = Float64Array.from(y0);
  const k = Array.from({ length: 7 }, () => new Float64Array(m));
  const stage = new Float64Array(m);
  const yNew = new Float64Array(m);
  let t = t0;
  rhs(t, y, k[0]);
  onNode(t, y, k[0]);
  const span = tEnd - t0;
  if (span <= 0) return { ok: true, steps: 0, rejected: 0 };
  let h = Math.min(options.initialStep ?? span * 1e-3, span);
  let steps = 0;
  let rejected = 0;
  while (t < tEnd) {
    if (steps + rejected > maxSteps) return { ok: false, steps, rejected };
    if (t + h > tEnd) h = tEnd - t;
    if (t + h === t) return { ok: false, steps, rejected };
    for (let s = 1; s < 7; s++) {
      for (let i = 0; i < m; i++) {
        let sum = y[i];
        for (let j = 0; j < s; j++) sum += h * A[s][j] * k[j][i];
        stage[i] = sum;
      }
      rhs(t + C[s] * h, stage, k[s]);
      if (s === 6) yNew.set(stage);
    }
    let errorNorm = 0;
    for (let i = 0; i < m; i++) {
      let err = 0;
      for (let j = 0; j < 7; j++) err += E[j] * k[j][i];
      const scale = atol + rtol * Math.max(Math.abs(y[i]), Math.abs(yNew[i]));
      errorNorm = Math.max(errorNorm, Math.abs(h * err) / scale);
    }
    if (!Number.isFinite(errorNorm)) {
      h *= 0.25;
      rejected++;
      continue;
    }
    if (errorNorm <= 1) {
      t = t + h >= tEnd ? tEnd : t + h;
      y.set(yNew);
      k[0].set(k[6]);
      steps++;
      onNode(t, y, k[0]);
    } else {
      rejected++;
    }
    const factor = errorNorm === 0 ? 5 : 0.9 * Math.pow(errorNorm, -0.2);
    h *= Math.min(5, Math.max(0.2, factor));
  }
  return { ok: true, steps, rejected };
}
