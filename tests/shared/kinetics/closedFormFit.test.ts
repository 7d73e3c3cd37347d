import fc from "fast-check";
import { levenbergMarquardt as mlLevenbergMarquardt } from "ml-levenberg-marquardt";
import { describe, expect, it } from "vitest";
import {
  createVolumeModel,
  fitVolumes,
  initialConcentrationGas,
  levenbergMarquardt,
  predictVolume,
  residualsAt,
  selectFitPoints,
  shortOfFullGuard,
  volumeFitRules,
  type Trace,
} from "../../../shared/kinetics/index";
import { closedFormPass } from "../../../shared/kinetics/closedFormPasses";
import { refineClosedForm } from "../../../shared/kinetics/closedFormRefinement";
import { ClosedFormPassRunner } from "../../../shared/kinetics/closedFormPassRunner";
import { odexConversion } from "../../support/odexReference";

const V0 = 2;
const CA0 = initialConcentrationGas(0.7, 2e5, 523.15);
/** More points than the fit thins, so fitVolumes takes the fused route. */
const POINTS = 30_000;

/** k giving an initial rate dX/dt of r0 per second at this order. */
const kFor = (order: number, r0: number) => r0 / Math.pow(CA0, order - 1);
const scaleFor = (order: number, k: number) => k * Math.pow(CA0, order - 1);

