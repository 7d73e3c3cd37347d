import { describe, expect, it } from "vitest";
import {
  KINETICS_CHECK_NOTICE,
  KineticsInputError,
  checkTrace,
  checkVerdict,
  predictVolume,
  type ApprovedRateModel,
  type BatchConditions,
} from "../../../shared/kinetics/index";

// Demo scenario (invented): Harrow Fen pilot plant, campaign HF-24, DMX → 2 MON with 30 % N2,
// εA = 0.7, first order, 2.0 bar(a), 250 °C.
const model: ApprovedRateModel = {
  order: 1,
  kRef: 8e-4,
  TRef: 523.15,
  Ea: 120e3,
  epsilonA: 0.7,
  tolerancePct: 10,
  residualRmsMax: 0.002,
  temperatureBandK: 2,
  pressureBandPct: 2,
};
const conditions: BatchConditions = { T: 523.15, P: 2e5, V0: 2, yA0: 0.7 };

function trace(k: number, options: { points?: number; order?: number; noise?: number; cA0?: number } = {}) {
  const points = options.points ?? 600;
  const t = new Float64Array(points);
  for (let i = 0; i < points; i++) t[i] = i * 5;
  const V = predictVolume({ order: options.order ?? 1, k, epsilonA: 0.7, V0: 2, cA0: options.cA0 }, t);
  const noise = options.noise ?? 2e-4;
  for (let i = 0; i < points; i++) V[i] += noise * Math.sin(i * 12.9898);
  return { t, V, T: new Float64Array(points).fill(523.15), P: new Float64Array(points).fill(2e5) };
}

const codes = (result: ReturnType<typeof checkTrace>) => result.reasons.map((r) => r.code);

