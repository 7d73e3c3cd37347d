import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  KineticsInputError,
  fitIntegral,
  fitLinearised,
  fitVolumes,
  initialConcentrationGas,
  predictVolume,
  rateConstantUnit,
} from "../../../shared/kinetics/index";

const V0 = 2;
const CA0 = initialConcentrationGas(0.7, 2e5, 523.15);

/** Noise-free synthetic trace: invented data, checked against the model that made it. */
function syntheticTrace(order: number, k: number, epsilonA: number, points: number, duration: number) {
  const t = new Float64Array(points);
  for (let i = 0; i < points; i++) t[i] = (i * duration) / (points - 1);
  return { t, V: predictVolume({ order, k, epsilonA, V0, cA0: CA0 }, t) };
}

/** k giving an initial rate dX/dt of r0 per second at this order. */
const kFor = (order: number, r0: number) => r0 / Math.pow(CA0, order - 1);

describe("nonlinear fit on volumes", () => {
  it("gives back k within 1e−6 relative from noise-free traces for every order (property)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(0, 0.5, 1, 1.5, 2, 0.8, 2.7),
        fc.double({ min: 2e-4, max: 2e-3, noNaN: true }),
        fc.constantFrom(-0.5, 0.3, 0.7, 2),
        fc.integer({ min: 12, max: 400 }),
        (order, r0, epsilonA, points) => {
          const k = kFor(order, r0);
          const trace = syntheticTrace(order, k, epsilonA, points, 1500);
          const fit = fitVolumes(trace, { order, V0, epsilonA, cA0: CA0 });
          expect(fit.converged).toBe(true);
          expect(Math.abs(fit.k / k - 1)).toBeLessThan(1e-6);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("starts from a k slow enough to matter when its first guess puts every point past full conversion", () => {
    // Found by the property above: zero order, εA = 2, 12 points of which 3 are short of full
    // conversion (the other 9 at it, kept: the model is flat there).
    const k = kFor(0, 0.0016087795461018524);
    const fit = fitVolumes(syntheticTrace(0, k, 2, 12, 1500), { order: 0, V0, epsilonA: 2, cA0: CA0 });
    expect(fit.points).toBe(12);
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.k / k - 1)).toBeLessThan(1e-6);
  });

  it("fits k and n together on a noise-free order-1.3 trace", () => {
    const k = kFor(1.3, 8e-4);
    const fit = fitVolumes(syntheticTrace(1.3, k, 0.7, 300, 3000), { order: 1, fitOrder: true, V0, epsilonA: 0.7, cA0: CA0 });
    expect(fit.order).toBeCloseTo(1.3, 6);
    expect(Math.abs(fit.k / k - 1)).toBeLessThan(1e-6);
    expect(fit.kUnit).toBe("(mol/L)^(-0.3)/s");
  });

  it("reports standard error and a t-based interval that cover the true k under noise", () => {
    const k = 8e-4;
    const trace = syntheticTrace(1, k, 0.7, 500, 3600);
    // Deterministic pseudo-noise of about 1 mL.
    for (let i = 0; i < trace.V.length; i++) trace.V[i] += 1e-3 * (((i * 7919) % 101) / 50 - 1);
    const fit = fitVolumes(trace, { order: 1, V0, epsilonA: 0.7 });
    expect(fit.kStdError).toBeGreaterThan(0);
    expect(fit.kCI95[0]).toBeLessThan(k);
    expect(fit.kCI95[1]).toBeGreaterThan(k);
    expect(fit.residualRms).toBeGreaterThan(1e-4);
    expect(fit.residualRms).toBeLessThan(1e-3);
    expect(fit.residuals).toHaveLength(500);
  });

  it("keeps points read past full conversion, with a warning", () => {
    const trace = syntheticTrace(1, 1e-3, 0.7, 100, 3000);
    trace.V[99] = V0 * 1.8;
    const fit = fitVolumes(trace, { order: 1, V0, epsilonA: 0.7 });
    expect(fit.points).toBe(100);
    expect(fit.excludedPoints).toBe(0);
    expect(fit.warnings.join(" ")).toMatch(/1 point\(s\) read at or past full conversion/);
  });

  it("keeps the noise that lifts volumes past full conversion, so k is not biased low", () => {
    // Common practice: least squares is unbiased only over every point; dropping the volumes that
    // noise lifts past V0(1 + εA), and not those it lowers, truncates the noise and pulls k down.
    // First order, εA = 0.01 (so the plateau is only 20 mL above V0), 20 000 points to XA = 0.9,
    // noise of 2 mL from a seeded generator: about 2.5 % of the points read past full conversion.
    const k = 2e-3;
    const epsilonA = 0.01;
    const n = 20_000;
    const tEnd = -Math.log(1 - 0.9) / k;
    const trace = syntheticTrace(1, k, epsilonA, n, tEnd);
    let seed = 42;
    const uniform = () => (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 4294967296;
    for (let i = 0; i < n; i++) trace.V[i] += 2e-3 * Math.sqrt(-2 * Math.log(uniform() || 1e-300)) * Math.cos(2 * Math.PI * uniform());
    const fit = fitVolumes(trace, { order: 1, V0, epsilonA });
    expect(fit.warnings.join(" ")).toMatch(/read at or past full conversion/);
    expect(fit.points).toBe(n);
    // Within three standard errors of the true k (dropping those points put it about 6 away).
    expect(Math.abs(fit.k - k)).toBeLessThan(3 * fit.kStdError);
    expect(fit.kCI95[0]).toBeLessThan(k);
    expect(fit.kCI95[1]).toBeGreaterThan(k);
  });

  it("warns about too few points", () => {
    const fit = fitVolumes({ t: [0, 10], V: [2, 2.01] }, { order: 1, V0, epsilonA: 0.7 });
    expect(fit.warnings.join(" ")).toMatch(/too few points/);
  });

  it("refuses εA = 0 and a missing cA0 with a typed error", () => {
    const trace = syntheticTrace(1, 1e-3, 0.7, 20, 1000);
    expect(() => fitVolumes(trace, { order: 1, V0, epsilonA: 0 })).toThrow(KineticsInputError);
    expect(() => fitVolumes(trace, { order: 2, V0, epsilonA: 0.7 })).toThrow(/cA0/);
  });
});

describe("linearised integral fits", () => {
  it.each([0, 1, 2, 1.5])("order %f gives back k from a noise-free trace", (order) => {
    const k = kFor(order, 6e-4);
    const fit = fitLinearised(syntheticTrace(order, k, 0.7, 200, 2500), { order, V0, epsilonA: 0.7, cA0: CA0 });
    expect(Math.abs(fit.k / k - 1)).toBeLessThan(1e-8);
    expect(fit.method).toBe("linearised");
  });

  it("leaves out conversions above 0.99 with a warning", () => {
    const fit = fitLinearised(syntheticTrace(1, 3e-3, 0.7, 200, 3000), { order: 1, V0, epsilonA: 0.7 });
    expect(fit.warnings.join(" ")).toMatch(/conversion above 0.99 excluded/);
  });

  it("reports too few points, not a missing cA0, when fewer than two conversions are below the cap", () => {
    // Three of the four volumes read above 0.99 conversion (V0 40 L, εA 0.7: full at 68 L).
    for (const trace of [{ t: [0, 300, 600, 900], V: [40, 67.9, 68, 68.1] }, { t: [0], V: [40] }]) {
      const fit = fitLinearised(trace, { order: 1, V0: 40, epsilonA: 0.7, cA0: 0.0322 });
      expect(fit.converged).toBe(false);
      expect(fit.warnings.join(" ")).toMatch(/too few points/);
    }
  });

  it("does not call a falling line converged when the volumes move against the sign of εA", () => {
    const fit = fitLinearised({ t: [0, 300, 600, 900], V: [39, 38, 37, 36] }, { order: 1, V0: 40, epsilonA: 0.7 });
    expect(fit.k).toBeLessThan(0);
    expect(fit.converged).toBe(false);
    expect(fit.warnings.join(" ")).toMatch(/no positive k/);
  });
});

describe("order auto", () => {
  it.each([0, 1, 1.5, 2])("picks order %f for a noise-free trace of that order and lists every order tried", (order) => {
    const fit = fitIntegral(syntheticTrace(order, kFor(order, 5e-4), 0.7, 300, 3000), { order: "auto", V0, epsilonA: 0.7, cA0: CA0 });
    expect(fit.order).toBeCloseTo(order, 4);
    expect(fit.orderTrials?.map((trial) => trial.label)).toEqual(["n = 0", "n = 0.5", "n = 1", "n = 1.5", "n = 2", expect.stringMatching(/^free n = /)]);
  });

  it.each([
    [0, 2e-4, 1000],
    [1.5, 5e-4, 3000],
  ])("on a short noise-free trace of order %f, names that order, not a free n a rounding error away", (order, r0, duration) => {
    // Twelve clean points: every fit's residuals are rounding, so no RMS ratio can choose.
    const fit = fitIntegral(syntheticTrace(order, kFor(order, r0), 0.7, 12, duration), { order: "auto", V0, epsilonA: 0.7, cA0: CA0 });
    expect(fit.orderFitted).toBe(false);
    expect(fit.order).toBe(order);
    expect(fit.kUnit).toBe(rateConstantUnit(order));
  });

  it("prefers the integer order when its residual RMS is within 5 % of the best", () => {
    const trace = syntheticTrace(1, 8e-4, 0.7, 400, 3600);
    for (let i = 0; i < trace.V.length; i++) trace.V[i] += 2e-3 * Math.sin(i * 12.9898);
    const fit = fitIntegral(trace, { order: "auto", V0, epsilonA: 0.7, cA0: CA0 });
    const best = Math.min(...(fit.orderTrials ?? []).map((trial) => trial.residualRms));
    expect(fit.order).toBe(1);
    expect(fit.orderFitted).toBe(false);
    expect(fit.residualRms).toBeLessThanOrEqual(1.05 * best);
  });
});

describe("k units", () => {
  it("names the unit for each order", () => {
    expect(rateConstantUnit(0)).toBe("mol/(L·s)");
    expect(rateConstantUnit(1)).toBe("1/s");
    expect(rateConstantUnit(2)).toBe("L/(mol·s)");
    expect(rateConstantUnit(1.5)).toBe("(mol/L)^(-0.5)/s");
  });
});
