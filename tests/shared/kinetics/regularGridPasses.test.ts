import { describe, expect, it } from "vitest";
import { fitVolumes, initialConcentrationGas, predictVolume, selectFitPoints } from "../../../shared/kinetics/index";
import { closedFormPass } from "../../../shared/kinetics/closedFormPasses";
import { OPEN_GUARD } from "../../../shared/kinetics/passBasics";
import { likelyGrid } from "../../../shared/kinetics/regularGrid";
import { gridPass } from "../../../shared/kinetics/regularGridPasses";
import { SelectionBuffers } from "../../../shared/kinetics/selectionBuffers";
import { ClosedFormPassRunner } from "../../../shared/kinetics/closedFormPassRunner";
import { odexConversion } from "../../support/odexReference";

const V0 = 2;
const CA0 = initialConcentrationGas(0.7, 2e5, 523.15);
const POINTS = 30_000;
const scaleFor = (order: number, k: number) => k * Math.pow(CA0, order - 1);
const setupFor = (order: 0 | 1 | 2, t: Float64Array, V: Float64Array, epsilonA: number, k: number) => ({
  order, t, V, V0, epsilonA, scale: scaleFor(order, k), kFactor: V0 * epsilonA * Math.pow(CA0, order - 1),
});
const evenTimes = (points: number, duration: number) => Float64Array.from({ length: points }, (_, i) => (i * duration) / (points - 1));

