import { describe, expect, it } from "vitest";
import { KineticsInputError, fitDifferential, smoothedDerivative } from "../../../shared/kinetics/index";
import { odexConversion } from "../../support/odexReference";

const V0 = 2;
const CA0 = 0.0322;

/** Volume trace from the rate law integrated by odex (independent ODE solver), uneven times. */
function odexTrace(order: number, k: number, epsilonA: number) {
  const t = Array.from({ length: 600 }, (_, i) => i * 5 + 1.5 * Math.sin(i));
  const X = odexConversion(order, k * Math.pow(CA0, order - 1), epsilonA, t);
  return { t, V: X.map((x) => V0 * (1 + epsilonA * x)) };
}

describe("differential method", () => {
  it.each([
    [1, 0.7],
    [1.5, 0.7],
    [2, -0.4],
  ])("recovers n = %f and k from an odex trace (εA = %f, uneven spacing)", (order, epsilonA) => {
    const k = 6e-4 / Math.pow(CA0, order - 1);
    const result = fitDifferential(odexTrace(order, k, epsilonA), { V0, epsilonA, cA0: CA0, window: 9, polynomialOrder: 3 });
    expect(result.order).toBeCloseTo(order, 3);
    expect(Math.abs(result.k / k - 1)).toBeLessThan(5e-3);
    expect(result.orderCI95[0]).toBeLessThan(result.order);
    expect(result.orderCI95[1]).toBeGreaterThan(result.order);
    expect(result.kCI95[0]).toBeLessThan(result.k);
  });

  it("needs a non-zero εA", () => {
    expect(() => fitDifferential({ t: [0, 1, 2], V: [1, 1, 1] }, { V0: 1, epsilonA: 0, cA0: 1 })).toThrow(KineticsInputError);
  });
});

describe("Savitzky–Golay derivative on uneven spacing", () => {
  it("is exact for a polynomial of the window's degree (local least squares, common practice)", () => {
    const x = Array.from({ length: 40 }, (_, i) => i + 0.3 * Math.sin(3 * i));
    const y = x.map((v) => 1 + 2 * v - 0.05 * v * v + 0.001 * v ** 3);
    const slope = smoothedDerivative(x, y, { window: 7, polynomialOrder: 3 });
    for (let i = 0; i < x.length; i++) expect(slope[i]).toBeCloseTo(2 - 0.1 * x[i] + 0.003 * x[i] ** 2, 8);
  });
});