/** Invented trace for the checks below: the model's volumes plus deterministic noise of about sigma L. */
function noisyTrace(order: number, epsilonA: number, k: number, duration: number, sigma: number, points = POINTS) {
  const t = new Float64Array(points);
  for (let i = 0; i < points; i++) t[i] = (i * duration) / (points - 1);
  const V = predictVolume({ order, k, epsilonA, V0, cA0: CA0 }, t);
  let seed = 20240611;
  const uniform = () => (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 4294967296;
  for (let i = 0; i < points; i++) V[i] += 2 * sigma * (uniform() + uniform() + uniform() - 1.5);
  return { t, V };
}

/**
 * The full Levenberg–Marquardt fit on the same usable points, started 0.1 % away and run to a
 * step of 1e−13·k so that its own stopping error stays well below the 1e−10 compared.
 */
function fullLevenbergMarquardt(trace: Trace, order: number, epsilonA: number, start: number) {
  const { t, V } = selectFitPoints(trace, volumeFitRules(V0, epsilonA));
  const model = createVolumeModel({ t, V, V0, epsilonA, cA0: CA0, order, fitOrder: false });
  const lm = levenbergMarquardt(model, { initial: [start * 1.001], lower: [0], stepTolerance: 1e-13 });
  return { lm, ...residualsAt(t, V, { order, k: lm.params[0], epsilonA, V0, cA0: CA0 }) };
}

/** Residuals at k over the usable points from the fused passes, chosen as the refinement chooses them. */
function passResiduals(trace: Trace, order: 0 | 1 | 2, epsilonA: number, k: number): Float64Array {
  const { t, V } = selectFitPoints(trace, volumeFitRules(V0, epsilonA));
  const residuals = new Float64Array(t.length);
  const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
  const passes = new ClosedFormPassRunner({ order, t, V, V0, epsilonA, cA0: CA0 });
  expect(passes.first(k, sums)).toBe(true);
  passes.withResiduals(k, residuals, sums);
  return residuals;
}

const relative = (a: number, b: number) => Math.abs(a / b - 1);
const CASES = ([0, 1, 2] as const).flatMap((order) => [-0.5, 0.3, 0.7, 2].map((epsilonA) => [order, epsilonA] as const));

describe("fused closed-form passes", () => {
  it.each(CASES)("order %i, εA = %f: model volumes match odex (independent ODE solver)", (order, epsilonA) => {
    // Reduced time up to 3.6, or 0.5 at zero order, which reaches full conversion soon after.
    const k = kFor(order, order === 0 ? 1.6e-4 : 1.2e-3);
    const t = Float64Array.from({ length: POINTS }, (_, i) => (i * 3000) / (POINTS - 1));
    const residuals = new Float64Array(POINTS);
    const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    // With V = 0 the residuals are minus the model volumes.
    closedFormPass({ order, t, V: new Float64Array(POINTS), V0, epsilonA, scale: scaleFor(order, k), kFactor: V0 * epsilonA * Math.pow(CA0, order - 1) }, residuals, sums);
    const sample = Array.from({ length: 150 }, (_, j) => Math.floor((j * (POINTS - 1)) / 149));
    const reference = odexConversion(order, scaleFor(order, k), epsilonA, sample.map((i) => t[i]));
    for (let j = 1; j < sample.length; j++) {
      const ours = (-residuals[sample[j]] - V0) / (epsilonA * V0);
      expect(Math.abs(ours - reference[j]) / reference[j]).toBeLessThan(1e-8);
    }
  });

  it.each(CASES)("order %i, εA = %f: residuals and sums equal the block kernels' at the same k", (order, epsilonA) => {
    const k = kFor(order, 6e-4);
    const trace = noisyTrace(order, epsilonA, k, 3600, 1e-3);
    const { t, V } = selectFitPoints(trace, { V0, epsilonA });
    const residuals = new Float64Array(t.length);
    const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    closedFormPass({ order, t, V, V0, epsilonA, scale: scaleFor(order, k), kFactor: V0 * epsilonA * Math.pow(CA0, order - 1) }, residuals, sums);
    const reference = residualsAt(t, V, { order, k, epsilonA, V0, cA0: CA0 });
    const jtj = new Float64Array(1);
    const jtr = new Float64Array(1);
    createVolumeModel({ t, V, V0, epsilonA, cA0: CA0, order, fitOrder: false }).accumulate(Float64Array.of(k), jtj, jtr);
    let largest = 0;
    for (let i = 0; i < t.length; i++) largest = Math.max(largest, Math.abs(residuals[i] - reference.residuals[i]));
    expect(largest).toBeLessThan(1e-12);
    expect(relative(sums.ssr, reference.ssr)).toBeLessThan(1e-10);
    expect(relative(sums.sst, reference.sst)).toBeLessThan(1e-10);
    expect(relative(sums.jtj, jtj[0])).toBeLessThan(1e-10);
    expect(Math.abs(sums.jtr - jtr[0])).toBeLessThan(1e-9 * Math.sqrt(sums.jtj * sums.ssr));
  });

  it.each([0, 1, 2] as const)("order %i: times out of order still give the block kernels' residuals", (order) => {
    const k = kFor(order, 6e-4);
    const sorted = noisyTrace(order, 0.7, k, 3600, 1e-3, 5000);
    // A fixed shuffle: every 7th point in turn, so consecutive times jump back and forth.
    const order7 = Array.from({ length: 5000 }, (_, i) => (i * 7) % 5000);
    const t = Float64Array.from(order7, (i) => sorted.t[i]);
    const V = Float64Array.from(order7, (i) => sorted.V[i]);
    const residuals = new Float64Array(t.length);
    const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    closedFormPass({ order, t, V, V0, epsilonA: 0.7, scale: scaleFor(order, k), kFactor: V0 * 0.7 * Math.pow(CA0, order - 1) }, residuals, sums);
    const reference = residualsAt(t, V, { order, k, epsilonA: 0.7, V0, cA0: CA0 });
    let largest = 0;
    for (let i = 0; i < t.length; i++) largest = Math.max(largest, Math.abs(residuals[i] - reference.residuals[i]));
    expect(largest).toBeLessThan(1e-12);
  });
});

describe("fitVolumes on many points (fused Gauss–Newton route)", () => {
  it.each(CASES)("order %i, εA = %f: same k as the full Levenberg–Marquardt to 1e−10 on noisy data", (order, epsilonA) => {
    const k = kFor(order, 6e-4);
    const trace = noisyTrace(order, epsilonA, k, order === 0 ? 900 : 3600, 1e-3);
    const fit = fitVolumes(trace, { order, V0, epsilonA, cA0: CA0 });
    const full = fullLevenbergMarquardt(trace, order, epsilonA, fit.k);
    expect(fit.converged).toBe(true);
    expect(full.lm.converged).toBe(true);
    // The residuals are exactly those of a fused pass at the reported k: the fast route was taken.
    expect(fit.residuals).toEqual(passResiduals(trace, order, epsilonA, fit.k));
    expect(relative(fit.k, full.lm.params[0])).toBeLessThan(1e-10);
    expect(relative(fit.residualRms, Math.sqrt(full.ssr / full.residuals.length))).toBeLessThan(1e-9);
    expect(relative(fit.r2, 1 - full.ssr / full.sst)).toBeLessThan(1e-9);
    const lmStdError = Math.sqrt((full.ssr / (full.residuals.length - 1)) * (full.lm.inverseNormalMatrix as Float64Array)[0]);
    expect(relative(fit.kStdError, lmStdError)).toBeLessThan(1e-6);
    expect(fit.residuals).toHaveLength(full.residuals.length);
  });

  it("agrees with ml-levenberg-marquardt (npm curve-fitting package) on a noisy first-order trace", () => {
    const epsilonA = 0.7;
    const k = 6e-4;
    const trace = noisyTrace(1, epsilonA, k, 3600, 1e-3);
    const fit = fitVolumes(trace, { order: 1, V0, epsilonA });
    const reference = mlLevenbergMarquardt(
      { x: trace.t, y: trace.V },
      ([kk]: number[]) => (t: number) => V0 * (1 + epsilonA * (1 - Math.exp(-kk * t))),
      {
        initialValues: [0.8 * k],
        jacobianFunction: ([kk]: number[]) => (t: number) => [V0 * epsilonA * t * Math.exp(-kk * t)],
        improvementThreshold: 1e-12,
        errorTolerance: 1e-15,
      },
    );
    expect(relative(fit.k, reference.parameterValues[0])).toBeLessThan(1e-8);
  });

  it("still fits when some points must be left out (the exact selection rules run)", () => {
    const trace = noisyTrace(1, 0.7, 6e-4, 3600, 1e-3);
    trace.V[100] = Number.NaN;
    trace.t[200] = -1;
    trace.V[POINTS - 1] = V0 * 1.8;
    const fit = fitVolumes(trace, { order: 1, V0, epsilonA: 0.7 });
    const full = fullLevenbergMarquardt(trace, 1, 0.7, fit.k);
    // The volume past full conversion is kept (with a warning); the unreadable and negative-time points are not.
    expect(fit.points).toBe(POINTS - 2);
    expect(fit.excludedPoints).toBe(2);
    expect(fit.warnings.join(" ")).toMatch(/read at or past full conversion/);
    expect(relative(fit.k, full.lm.params[0])).toBeLessThan(1e-10);
  });
});

describe("falling back to Levenberg–Marquardt", () => {
  const epsilonA = 0.7;
  const k = 6e-4;
  const t = Float64Array.from({ length: POINTS }, (_, i) => (i * 3600) / (POINTS - 1));

  it("gives up when a step raises the residual sum", () => {
    const V = predictVolume({ order: 1, k, epsilonA, V0 }, t);
    const result = refineClosedForm({ order: 1, t, V, V0, epsilonA }, 2 * k);
    expect(result.outcome).toBe("residual sum rose");
    if (result.outcome === "converged") return;
    // Both sums from the block kernels, not from the fused passes that took the step.
    const ssrAt = (kk: number) => residualsAt(t, V, { order: 1, k: kk, epsilonA, V0 }).ssr;
    expect(result.triedK).toBeGreaterThan(0);
    expect(ssrAt(result.triedK)).toBeGreaterThan(ssrAt(result.k));
  });

  it("gives up when a step would make k negative", () => {
    const V = predictVolume({ order: 1, k, epsilonA, V0 }, t);
    const result = refineClosedForm({ order: 1, t, V, V0, epsilonA }, 10 * k);
    expect(result.outcome).toBe("k would not stay positive");
    if (result.outcome !== "converged") expect(result.triedK).toBeLessThanOrEqual(0);
  });

  it("converges from a close start and reports no step when the start already is the solution", () => {
    const V = predictVolume({ order: 1, k, epsilonA, V0 }, t);
    const close = refineClosedForm({ order: 1, t, V, V0, epsilonA }, k * (1 + 1e-6));
    const exact = refineClosedForm({ order: 1, t, V, V0, epsilonA }, k);
    expect(close.outcome).toBe("converged");
    expect(exact.outcome).toBe("converged");
    if (close.outcome === "converged") expect(relative(close.k, k)).toBeLessThan(1e-12);
    if (exact.outcome === "converged") {
      expect(exact.steps).toBe(0);
      expect(exact.k).toBe(k);
      expect(exact.ssr).toBeLessThan(1e-20);
    }
  });

  it("fitVolumes still reaches the least-squares k when the thinned start is poor", () => {
    // Every 7th point (the thinning stride here) reads 40 % short of the true rise, so the thinned
    // fit starts far off and the fused route gives up.
    const V = predictVolume({ order: 1, k, epsilonA, V0 }, t);
    for (let i = 0; i < POINTS; i += 7) V[i] = V0 + 0.6 * (V[i] - V0);
    const fit = fitVolumes({ t, V }, { order: 1, V0, epsilonA });
    const reference = fullLevenbergMarquardt({ t, V }, 1, epsilonA, k);
    expect(fit.converged).toBe(true);
    expect(relative(fit.k, reference.lm.params[0])).toBeLessThan(1e-9);
  });
});

describe("quick selection scan", () => {
  // Common practice: a shortcut must give exactly what the full rules give. Plain arrays skip
  // the shortcut, so they serve as the reference.
  const value = fc.oneof(
    { weight: 8, arbitrary: fc.double({ min: 1.9, max: 3.5, noNaN: true }) },
    { weight: 1, arbitrary: fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 2, 3.4, 3.4 - 1e-15, 3.4 + 1e-15, 2.6, 2.6 - 1e-15, 2.6 + 1e-15) },
  );
  it("keeps and drops exactly the points the full rules keep and drop (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.oneof(fc.double({ min: 0, max: 1e4, noNaN: true }), fc.constantFrom(-1, Number.NaN, Number.POSITIVE_INFINITY)), value), { minLength: 1, maxLength: 60 }),
        fc.constantFrom(undefined, 0.5, 0.99, 1.5),
        fc.constantFrom(0.7, -0.3),
        fc.boolean(),
        (pairs, maxConversion, epsilonA, keepPastFull) => {
          const t = pairs.map(([ti]) => ti);
          const V = pairs.map(([, v]) => (epsilonA > 0 ? v : 4 - v));
          const rules = { V0, epsilonA, maxConversion, keepPastFull };
          const quick = selectFitPoints({ t: Float64Array.from(t), V: Float64Array.from(V) }, rules);
          const exact = selectFitPoints({ t, V }, rules);
          expect(Array.from(quick.t)).toEqual(Array.from(exact.t));
          expect(Array.from(quick.V)).toEqual(Array.from(exact.V));
          expect(quick.excluded).toBe(exact.excluded);
          expect(quick.warnings).toEqual(exact.warnings);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("the guard short of full conversion", () => {
  const pastByRule = (v: number, V0: number, epsilonA: number) => (v - V0) / (epsilonA * V0) >= 1;
  const admits = (guard: { lowV: number; highV: number }, v: number) => v > guard.lowV && v < guard.highV;
  const ulpsFrom = (x: number, steps: number) => {
    const f = new Float64Array([x]);
    const b = new BigInt64Array(f.buffer);
    b[0] += BigInt(x >= 0 ? steps : -steps);
    return f[0];
  };

  it("admits exactly the volumes the exact rule reads short of full conversion, at and beside its edge (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        fc.oneof(fc.double({ min: -0.999, max: 5, noNaN: true }), fc.constantFrom(0, -0, 1e-12, -1e-12, 0.7, -0.5)),
        fc.integer({ min: -8, max: 8 }),
        (V0, epsilonA, steps) => {
          const guard = shortOfFullGuard({ V0, epsilonA });
          expect(guard).toBeDefined();
          if (guard === undefined) return;
          const edge = Number.isFinite(guard.highV) ? guard.highV : guard.lowV;
          for (const v of [ulpsFrom(edge, steps), V0, V0 * (1 + epsilonA), -V0, 10 * V0]) {
            expect(admits(guard, v)).toBe(!pastByRule(v, V0, epsilonA));
          }
        },
      ),
      { numRuns: 500 },
    );
  });

  it("a point past full conversion that the thinned copy and the last points miss is still counted, with k as the selection route gives", () => {
    const epsilonA = 0.7;
    const trace = noisyTrace(1, epsilonA, 6e-4, 3600, 1e-3, 100_000);
    // One spike past full conversion early on, off every thinned index and far from the end.
    trace.V[12_345] = V0 * (1 + epsilonA) + 0.01;
    const fit = fitVolumes(trace, { order: 1, V0, epsilonA });
    expect(fit.warnings.join(" ")).toMatch(/^1 point\(s\) read at or past full conversion/);
    const viaSelection = fitVolumes({ t: Array.from(trace.t), V: Array.from(trace.V) }, { order: 1, V0, epsilonA });
    expect(relative(fit.k, viaSelection.k)).toBeLessThan(1e-10);
    expect(fit.points).toBe(100_000);
  });
});
