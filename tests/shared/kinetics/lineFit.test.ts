import { describe, expect, it } from "vitest";
import { fitLine, fitLineThroughOrigin } from "../../../shared/kinetics/index";

function expectDigits(actual: number, certified: number, digits: number): void {
  expect(Math.abs(actual - certified) / Math.abs(certified)).toBeLessThan(0.5 * 10 ** -digits);
}

describe("straight line through the origin", () => {
  it("reproduces NIST StRD NoInt1 to 12 digits", () => {
    // NIST Statistical Reference Datasets, linear regression, NoInt1 (certified values).
    const x = Array.from({ length: 11 }, (_, i) => 60 + i);
    const y = x.map((v) => v + 70);
    const fit = fitLineThroughOrigin(x, y);
    expectDigits(fit.slope, 2.07438016528926, 12);
    expectDigits(fit.slopeStdError, 0.0165289256198347, 12);
    expectDigits(fit.residualStdDev, 3.56753034006338, 12);
    // NoInt1 certified R² 0.999365492298663 (uncentred, as for a no-intercept model; from memory).
    expectDigits(fit.r2, 0.999365492298663, 12);
  });
});

describe("straight line with intercept", () => {
  it("reproduces Anscombe's data set I (Anscombe 1973, The American Statistician 27(1); from memory)", () => {
    const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
    const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
    const fit = fitLine(x, y);
    expect(fit.intercept).toBeCloseTo(3.0001, 4);
    expect(fit.slope).toBeCloseTo(0.5001, 4);
    expect(fit.r2).toBeCloseTo(0.6665, 4);
    expect(fit.slopeStdError).toBeCloseTo(0.1179, 4);
    expect(fit.interceptStdError).toBeCloseTo(1.1247, 4);
  });

  it("gives intervals from the t quantile with n − 2 degrees of freedom", () => {
    const x = [1, 2, 3, 4, 5, 6];
    const y = [2.1, 3.9, 6.2, 7.8, 10.1, 12.2];
    const fit = fitLine(x, y);
    // t(0.975, 4) = 2.776 (NIST/SEMATECH e-Handbook 1.3.6.7.2; from memory).
    expect((fit.slopeCI95[1] - fit.slope) / fit.slopeStdError).toBeCloseTo(2.776, 3);
  });
});
