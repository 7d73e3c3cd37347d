import { describe, expect, it } from "vitest";
import { GAS_CONSTANT, KineticsInputError, arrheniusRateConstant, fitArrhenius } from "../../../shared/kinetics/index";

describe("Arrhenius", () => {
  it("uses R = 8.314462618 J/(mol·K) (CODATA 2018, exact)", () => {
    expect(GAS_CONSTANT).toBe(8.314462618);
  });

  it("k doubles between 25 °C and 35 °C for Ea ≈ 52.9 kJ/mol (common practice; figure from memory)", () => {
    const fit = fitArrhenius([{ T: 298.15, k: 1 }, { T: 308.15, k: 2 }], 298.15);
    expect(fit.Ea / 1000).toBeCloseTo(52.9, 1);
    expect(fit.kRef).toBeCloseTo(1, 12);
    expect(fit.warnings.join(" ")).toMatch(/only two temperatures/);
  });

  it("k(T) equals kRef at TRef and follows exp(−Ea/R·(1/T − 1/TRef))", () => {
    const parameters = { kRef: 8e-4, TRef: 523.15, Ea: 120e3 };
    expect(arrheniusRateConstant(parameters, 523.15)).toBe(8e-4);
    expect(arrheniusRateConstant(parameters, 533.15)).toBeCloseTo(8e-4 * Math.exp((-120e3 / 8.314462618) * (1 / 533.15 - 1 / 523.15)), 15);
  });

  it("fits kRef and Ea with intervals, and weights by each k's standard error", () => {
    const truth = { kRef: 8e-4, TRef: 523.15, Ea: 120e3 };
    const temps = [503.15, 513.15, 523.15, 533.15, 543.15];
    const scatter = [1.02, 0.97, 1.01, 0.99, 1.03];
    const points = temps.map((T, i) => ({ T, k: arrheniusRateConstant(truth, T) * scatter[i], kStdError: arrheniusRateConstant(truth, T) * 0.02 * (i === 4 ? 10 : 1) }));
    const plain = fitArrhenius(points, 523.15);
    const weighted = fitArrhenius(points, 523.15, true);
    expect(plain.EaCI95[0]).toBeLessThan(truth.Ea);
    expect(plain.EaCI95[1]).toBeGreaterThan(truth.Ea);
    expect(plain.kRefCI95[0]).toBeLessThan(plain.kRef);
    expect(weighted.weighted).toBe(true);
    // Down-weighting the noisy last point moves Ea towards the other four.
    const firstFour = fitArrhenius(points.slice(0, 4), 523.15);
    expect(Math.abs(weighted.Ea - firstFour.Ea)).toBeLessThan(Math.abs(plain.Ea - firstFour.Ea));
  });

  it("recovers exact parameters from exact data", () => {
    const truth = { kRef: 3.2e-3, TRef: 500, Ea: 85e3 };
    const fit = fitArrhenius([480, 500, 520, 540].map((T) => ({ T, k: arrheniusRateConstant(truth, T) })), 500);
    expect(fit.Ea).toBeCloseTo(85e3, 6);
    expect(fit.kRef / 3.2e-3).toBeCloseTo(1, 12);
  });

  it("names the bad field", () => {
    try {
      fitArrhenius([{ T: 500, k: 1 }, { T: -3, k: 2 }], 500);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(KineticsInputError);
      expect((error as KineticsInputError).field).toBe("points[1].T");
    }
  });
});
