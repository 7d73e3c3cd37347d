import { describe, expect, it } from "vitest";
import {
  GeneralOrderKernel,
  integrateDormandPrince,
  predictConversion,
  predictVolume,
  quinticHermite,
  reducedTimeAtConversion,
} from "../../../shared/kinetics/index";
import { closedFormReducedTime } from "../../../shared/kinetics/reducedTime";
import { odexConversion } from "../../support/odexReference";

const CA0 = 0.0322;
const EPSILONS = [-0.5, 0, 0.7, 2];

describe("closed-form conversion against odex (independent ODE solver)", () => {
  for (const order of [0, 1, 2]) {
    for (const epsilonA of EPSILONS) {
      it(`order ${order}, εA = ${epsilonA}`, () => {
        const tau = 1.2 * Math.pow(CA0, order - 1);
        const k = order === 0 ? (0.5 * CA0) / 3000 : tau / Math.pow(CA0, order - 1) / 3000;
        // Dense times, then a sparse tail: both the series-from-anchor and the anchored evaluation run.
        const times = [...Array.from({ length: 2000 }, (_, i) => i * 0.25), ...Array.from({ length: 300 }, (_, i) => 500 + i * 8), 2900, 3000];
        const ours = predictConversion({ order, k, epsilonA, V0: 1, cA0: CA0 }, times);
        const reference = odexConversion(order, k * Math.pow(CA0, order - 1), epsilonA, times);
        for (let i = 1; i < times.length; i++) {
          expect(Math.abs(ours[i] - reference[i]) / reference[i]).toBeLessThan(1e-8);
        }
      });
    }
  }
});

describe("general-order route against odex", () => {
  for (const order of [0.5, 1.5]) {
    for (const epsilonA of EPSILONS) {
      it(`order ${order}, εA = ${epsilonA}`, () => {
        const k = 6e-4 / Math.pow(CA0, order - 1);
        const times = [0.5, 10, 100, 400, 800, 1200, 1600, 2000];
        const ours = predictConversion({ order, k, epsilonA, V0: 1, cA0: CA0 }, times);
        const reference = odexConversion(order, k * Math.pow(CA0, order - 1), epsilonA, times);
        for (let i = 0; i < times.length; i++) {
          expect(Math.abs(ours[i] - reference[i]) / reference[i]).toBeLessThan(1e-8);
        }
      });
    }
  }

  it("reaches full conversion in finite time for n < 1 and stays there", () => {
    // n = 0.5, εA = 0: X = 1 − (1 − τ/2)², complete at τ = 2 (common practice).
    const X = predictConversion({ order: 0.5, k: 1, epsilonA: 0, V0: 1, cA0: 1 }, [0.5, 1, 1.9, 2.5, 4]);
    expect(X[0]).toBeCloseTo(1 - (1 - 0.25) ** 2, 10);
    expect(X[2]).toBeCloseTo(1 - (1 - 0.95) ** 2, 10);
    expect(X[3]).toBe(1);
    expect(X[4]).toBe(1);
  });

  it("agrees with the closed forms when asked for the order sensitivity at n = 1 and 2", () => {
    for (const order of [1, 2]) {
      const kernel = new GeneralOrderKernel(order, 0.7, 5);
      const taus = [0.01, 0.5, 1, 3, 5];
      const X = new Float64Array(taus.length);
      const rate = new Float64Array(taus.length);
      kernel.fill(1, taus, 0, taus.length, X, rate, new Float64Array(taus.length));
      const closed = predictConversion({ order, k: 1, epsilonA: 0.7, V0: 1, cA0: 1 }, taus);
      for (let i = 0; i < taus.length; i++) expect(Math.abs(X[i] - closed[i]) / closed[i]).toBeLessThan(1e-10);
    }
  });

  it("∂X/∂n matches a central difference", () => {
    const taus = [0.2, 1, 2.5];
    const at = (order: number, withSensitivity: boolean) => {
      const kernel = new GeneralOrderKernel(order, 0.7, 3);
      const X = new Float64Array(3);
      const dXdn = new Float64Array(3);
      kernel.fill(1, taus, 0, 3, X, new Float64Array(3), withSensitivity ? dXdn : null);
      return withSensitivity ? dXdn : X;
    };
    const h = 1e-5;
    const analytic = at(1.3, true);
    const plus = at(1.3 + h, false);
    const minus = at(1.3 - h, false);
    for (let i = 0; i < 3; i++) expect(analytic[i]).toBeCloseTo((plus[i] - minus[i]) / (2 * h), 7);
  });
});

