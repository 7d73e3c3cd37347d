import { describe, expect, it } from "vitest";
import { regularizedIncompleteBeta, studentTCdf, studentTQuantile } from "../../../shared/kinetics/index";

describe("Student t quantiles", () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.2 "Critical Values of the
  // Student's t Distribution" (three decimals; from memory).
  const table: [number, number, number][] = [
    [0.975, 1, 12.706], [0.975, 2, 4.303], [0.975, 3, 3.182], [0.975, 5, 2.571], [0.975, 10, 2.228],
    [0.975, 20, 2.086], [0.975, 30, 2.042], [0.975, 100, 1.984], [0.95, 10, 1.812], [0.99, 10, 2.764],
    [0.995, 10, 3.169], [0.995, 1, 63.657], [0.9, 5, 1.476],
  ];
  it.each(table)("t(%f, %i) = %f", (p, dof, expected) => {
    expect(studentTQuantile(p, dof)).toBeCloseTo(expected, 3);
  });

  it("is symmetric and tends to the normal quantile 1.959964 (NIST/SEMATECH table, ∞ row; from memory)", () => {
    expect(studentTQuantile(0.025, 7)).toBeCloseTo(-studentTQuantile(0.975, 7), 12);
    expect(studentTQuantile(0.975, 1e8)).toBeCloseTo(1.959964, 5);
  });

  it("inverts its own CDF", () => {
    for (const dof of [1, 2.5, 9, 44]) {
      for (const p of [0.6, 0.9, 0.999]) expect(studentTCdf(studentTQuantile(p, dof), dof)).toBeCloseTo(p, 12);
    }
  });

  it("t with 1 degree of freedom is the Cauchy law: CDF(t) = 1/2 + atan(t)/π (common practice)", () => {
    for (const t of [-3, 0.2, 1, 7]) expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 13);
  });
});

describe("regularised incomplete beta", () => {
  it("meets closed forms: I_x(1, 1) = x, I_x(a, 1) = x^a, I_½(a, a) = ½ (common practice)", () => {
    expect(regularizedIncompleteBeta(0.3, 1, 1)).toBeCloseTo(0.3, 14);
    expect(regularizedIncompleteBeta(0.3, 2.5, 1)).toBeCloseTo(Math.pow(0.3, 2.5), 14);
    expect(regularizedIncompleteBeta(0.5, 7.3, 7.3)).toBeCloseTo(0.5, 14);
    expect(regularizedIncompleteBeta(0.2, 1, 3)).toBeCloseTo(1 - Math.pow(0.8, 3), 14);
  });
});