/** Invented trace: the model's volumes plus deterministic noise of about sigma L. */
function noisyVolumes(order: number, epsilonA: number, k: number, t: Float64Array, sigma: number): Float64Array {
  const V = predictVolume({ order, k, epsilonA, V0, cA0: CA0 }, t);
  let seed = 7;
  const uniform = () => (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 4294967296;
  for (let i = 0; i < V.length; i++) V[i] += 2 * sigma * (uniform() + uniform() + uniform() - 1.5);
  return V;
}

const CASES = ([0, 1, 2] as const).flatMap((order) => [-0.5, 0.3, 0.7, 2].map((epsilonA) => [order, epsilonA] as const));

describe("passes on a regular time grid", () => {
  it.each(CASES)("order %i, εA = %f: model volumes match odex (independent ODE solver)", (order, epsilonA) => {
    const k = order === 0 ? 1.6e-4 * CA0 : 1.2e-3 / Math.pow(CA0, order - 1);
    const t = evenTimes(POINTS, 3000);
    const V = new Float64Array(POINTS);
    const grid = likelyGrid(t, scaleFor(order, k));
    expect(grid).toBeDefined();
    const residuals = new Float64Array(POINTS);
    const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    // With V = 0 the residuals are minus the model volumes.
    gridPass(setupFor(order, t, V, epsilonA, k), grid!, residuals, sums, OPEN_GUARD);
    const sample = Array.from({ length: 150 }, (_, j) => Math.floor((j * (POINTS - 1)) / 149));
    const reference = odexConversion(order, 1, epsilonA, sample.map((i) => scaleFor(order, k) * t[i]));
    for (let j = 1; j < sample.length; j++) {
      const ours = (-residuals[sample[j]] - V0) / (epsilonA * V0);
      expect(Math.abs(ours - reference[j]) / reference[j]).toBeLessThan(1e-8);
    }
  });

  /** The checked and residual grid passes and the general pass at one k, on a noisy trace. */
  function gridAndGeneral(order: 0 | 1 | 2, epsilonA: number, k: number, duration: number) {
    const t = evenTimes(POINTS, duration);
    const V = noisyVolumes(order, epsilonA, k, t, 1e-3);
    const setup = setupFor(order, t, V, epsilonA, k);
    const grid = likelyGrid(t, setup.scale)!;
    const checked = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    const gridSums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    const plainSums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    const outcome = gridPass(setup, grid, null, checked, OPEN_GUARD);
    const onGrid = new Float64Array(POINTS);
    const general = new Float64Array(POINTS);
    gridPass(setup, grid, onGrid, gridSums, OPEN_GUARD);
    closedFormPass(setup, general, plainSums);
    let largest = 0;
    for (let i = 0; i < POINTS; i++) largest = Math.max(largest, Math.abs(onGrid[i] - general[i]));
    return { V, outcome, checked, gridSums, plainSums, onGrid, largest };
  }
  const relative = (a: number, b: number) => Math.abs(a / b - 1);

  it.each(CASES)("order %i, εA = %f: residuals and sums equal the general pass's at the same k", (order, epsilonA) => {
    const k = order === 0 ? 6e-4 * CA0 : 6e-4 / Math.pow(CA0, order - 1);
    const { outcome, checked, gridSums, plainSums, largest } = gridAndGeneral(order, epsilonA, k, order === 0 ? 900 : 3600);
    expect(outcome).toBe("complete");
    // Common practice: both carry an exponential by products; they differ only by rounding.
    expect(largest).toBeLessThan(1e-13);
    expect(relative(gridSums.ssr, plainSums.ssr)).toBeLessThan(1e-10);
    expect(relative(gridSums.sst, plainSums.sst)).toBeLessThan(1e-12);
    expect(relative(gridSums.jtj, plainSums.jtj)).toBeLessThan(1e-10);
    const scaleOfJtr = 1e-9 * Math.sqrt(plainSums.jtj * plainSums.ssr);
    expect(Math.abs(gridSums.jtr - plainSums.jtr)).toBeLessThan(scaleOfJtr);
    expect(Math.abs(checked.jtr - plainSums.jtr)).toBeLessThan(scaleOfJtr);
  });

  it.each([-0.5, 0.3, 2])("order 0, εA = %f, past full conversion part way: residuals and sums equal the general pass's", (epsilonA) => {
    // Reduced time up to 2.2, beyond ln(1 + εA)/εA for each εA here: the last blocks are flat.
    const { V, outcome, checked, gridSums, plainSums, onGrid, largest } = gridAndGeneral(0, epsilonA, 1.2e-3 * CA0, 1800);
    expect(outcome).toBe("complete");
    // Common practice: the same model by two evaluations differs only by rounding.
    expect(largest).toBeLessThan(1e-13);
    // The flat part is there: the model stands at V0(1 + εA) at the end.
    expect(Math.abs(V[POINTS - 1] - onGrid[POINTS - 1] - V0 * (1 + epsilonA))).toBeLessThan(1e-12);
    for (const ssr of [gridSums.ssr, checked.ssr]) expect(relative(ssr, plainSums.ssr)).toBeLessThan(1e-10);
    for (const jtj of [gridSums.jtj, checked.jtj]) expect(relative(jtj, plainSums.jtj)).toBeLessThan(1e-10);
  });

  it.each([0, 1, 2] as const)("order %i: the checked pass stops at a point off the grid or outside the guard, and says which", (order) => {
    const k = 6e-4 / Math.pow(CA0, order - 1);
    const t = evenTimes(POINTS, 3600);
    const V = noisyVolumes(order, 0.7, k, t, 1e-3);
    const grid = likelyGrid(t, scaleFor(order, k))!;
    const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    const moved = Float64Array.from(t);
    moved[12_345] += 1e-6;
    expect(gridPass(setupFor(order, moved, V, 0.7, k), grid, null, sums, OPEN_GUARD)).toBe("off grid");
    // The guard's upper limit at a volume the trace passes part way.
    const limit = V[20_000];
    expect(gridPass(setupFor(order, t, V, 0.7, k), grid, null, sums, { lowV: -Infinity, highV: limit })).toBe("outside guard");
    expect(gridPass(setupFor(order, t, V, 0.7, k), grid, null, sums, OPEN_GUARD)).toBe("complete");
  });

  it("the checked pass judges the times by the grid: a missing time is off the grid, a negative start outside the guard", () => {
    const k = 6e-4;
    const t = evenTimes(POINTS, 3600);
    const V = noisyVolumes(1, 0.7, k, t, 1e-3);
    const grid = likelyGrid(t, k)!;
    const sums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };
    const holed = Float64Array.from(t);
    holed[777] = Number.NaN;
    expect(gridPass(setupFor(1, holed, V, 0.7, k), grid, null, sums, OPEN_GUARD)).toBe("off grid");
    const early = Float64Array.from(t, (ti) => ti - 5);
    expect(gridPass(setupFor(1, early, V, 0.7, k), likelyGrid(early, k)!, null, sums, OPEN_GUARD)).toBe("outside guard");
  });

  it("does not take times with jitter for a grid", () => {
    const t = evenTimes(POINTS, 3600);
    for (let i = 1; i < POINTS - 1; i++) t[i] += 0.01 * Math.sin(i);
    expect(likelyGrid(t, 6e-4)).toBeUndefined();
  });
});

