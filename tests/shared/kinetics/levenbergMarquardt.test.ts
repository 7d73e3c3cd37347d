import { describe, expect, it } from "vitest";
import { levenbergMarquardt as mlLevenbergMarquardt } from "ml-levenberg-marquardt";
import { createFirstOrderRiseModel, levenbergMarquardt, type NormalEquationsModel } from "../../../shared/kinetics/index";

// NIST Statistical Reference Datasets, nonlinear regression, Misra1a: y = b1·(1 − exp(−b2·x)).
const MISRA1A: [number, number][] = [
  [77.6, 10.07], [114.9, 14.73], [141.1, 17.94], [190.8, 23.93], [239.9, 29.61], [289.0, 35.18], [332.8, 40.02],
  [378.4, 44.82], [434.8, 50.76], [477.3, 55.05], [536.8, 61.01], [593.1, 66.4], [689.1, 75.47], [760.0, 81.78],
];
const x = MISRA1A.map(([xi]) => xi);
const y = MISRA1A.map(([, yi]) => yi);
const CERTIFIED_B1 = 2.3894212918e2;
const CERTIFIED_B2 = 5.5015643181e-4;
// Certified residual sum of squares (from memory; confirmed below by recomputing it at the certified values).
const CERTIFIED_RSS = 1.2455138894e-1;

function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe("Levenberg–Marquardt on NIST StRD Misra1a", () => {
  it("the certified residual sum of squares matches the certified parameters", () => {
    let rss = 0;
    for (let i = 0; i < x.length; i++) {
      const r = y[i] - CERTIFIED_B1 * (1 - Math.exp(-CERTIFIED_B2 * x[i]));
      rss += r * r;
    }
    expect(relative(rss, CERTIFIED_RSS)).toBeLessThan(1e-9);
  });

  it.each([
    ["NIST start 1", [500, 1e-4]],
    ["NIST start 2", [250, 5e-4]],
  ])("reproduces b1 and b2 to at least 6 significant digits from %s", (_name, initial) => {
    const result = levenbergMarquardt(createFirstOrderRiseModel(x, y), { initial });
    expect(result.converged).toBe(true);
    expect(relative(result.params[0], CERTIFIED_B1)).toBeLessThan(5e-7);
    expect(relative(result.params[1], CERTIFIED_B2)).toBeLessThan(5e-7);
    expect(relative(result.residualSumSquares, CERTIFIED_RSS)).toBeLessThan(1e-8);
  });

  it.each([
    ["NIST start 1", [500, 1e-4]],
    ["NIST start 2", [250, 5e-4]],
  ])("still reaches the certified b1 and b2 from %s when the first λ is small (a start trusted too much)", (_name, initial) => {
    const result = levenbergMarquardt(createFirstOrderRiseModel(x, y), { initial, initialDamping: 1e-6 });
    expect(result.converged).toBe(true);
    expect(relative(result.params[0], CERTIFIED_B1)).toBeLessThan(5e-7);
    expect(relative(result.params[1], CERTIFIED_B2)).toBeLessThan(5e-7);
  });

  it("takes fewer passes over the data from a close start when the first λ is small", () => {
    let passes = 0;
    const model = createFirstOrderRiseModel(x, y);
    const counted = { ...model, accumulate: (...args: Parameters<typeof model.accumulate>) => (passes++, model.accumulate(...args)) };
    const close = [CERTIFIED_B1 * (1 + 1e-4), CERTIFIED_B2 * (1 - 1e-4)];
    levenbergMarquardt(counted, { initial: close });
    const usual = passes;
    passes = 0;
    const result = levenbergMarquardt(counted, { initial: close, initialDamping: 1e-6 });
    expect(relative(result.params[1], CERTIFIED_B2)).toBeLessThan(5e-7);
    expect(passes).toBeLessThan(usual);
  });

  it("gives the certified standard deviations of b1 and b2 (NIST StRD Misra1a certified: 2.7070075241E+00, 7.2668688436E−06; from memory)", () => {
    const result = levenbergMarquardt(createFirstOrderRiseModel(x, y), { initial: [250, 5e-4] });
    const variance = result.residualSumSquares / (x.length - 2);
    const inverse = result.inverseNormalMatrix as Float64Array;
    expect(relative(Math.sqrt(variance * inverse[0]), 2.7070075241)).toBeLessThan(1e-6);
    expect(relative(Math.sqrt(variance * inverse[3]), 7.2668688436e-6)).toBeLessThan(1e-6);
  });
});

describe("Levenberg–Marquardt where the prediction does not depend on a parameter", () => {
  it("reports no convergence instead of calling the start a solution", () => {
    // y = min(b·x, 1) at b large: every point is on the cap, so the Jacobian is zero (common practice: a flat objective has no least-squares step).
    const xs = [1, 2, 3];
    const flat = {
      parameterCount: 1,
      pointCount: xs.length,
      accumulate(params: Float64Array, jtj: Float64Array | null, jtr: Float64Array | null) {
        let ssr = 0;
        if (jtj) jtj[0] = 0;
        if (jtr) jtr[0] = 0;
        for (const xi of xs) {
          const capped = params[0] * xi >= 1;
          const r = 0.2 * xi - (capped ? 1 : params[0] * xi);
          ssr += r * r;
          if (!capped && jtj && jtr) {
            jtj[0] += xi * xi;
            jtr[0] += xi * r;
          }
        }
        return ssr;
      },
    };
    const result = levenbergMarquardt(flat, { initial: [5] });
    expect(result.converged).toBe(false);
    expect(result.message).toMatch(/does not change/);
    expect(levenbergMarquardt(flat, { initial: [0.3] }).params[0]).toBeCloseTo(0.2, 9);
  });
});

describe("Levenberg–Marquardt with one parameter and large residuals (a model that does not fit the data)", () => {
  // y = e^(k·x) fitted to a line with a ripple: the residuals stay large at the least-squares k,
  // so JᵀJ misses much of the residual sum's curvature.
  const xs = Array.from({ length: 200 }, (_, i) => i / 199);
  const ys = xs.map((xi) => 1 + 2 * xi + 0.3 * Math.sin(9 * xi));
  const exponential: NormalEquationsModel = {
    parameterCount: 1,
    pointCount: xs.length,
    accumulate(params, jtj, jtr) {
      let ssr = 0;
      if (jtj) jtj[0] = 0;
      if (jtr) jtr[0] = 0;
      for (let i = 0; i < xs.length; i++) {
        const m = Math.exp(params[0] * xs[i]);
        const r = ys[i] - m;
        ssr += r * r;
        if (jtj && jtr) {
          jtj[0] += xs[i] * m * xs[i] * m;
          jtr[0] += xs[i] * m * r;
        }
      }
      return ssr;
    },
  };

  it("reaches the k of ml-levenberg-marquardt (npm curve-fitting package, analytic Jacobian, tight tolerances) to 1e−9", () => {
    const reference = mlLevenbergMarquardt(
      { x: xs, y: ys },
      ([k]: number[]) => (xi: number) => Math.exp(k * xi),
      { initialValues: [0.5], jacobianFunction: ([k]: number[]) => (xi: number) => [xi * Math.exp(k * xi)], improvementThreshold: 1e-12, errorTolerance: 1e-15 },
    );
    const result = levenbergMarquardt(exponential, { initial: [0.5] });
    expect(result.converged).toBe(true);
    expect(relative(result.params[0], reference.parameterValues[0])).toBeLessThan(1e-9);
  });
});