describe("checkTrace", () => {
  it.each([50, 200, 5000])("finds the trace's own k when the model's k is %i times it", (times) => {
    // A batch far faster in the model than in the vessel: started at the model's k, every point
    // lay past full conversion and the fit reported k near the model's (0 % off at 200×).
    // Ten points of a clean first-order rise, the trace's k 0.002 1/s (common practice: the
    // observed k comes from the trace alone).
    const k = 0.002;
    const t = Float64Array.from({ length: 10 }, (_, i) => i * 127.9213940552251);
    const V = predictVolume({ order: 1, k, epsilonA: 0.7, V0: 40 }, t);
    const far = { ...model, kRef: k * times, Ea: 160e3, residualRmsMax: 0.6 };
    const result = checkVerdict({ model: far, conditions: { T: 523.15, P: 2e5, V0: 40, yA0: 0.7 }, trace: { t, V } });
    expect(result.kObserved / k - 1).toBeLessThan(1e-6);
    expect(result.kObserved / k - 1).toBeGreaterThan(-1e-6);
    expect(result.verdict).toBe("outside");
    expect(result.reasons.map((r) => r.code)).toContain("k-outside-tolerance");
    expect(result.reasons.map((r) => r.code)).not.toContain("fit-failed");
  });

  it("passes a trace at the model's k", () => {
    const result = checkTrace({ model, conditions, trace: trace(8e-4) });
    expect(result.reasons).toEqual([]);
    expect(result.verdict).toBe("within");
    expect(Math.abs(result.deviationPct)).toBeLessThan(0.1);
    expect(result.kObservedCI95[0]).toBeLessThan(8e-4);
    expect(result.kObservedCI95[1]).toBeGreaterThan(8e-4);
    expect(result.predicted).toHaveLength(600);
    expect(result.linearised?.slope).toBeCloseTo(result.kObserved, 12);
    expect(result.notice).toBe(KINETICS_CHECK_NOTICE);
  });

  it("fails at 1.3 × k with k-outside-tolerance, giving the numbers", () => {
    const result = checkTrace({ model, conditions, trace: trace(1.3 * 8e-4) });
    expect(result.verdict).toBe("outside");
    expect(codes(result)).toEqual(["k-outside-tolerance"]);
    expect(result.deviationPct).toBeCloseTo(30, 0);
    expect(result.reasons[0].message).toMatch(/1\/s .*30 %, outside ±10 %/);
  });

  it("uses Arrhenius at the batch temperature for kModel", () => {
    const hotter = { ...conditions, T: 528.15 };
    const kHot = 8e-4 * Math.exp((-120e3 / 8.314462618) * (1 / 528.15 - 1 / 523.15));
    const data = trace(kHot);
    data.T.fill(528.15);
    const result = checkTrace({ model, conditions: hotter, trace: data });
    expect(result.kModel).toBeCloseTo(kHot, 15);
    expect(result.verdict).toBe("within");
  });

  it("fails a temperature excursion with temperature-outside-band", () => {
    const data = trace(8e-4);
    for (let i = 200; i < 230; i++) data.T[i] = 526.4;
    const result = checkTrace({ model, conditions, trace: data });
    expect(codes(result)).toEqual(["temperature-outside-band"]);
    expect(result.reasons[0].message).toMatch(/30 of 600 points .*526\.4 K/);
  });

  it("fails a pressure excursion with pressure-outside-band", () => {
    const data = trace(8e-4);
    data.P[10] = 2.1e5;
    expect(codes(checkTrace({ model, conditions, trace: data }))).toEqual(["pressure-outside-band"]);
  });

  it("fails a noisy trace with residuals-too-large", () => {
    const result = checkTrace({ model, conditions, trace: trace(8e-4, { noise: 0.01 }) });
    expect(codes(result)).toContain("residuals-too-large");
  });

  it("fails a second-order trace against a first-order model with residuals-too-large", () => {
    const cA0 = 0.7 * 2e5 / (8.314462618 * 523.15) / 1000;
    const result = checkTrace({ model, conditions, trace: trace(8e-4 / cA0, { order: 2, cA0, noise: 0 }) });
    expect(codes(result)).toContain("residuals-too-large");
  });

  it("fails a short trace with too-few-points", () => {
    const result = checkTrace({ model: { ...model, minPoints: 50 }, conditions, trace: trace(8e-4, { points: 30 }) });
    expect(codes(result)).toContain("too-few-points");
  });

  it("fails a trace that stops early with conversion-too-low", () => {
    const result = checkTrace({ model: { ...model, minConversion: 0.5 }, conditions, trace: trace(8e-4, { points: 100 }) });
    expect(codes(result)).toEqual(["conversion-too-low"]);
  });

  it("flags a volume beyond full conversion (leak or meter fault)", () => {
    const data = trace(8e-4);
    data.V[599] = 2 * 1.7 + 0.05;
    const result = checkTrace({ model, conditions, trace: data });
    expect(codes(result)).toContain("volume-past-full-conversion");
  });

  it("flags a volume moving against the sign of εA", () => {
    const data = trace(8e-4);
    for (let i = 0; i < 20; i++) data.V[i] = 2 - 0.01 * i;
    expect(codes(checkTrace({ model, conditions, trace: data }))).toContain("volume-against-epsilon");
  });

  it("says so when εA = 0 instead of dividing by zero", () => {
    const data = trace(8e-4);
    data.V.fill(2);
    const result = checkTrace({ model: { ...model, epsilonA: 0 }, conditions, trace: data });
    expect(result.verdict).toBe("outside");
    expect(codes(result)).toEqual(["no-volume-change-expected"]);
    expect(result.fit).toBeNull();
    expect(Array.from(result.predicted.slice(0, 3))).toEqual([2, 2, 2]);
  });

  it("reports fit-failed when no rate constant can be fitted", () => {
    const result = checkTrace({ model, conditions, trace: { t: [0], V: [2] } });
    expect(codes(result)).toEqual(expect.arrayContaining(["fit-failed", "too-few-points", "conversion-too-low"]));
  });

  it("checks a second-order model with cA0 computed from yA0", () => {
    const cA0 = 0.7 * 2e5 / (8.314462618 * 523.15) / 1000;
    const secondOrder = { ...model, order: 2, kRef: 8e-4 / cA0 };
    const result = checkTrace({ model: secondOrder, conditions, trace: trace(8e-4 / cA0, { order: 2, cA0 }) });
    expect(result.cA0).toBeCloseTo(cA0, 15);
    expect(result.verdict).toBe("within");
    expect(result.kUnit).toBe("L/(mol·s)");
  });

  it("needs cA0 or yA0 for orders other than 1", () => {
    expect(() => checkTrace({ model: { ...model, order: 2 }, conditions: { T: 523.15, P: 2e5, V0: 2 }, trace: trace(8e-4) })).toThrow(KineticsInputError);
  });

  it("notes bands it could not check", () => {
    const { t, V } = trace(8e-4);
    const result = checkTrace({ model, conditions, trace: { t, V } });
    expect(result.verdict).toBe("within");
    expect(result.notes).toHaveLength(2);
  });

  it("gives the same verdict without the chart series through checkVerdict", () => {
    const cases = [
      { model, conditions, trace: trace(8e-4) },
      { model, conditions, trace: trace(1.3 * 8e-4) },
      { model: { ...model, order: 2 }, conditions, trace: trace(8e-4 / 0.0322, { order: 2, cA0: 0.0322 }) },
      { model: { ...model, epsilonA: 0 }, conditions, trace: trace(8e-4) },
    ];
    for (const input of cases) {
      const { predicted, linearised, ...withoutSeries } = checkTrace(input);
      const verdict = checkVerdict(input);
      expect(verdict).toEqual(withoutSeries);
      expect(verdict).not.toHaveProperty("predicted");
      expect(verdict).not.toHaveProperty("linearised");
      expect(predicted).toHaveLength(input.trace.t.length);
      expect(linearised === null).toBe(input.model.epsilonA === 0);
    }
  });
});