describe("predicted volumes on many points (regular grid, then carried)", () => {
  it.each(CASES)("order %i, εA = %f: equal the general kernels' (plain-array times) and follow odex", (order, epsilonA) => {
    // Reduced time up to 3.6, or 0.48 at zero order, which reaches full conversion soon after.
    const k = order === 0 ? 1.6e-4 * CA0 : 1.2e-3;
    const t = evenTimes(POINTS, 3000);
    // One time moved off the grid part way: the points from there on carry the exponential along.
    const moved = Float64Array.from(t);
    moved[20_000] += 1e-3;
    // Irregular times throughout, with a step back and a gap beyond the short series' reach.
    const irregular = Float64Array.from(t, (ti, i) => ti + 0.03 * Math.sin(i * 0.9));
    irregular[12_000] = irregular[11_990];
    for (let i = 25_000; i < POINTS; i++) irregular[i] += 200;
    const model = { order, k, epsilonA, V0, cA0: CA0 };
    for (const times of [t, moved, irregular]) {
      const onGrid = predictVolume(model, times);
      const general = predictVolume(model, Array.from(times));
      let largest = 0;
      for (let i = 0; i < POINTS; i++) largest = Math.max(largest, Math.abs(onGrid[i] - general[i]));
      // Common practice: the same model by two evaluations differs only by rounding.
      expect(largest).toBeLessThan(1e-13);
    }
    const sample = Array.from({ length: 120 }, (_, j) => Math.floor((j * (POINTS - 1)) / 119));
    const reference = odexConversion(order, scaleFor(order, k), epsilonA, sample.map((i) => t[i]));
    const volumes = predictVolume(model, t);
    for (let j = 1; j < sample.length; j++) {
      const X = (volumes[sample[j]] - V0) / (epsilonA * V0);
      expect(Math.abs(X - reference[j]) / reference[j]).toBeLessThan(1e-8);
    }
  });
});