describe("volume prediction", () => {
  it("first order: V = V0(1 + εA(1 − e^(−kt)))", () => {
    const V = predictVolume({ order: 1, k: 1e-3, epsilonA: 0.7, V0: 2 }, [0, 100, 1000]);
    expect(V[0]).toBe(2);
    expect(V[2]).toBeCloseTo(2 * (1 + 0.7 * (1 - Math.exp(-1))), 14);
  });

  it("zero order caps at full conversion: V ≤ V0(1 + εA)", () => {
    const V = predictVolume({ order: 0, k: 1e-3, epsilonA: 0.7, V0: 2, cA0: 0.03 }, [0, 10, 100, 1000]);
    expect(V[1]).toBeCloseTo(2 * Math.exp((1e-3 * 0.7 * 10) / 0.03), 12);
    expect(V[3]).toBeCloseTo(2 * 1.7, 14);
  });

  it("εA = 0: the volume does not move", () => {
    expect(Array.from(predictVolume({ order: 2, k: 5, epsilonA: 0, V0: 3, cA0: 0.1 }, [0, 1, 50]))).toEqual([3, 3, 3]);
  });

  it("dense second-order evaluation matches point-by-point evaluation for εA in [−0.9, 5]", () => {
    for (const epsilonA of [-0.9, 5]) {
      const model = { order: 2, k: 1, epsilonA, V0: 1, cA0: 1 };
      const taus = Array.from({ length: 5000 }, (_, i) => 1e-5 * i * i * 0.0004 + i * 1e-5);
      const dense = predictConversion(model, taus);
      for (let i = 1; i < taus.length; i += 97) {
        const alone = predictConversion(model, [taus[i]])[0];
        expect(Math.abs(dense[i] - alone) / alone).toBeLessThan(1e-12);
      }
    }
  });

  it.each([-0.9, -0.5, 0.7, 5])("second-order volumes (anchored polynomial) equal V0(1 + εA·X) from the conversion route, εA = %f", (epsilonA) => {
    const model = { order: 2, k: 0.5, epsilonA, V0: 2, cA0: 1 };
    // Ascending and dense, then sparse, then out of order: every way of placing anchors.
    const times = [...Array.from({ length: 4000 }, (_, i) => i * 5e-3), ...Array.from({ length: 200 }, (_, i) => 20 + i * 0.7), 3, 150, 0.01, 90];
    const volumes = predictVolume(model, times);
    const X = predictConversion(model, times);
    for (let i = 0; i < times.length; i++) {
      expect(Math.abs(volumes[i] - model.V0 * (1 + epsilonA * X[i]))).toBeLessThan(1e-12);
    }
    // The implicit closed form (1 + εA)·X/(1 − X) + εA·ln(1 − X) = τ (common practice), from the volumes.
    for (const i of [10, 500, 3999, 4100, 4203]) {
      const Xi = (volumes[i] - model.V0) / (model.V0 * epsilonA);
      const implicit = ((1 + epsilonA) * Xi) / (1 - Xi) + epsilonA * Math.log(1 - Xi);
      expect(Math.abs(implicit - 0.5 * times[i]) / (0.5 * times[i])).toBeLessThan(1e-9);
    }
  });

  it("second-order Newton solve stays robust over εA in [−0.9, 5]", () => {
    for (const epsilonA of [-0.9, -0.3, 0, 1, 5]) {
      const taus = [1e-6, 0.1, 1, 10, 1e3, 1e6];
      const X = predictConversion({ order: 2, k: 1, epsilonA, V0: 1, cA0: 1 }, taus);
      for (let i = 0; i < taus.length; i++) {
        const implicit = ((1 + epsilonA) * X[i]) / (1 - X[i]) + epsilonA * Math.log(1 - X[i]);
        expect(Math.abs(implicit - taus[i]) / taus[i]).toBeLessThan(1e-9);
      }
    }
  });
});

describe("numerical building blocks", () => {
  it("Dormand–Prince integrates y' = y to e (common practice)", () => {
    let last = 0;
    integrateDormandPrince((_t, y, dy) => { dy[0] = y[0]; }, 0, [1], 1, (_t, y) => { last = y[0]; });
    expect(Math.abs(last - Math.E) / Math.E).toBeLessThan(1e-11);
  });

  it("quintic Hermite is exact for a fifth-degree polynomial", () => {
    const p = (x: number) => 2 - x + 3 * x ** 3 - x ** 5;
    const d = (x: number) => -1 + 9 * x ** 2 - 5 * x ** 4;
    const dd = (x: number) => 18 * x - 20 * x ** 3;
    const [a, b] = [0.3, 1.1];
    const value = quinticHermite(0.37, b - a, p(a), d(a), dd(a), p(b), d(b), dd(b));
    expect(value).toBeCloseTo(p(a + 0.37 * (b - a)), 13);
  });

  it("reduced time at conversion matches the closed forms at n = 0 and 2", () => {
    const X = 0.8;
    const eps = 0.7;
    expect(reducedTimeAtConversion(X, 0, eps)).toBeCloseTo(Math.log1p(eps * X) / eps, 10);
    expect(reducedTimeAtConversion(X, 2, eps)).toBeCloseTo(((1 + eps) * X) / (1 - X) + eps * Math.log(1 - X), 9);
  });

  it("closedFormReducedTime (the fits' first guess) agrees with the quadrature at n = 0, 1 and 2", () => {
    for (const order of [0, 1, 2] as const) {
      for (const eps of EPSILONS) {
        for (const X of [0.05, 0.5, 0.9]) {
          const quadrature = reducedTimeAtConversion(X, order, eps);
          expect(Math.abs(closedFormReducedTime(X, order, eps) / quadrature - 1)).toBeLessThan(1e-9);
        }
      }
    }
  });
});