describe("fitVolumes on many points takes the same k by every route", () => {
  // Float64Array traces take the route that proves the points in its first pass (on the grid
  // where the times allow); plain arrays take the exact selection first. Both must agree.
  const k = 6e-4;
  const relative = (a: number, b: number) => Math.abs(a / b - 1);
  const plainCopy = (x: Float64Array) => Array.from(x);

  it.each([0, 1, 2] as const)("order %i on a regular grid", (order) => {
    const kk = k / Math.pow(CA0, order - 1);
    const t = evenTimes(POINTS, order === 0 ? 900 : 3600);
    const V = noisyVolumes(order, 0.7, kk, t, 1e-3);
    const fast = fitVolumes({ t, V }, { order, V0, epsilonA: 0.7, cA0: CA0 });
    const exact = fitVolumes({ t: plainCopy(t), V: plainCopy(V) }, { order, V0, epsilonA: 0.7, cA0: CA0 });
    expect(relative(fast.k, exact.k)).toBeLessThan(1e-10);
    expect(relative(fast.residualRms, exact.residualRms)).toBeLessThan(1e-9);
    expect(fast.points).toBe(POINTS);
  });

  it("with one point off the grid late in the trace", () => {
    const t = evenTimes(POINTS, 3600);
    t[POINTS - 10] += 0.05;
    const V = noisyVolumes(1, 0.7, k, t, 1e-3);
    const fast = fitVolumes({ t, V }, { order: 1, V0, epsilonA: 0.7 });
    const exact = fitVolumes({ t: plainCopy(t), V: plainCopy(V) }, { order: 1, V0, epsilonA: 0.7 });
    expect(relative(fast.k, exact.k)).toBeLessThan(1e-10);
  });

  it("counts the volumes read past full conversion alike on the quick route and the exact one", () => {
    // Zero order runs onto its plateau a third of the way in; noise puts about half the plateau
    // past full conversion. Plain arrays take the exact rules, point by point.
    const t = evenTimes(POINTS, 3 * 3600);
    const V = noisyVolumes(0, 0.7, k * CA0, t, 1e-3);
    const fast = fitVolumes({ t, V }, { order: 0, V0, epsilonA: 0.7, cA0: CA0 });
    const exact = fitVolumes({ t: plainCopy(t), V: plainCopy(V) }, { order: 0, V0, epsilonA: 0.7, cA0: CA0 });
    expect(fast.warnings.join(" ")).toMatch(/read at or past full conversion/);
    expect(fast.warnings).toEqual(exact.warnings);
    expect(fast.points).toBe(POINTS);
    expect(relative(fast.k, exact.k)).toBeLessThan(1e-10);
  });

  it.each([0, 1, 2] as const)("order %i with irregular times and a few unusable points", (order) => {
    const kk = k / Math.pow(CA0, order - 1);
    const t = evenTimes(POINTS, order === 0 ? 900 : 3600);
    for (let i = 1; i < POINTS - 1; i++) t[i] += 0.02 * Math.sin(i * 1.7);
    const V = noisyVolumes(order, 0.7, kk, t, 1e-3);
    V[500] = Number.NaN;
    V[20_000] = V0 * 1.8;
    const fast = fitVolumes({ t, V }, { order, V0, epsilonA: 0.7, cA0: CA0 });
    const exact = fitVolumes({ t: plainCopy(t), V: plainCopy(V) }, { order, V0, epsilonA: 0.7, cA0: CA0 });
    // The NaN is left out; the volume past full conversion is kept.
    expect(fast.points).toBe(POINTS - 1);
    expect(exact.points).toBe(POINTS - 1);
    expect(relative(fast.k, exact.k)).toBeLessThan(1e-10);
  });

  it.each([0, 1] as const)("order %i on a grid with a missing time and times before zero", (order) => {
    const kk = k / Math.pow(CA0, order - 1);
    const t = evenTimes(POINTS, order === 0 ? 900 : 3600);
    const V = noisyVolumes(order, 0.7, kk, t, 1e-3);
    const shifted = Float64Array.from(t, (ti) => ti - 2);
    t[4_321] = Number.NaN;
    for (const times of [t, shifted]) {
      const fast = fitVolumes({ t: times, V }, { order, V0, epsilonA: 0.7, cA0: CA0 });
      const exact = fitVolumes({ t: plainCopy(times), V: plainCopy(V) }, { order, V0, epsilonA: 0.7, cA0: CA0 });
      expect(fast.points).toBe(exact.points);
      expect(fast.points).toBeLessThan(POINTS);
      expect(relative(fast.k, exact.k)).toBeLessThan(1e-10);
    }
  });

  it("gives the same fit whatever was fitted before it, and later fits leave its results alone", () => {
    // The selected copy lives in arrays reused from fit to fit (SelectionBuffers).
    const t = evenTimes(POINTS, 3600);
    const V = noisyVolumes(1, 0.7, k, t, 1e-3);
    V[700] = Number.NaN;
    const first = fitVolumes({ t, V }, { order: 1, V0, epsilonA: 0.7 });
    const residualsThen = Float64Array.from(first.residuals);
    const bigT = evenTimes(2 * POINTS, 7200);
    const bigV = noisyVolumes(0, 0.7, k * CA0, bigT, 2e-3);
    bigV[3] = Number.NaN;
    fitVolumes({ t: bigT, V: bigV }, { order: 0, V0, epsilonA: 0.7, cA0: CA0 });
    const again = fitVolumes({ t, V }, { order: 1, V0, epsilonA: 0.7 });
    expect(again.k).toBe(first.k);
    expect(again.points).toBe(POINTS - 1);
    expect(Array.from(again.residuals)).toEqual(Array.from(residualsThen));
    expect(Array.from(first.residuals)).toEqual(Array.from(residualsThen));
  });
});

describe("SelectionBuffers", () => {
  it("hands back the same arrays while they are long enough, and keeps none above its limit", () => {
    const buffers = new SelectionBuffers(100);
    const a = buffers.take(50);
    expect(buffers.take(40).t).toBe(a.t);
    const b = buffers.take(80);
    expect(b.t).not.toBe(a.t);
    expect(buffers.take(60).V).toBe(b.V);
    const huge = buffers.take(200);
    expect(huge.t.length).toBe(200);
    expect(buffers.take(10).t).toBe(b.t);
  });
});

describe("a grid run followed by points with gaps (a selection that dropped some near the end)", () => {
  const relative = (a: number, b: number) => Math.abs(a / b - 1);
  // Keeps every point up to `run`, then every third one: the times are a grid only up to `run`.
  function withGapsAfter(t: Float64Array, V: Float64Array, run: number) {
    const keep = Array.from({ length: t.length }, (_, i) => i).filter((i) => i < run || i % 3 === 0);
    return { t: Float64Array.from(keep, (i) => t[i]), V: Float64Array.from(keep, (i) => V[i]) };
  }

  it.each(CASES)("order %i, εA = %f: the runner's grid-run-then-general passes equal the general pass", (order, epsilonA) => {
    const k = order === 0 ? 6e-4 * CA0 : 6e-4 / Math.pow(CA0, order - 1);
    const full = evenTimes(POINTS, order === 0 ? 900 : 3600);
    const run = Math.floor(0.7 * POINTS);
    const { t, V } = withGapsAfter(full, noisyVolumes(order, epsilonA, k, full, 1e-3), run);
    const data = { order, t, V, V0, epsilonA, cA0: CA0 };
    const split = new ClosedFormPassRunner({ ...data, leadingRun: run });
    const plain = new ClosedFormPassRunner(data);
    const sums = () => ({ ssr: 0, jtj: 0, jtr: 0, sst: 0 });
    const [splitChecked, plainChecked, splitSums, plainSums] = [sums(), sums(), sums(), sums()];
    expect(split.first(k, splitChecked)).toBe(true);
    expect(plain.first(k, plainChecked)).toBe(true);
    const splitResiduals = new Float64Array(t.length);
    const plainResiduals = new Float64Array(t.length);
    split.withResiduals(k, splitResiduals, splitSums);
    plain.withResiduals(k, plainResiduals, plainSums);
    let largest = 0;
    for (let i = 0; i < t.length; i++) largest = Math.max(largest, Math.abs(splitResiduals[i] - plainResiduals[i]));
    // Common practice: both carry an exponential (or a series) from point to point; they differ only by rounding.
    expect(largest).toBeLessThan(1e-13);
    for (const [a, b] of [[splitSums, plainSums], [splitChecked, plainChecked]]) {
      expect(relative(a.ssr, b.ssr)).toBeLessThan(1e-10);
      expect(relative(a.jtj, b.jtj)).toBeLessThan(1e-10);
      expect(Math.abs(a.jtr - b.jtr)).toBeLessThan(1e-9 * Math.sqrt(b.jtj * b.ssr));
    }
    // The joined sum of squares about the mean against one computed directly from the volumes.
    const mean = V.reduce((s, v) => s + v, 0) / V.length;
    const sst = V.reduce((s, v) => s + (v - mean) ** 2, 0);
    expect(relative(splitSums.sst, sst)).toBeLessThan(1e-12);
    expect(relative(plainSums.sst, sst)).toBeLessThan(1e-12);
  });

  it("the selection reports how many points it kept before the first it dropped", () => {
    const t = evenTimes(2000, 3600);
    const V = predictVolume({ order: 1, k: 6e-4, epsilonA: 0.7, V0 }, t);
    const rules = { V0, epsilonA: 0.7 };
    expect(selectFitPoints({ t, V }, rules).leadingRun).toBe(2000);
    V[1500] = V0 * 1.7 + 0.01; // past full conversion
    V[1800] = Number.NaN;
    for (const trace of [{ t, V }, { t: Array.from(t), V: Array.from(V) }]) {
      const selected = selectFitPoints(trace, rules);
      expect(selected.leadingRun).toBe(1500);
      expect(selected.t.length).toBe(1998);
    }
    V[0] = Number.NaN; // the first point unreadable
    expect(selectFitPoints({ t, V }, rules).leadingRun).toBe(0);
  });

  it("sends a selection that dropped points near the end through the grid run, with the same fit", () => {
    const k = 8e-4;
    const t = evenTimes(POINTS, 3 * 3600);
    // A logger that lost a few readings near the end (NaN), which the selection drops.
    const V = noisyVolumes(1, 0.7, k, t, 3e-4);
    for (let i = POINTS - 2_000; i < POINTS; i += 97) V[i] = Number.NaN;
    const fit = fitVolumes({ t, V }, { order: 1, V0, epsilonA: 0.7 });
    expect(fit.excludedPoints).toBeGreaterThan(0);
    expect(fit.converged).toBe(true);
    // The same trace with its second time moved by 1 ns is no grid from the start, so it takes
    // the general loops throughout; the shift moves k by far less than the bound below.
    const shifted = Float64Array.from(t);
    shifted[1] += 1e-9;
    const reference = fitVolumes({ t: shifted, V }, { order: 1, V0, epsilonA: 0.7 });
    expect(reference.points).toBe(fit.points);
    expect(relative(fit.k, reference.k)).toBeLessThan(1e-9);
    expect(relative(fit.residualRms, reference.residualRms)).toBeLessThan(1e-9);
  });
});
