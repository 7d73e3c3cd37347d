import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { odexSolve } from "../../support/odexReference.js";

const UPLOAD_LIMIT = 64 * 1024;
let t: TestApp;
let eng: Client;
let op: Client;
beforeAll(async () => {
  t = await startTestApp({ settings: { uploadMaxBytes: UPLOAD_LIMIT } });
  const sign = async (roles: ("engineer" | "operator")[]) => {
    const p = await buildPerson(t.database.db, { roles });
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    return c;
  };
  [eng, op] = [await sign(["engineer"]), await sign(["operator"])];
});
afterAll(() => t.close());

// The demo scenario's first-order cracking at 250 °C: k = 2.0e-3 1/s, εA = 0.7, 40 L at t = 0.
const K_DEMO = 2.0e-3;
const EPSILON = 0.7;
const V0 = 40;
const TIMES = Array.from({ length: 601 }, (_, i) => i * 5);

/**
 * Gas volume at constant pressure, V = V0·(1 + εA·XA), with XA from dXA/dt = k·(1 − XA)
 * integrated by odex (an independent ODE solver), not by the library under test.
 */
function odexFirstOrderVolumes(k: number, times: number[]): number[] {
  return odexSolve((_t, X) => k * (1 - X), 0, times).map((X) => V0 * (1 + EPSILON * X));
}

const traceCsv = (volumes: number[], extra = "") =>
  `time (s),volume (L),temperature (K),pressure (Pa)\n${TIMES.map((s, i) => `${s},${volumes[i]},523.15,200000`).join("\n")}\n${extra}`;

const uploadTo = (client: Client, path: string, params: string | null, csv: string | Buffer | null) => {
  let req = client.agent.post(path).set("X-CSRF-Token", client.csrf);
  if (params !== null) req = req.field("params", params);
  if (csv !== null) req = req.attach("file", Buffer.from(csv), "trace.csv");
  return req;
};

const demoModel = {
  order: 1,
  kRef: K_DEMO,
  TRef: 523.15,
  Ea: 160_000,
  epsilonA: EPSILON,
  tolerancePct: 10,
  residualRmsMax: 0.015 * V0,
  temperatureBandK: 2,
  pressureBandPct: 2,
};
const demoConditions = { T: 523.15, P: 200_000, V0 };
const constant = (value: number) => TIMES.map(() => value);

describe("POST /api/kinetics/epsilon", () => {
  it("gives εA = yA0·δ for A → 2R with half inert in the feed", async () => {
    // εA = yA0·δ: 0.5 · (2 − 1)/1 = 0.5 (common practice).
    const res = await eng.post("/api/kinetics/epsilon", {
      reactants: [{ species: "A", coefficient: 1, phase: "gas" }],
      products: [{ species: "R", coefficient: 2 }],
      keySpecies: "A",
      feed: { A: 0.5, N2: 0.5 },
    });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ epsilonA: 0.5, delta: 1, yA0: 0.5 });
  });

  it("answers 422 naming the field when the key species is not a reactant", async () => {
    const res = await eng.post("/api/kinetics/epsilon", {
      reactants: [{ species: "A", coefficient: 1 }],
      products: [{ species: "R", coefficient: 2 }],
      keySpecies: "B",
      feed: { A: 1 },
    });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "invalid-kinetics-input", field: "keySpecies" });
  });
});

describe("POST /api/kinetics/fit", () => {
  const volumes = odexFirstOrderVolumes(K_DEMO, TIMES);

  it("gives back the odex trace's k within 1e-6 relative from JSON, with plain arrays", async () => {
    const res = await op.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, epsilonA: EPSILON, order: 1 });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.k / K_DEMO - 1)).toBeLessThan(1e-6);
    expect(res.body).toMatchObject({ order: 1, kUnit: "1/s", points: TIMES.length, V0 });
    expect(res.body.kCI95[0]).toBeLessThanOrEqual(res.body.k);
    expect(res.body.kCI95[1]).toBeGreaterThanOrEqual(res.body.k);
    expect(Array.isArray(res.body.residuals)).toBe(true);
    expect(res.body.residuals).toHaveLength(TIMES.length);
    expect(Math.max(...res.body.residuals.map(Math.abs))).toBeLessThan(1e-6);
  });

  it("without V0, counts time from the first reading, whenever the logger's clock started", async () => {
    // The same odex trace logged from t = 3600 s: its first volume is the charge, so V0 and time
    // zero are that reading's.
    const late = TIMES.map((ti) => ti + 3600);
    const res = await op.post("/api/kinetics/fit", { trace: { t: late, V: volumes }, epsilonA: EPSILON, order: 1 });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.k / K_DEMO - 1)).toBeLessThan(1e-6);
    expect(res.body.warnings.join(" ")).toMatch(/first volume, read at t = 3600 s; times are counted from that reading/);
    // With V0 given, the times are the user's own: no shift, no such warning.
    const given = await op.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, V0, epsilonA: EPSILON, order: 1 });
    expect(given.body.warnings.join(" ")).not.toMatch(/counted from/);
  });

  it("gives back the same k from a CSV upload", async () => {
    const res = await uploadTo(eng, "/api/kinetics/fit", JSON.stringify({ epsilonA: EPSILON, order: 1, V0 }), traceCsv(volumes));
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.k / K_DEMO - 1)).toBeLessThan(1e-6);
    expect(res.body.points).toBe(TIMES.length);
  });

  it("with order auto lists every order tried and picks first order for a first-order trace", async () => {
    // cA0 = yA0·P/(R·T) for the demo charge: 0.7 · 2e5 Pa / (8.314 J/(mol·K) · 523.15 K) / 1000 (common practice).
    const cA0 = (0.7 * 2e5) / (8.314462618 * 523.15) / 1000;
    const res = await eng.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, epsilonA: EPSILON, cA0, order: "auto" });
    expect(res.status).toBe(200);
    expect(res.body.order).toBe(1);
    expect(res.body.orderFitted).toBe(false);
    expect(Math.abs(res.body.k / K_DEMO - 1)).toBeLessThan(1e-6);
    const orders = res.body.orders as { order: number; orderFitted: boolean; residualRms: number }[];
    expect(orders.filter((o) => !o.orderFitted).map((o) => o.order)).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(orders.some((o) => o.orderFitted)).toBe(true);
    const first = orders.find((o) => o.order === 1 && !o.orderFitted)!;
    const second = orders.find((o) => o.order === 2)!;
    expect(first.residualRms).toBeLessThan(second.residualRms);
  });

  it("needs cA0 away from first order: 422 naming cA0", async () => {
    const res = await eng.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, epsilonA: EPSILON, order: 2 });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "invalid-kinetics-input", field: "cA0" });
  });

  it("needs cA0 for order auto too, and says it is for auto", async () => {
    const res = await eng.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, epsilonA: EPSILON, order: "auto" });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "invalid-kinetics-input", field: "cA0" });
    expect(res.body.error.message).toMatch(/Order "auto"/);
  });
});

describe("POST /api/kinetics/check", () => {
  const series = (k: number) => ({ t: TIMES, V: odexFirstOrderVolumes(k, TIMES), T: constant(523.15), P: constant(200_000) });

  it("is within for a trace at the model's k", async () => {
    const res = await eng.post("/api/kinetics/check", { model: demoModel, conditions: demoConditions, trace: series(K_DEMO) });
    expect(res.status).toBe(200);
    expect(res.body.verdict).toBe("within");
    expect(res.body.reasons).toEqual([]);
    expect(res.body.predicted).toHaveLength(TIMES.length);
    expect(res.body.notice).toMatch(/does not replace the batch review/);
  });

  it("is outside with k-outside-tolerance for a trace at 1.3 × k (JSON and CSV upload)", async () => {
    const fast = series(1.3 * K_DEMO);
    const res = await eng.post("/api/kinetics/check", { model: demoModel, conditions: demoConditions, trace: fast });
    expect(res.status).toBe(200);
    expect(res.body.verdict).toBe("outside");
    expect(res.body.reasons.map((r: { code: string }) => r.code)).toContain("k-outside-tolerance");
    expect(res.body.deviationPct).toBeCloseTo(30, 3);
    expect(res.body.linearised.x.length).toBeGreaterThan(100);

    const csv = traceCsv(fast.V);
    const uploaded = await uploadTo(op, "/api/kinetics/check", JSON.stringify({ model: demoModel, conditions: demoConditions, includeSeries: false }), csv);
    expect(uploaded.status).toBe(200);
    expect(uploaded.body.verdict).toBe("outside");
    expect(uploaded.body.reasons.map((r: { code: string }) => r.code)).toContain("k-outside-tolerance");
    expect(uploaded.body.predicted).toBeUndefined();
    expect(uploaded.body.linearised).toBeUndefined();
    expect(uploaded.body.deviationPct).toBeCloseTo(res.body.deviationPct, 3);
  });
});

describe("bad input is refused plainly, never with a 500", () => {
  const volumes = odexFirstOrderVolumes(K_DEMO, TIMES);

  it("missing V0 with no trace: 400 naming the trace; an empty trace: 422 naming V0", async () => {
    const none = await eng.post("/api/kinetics/fit", { epsilonA: EPSILON, order: 1 });
    expect(none.status).toBe(400);
    expect(none.body.error.field).toBe("trace");
    const empty = await eng.post("/api/kinetics/fit", { trace: { t: [], V: [] }, epsilonA: EPSILON, order: 1 });
    expect(empty.status).toBe(422);
    expect(empty.body.error.field).toBe("V0");
    const noFile = await uploadTo(eng, "/api/kinetics/fit", JSON.stringify({ epsilonA: EPSILON, order: 1 }), null);
    expect(noFile.status).toBe(400);
    expect(noFile.body.error).toMatchObject({ code: "file-missing", field: "file" });
  });

  it("a CSV with a bad line: 422 listing the problem on its line", async () => {
    const lines = traceCsv(volumes).split("\n");
    lines[3] = "10,forty,523.15,200000"; // file line 4
    const res = await uploadTo(eng, "/api/kinetics/fit", JSON.stringify({ epsilonA: EPSILON, order: 1 }), lines.join("\n"));
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("trace-csv-invalid");
    expect(res.body.error.totalProblems).toBe(1);
    expect(res.body.error.problems[0]).toMatchObject({ line: 4, code: "not-a-number" });
    expect(res.body.error.problems[0].message).toMatch(/^Line 4:/);
  });

  it("lists at most 20 problems and counts them all", async () => {
    const bad = `time (s),volume (L)\n${Array.from({ length: 30 }, (_, i) => `${i},x`).join("\n")}\n`;
    const res = await uploadTo(eng, "/api/kinetics/check", JSON.stringify({ model: demoModel, conditions: demoConditions }), bad);
    expect(res.status).toBe(422);
    expect(res.body.error.problems).toHaveLength(20);
    expect(res.body.error.totalProblems).toBe(30);
  });

  it("an empty body: 400 naming a field", async () => {
    for (const path of ["/api/kinetics/epsilon", "/api/kinetics/fit", "/api/kinetics/check"]) {
      const res = await eng.agent.post(path).set("X-CSRF-Token", eng.csrf);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe("invalid-input");
      expect(typeof res.body.error.field).toBe("string");
    }
  });

  it("a params part that is not JSON, or not valid: 400 naming params", async () => {
    const res = await uploadTo(eng, "/api/kinetics/fit", "{order: 1,", traceCsv(volumes));
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: "invalid-params", field: "params" });
    const wrong = await uploadTo(eng, "/api/kinetics/fit", JSON.stringify({ epsilonA: "big", order: 1 }), traceCsv(volumes));
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.field).toBe("params.epsilonA");
  });

  it("a file over the upload limit: 413", async () => {
    const big = traceCsv(volumes) + "9".repeat(UPLOAD_LIMIT);
    const res = await uploadTo(eng, "/api/kinetics/fit", JSON.stringify({ epsilonA: EPSILON, order: 1 }), big);
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: "file-too-large", field: "file" });
  });

  it("bytes that are not UTF-8 text: 422 naming the file", async () => {
    const res = await uploadTo(eng, "/api/kinetics/fit", JSON.stringify({ epsilonA: EPSILON, order: 1 }), Buffer.from([0x74, 0x69, 0xff, 0xfe, 0x0a]));
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe("file");
  });

  it("ragged or backwards trace columns and values the kinetics cannot use name their fields", async () => {
    const ragged = await eng.post("/api/kinetics/fit", { trace: { t: [0, 1, 2], V: [40, 41] }, epsilonA: EPSILON, order: 1 });
    expect(ragged.status).toBe(400);
    expect(ragged.body.error.field).toBe("trace.V");
    const backwards = await eng.post("/api/kinetics/fit", { trace: { t: [0, 10, 5], V: [40, 41, 42] }, epsilonA: EPSILON, order: 1 });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.field).toBe("trace.t.2");
    const zeroEpsilon = await eng.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, epsilonA: 0, order: 1 });
    expect(zeroEpsilon.status).toBe(422);
    expect(zeroEpsilon.body.error.field).toBe("epsilonA");
    const check = await eng.post("/api/kinetics/check", { model: { ...demoModel, order: 2 }, conditions: demoConditions, trace: series() });
    expect(check.status).toBe(422);
    expect(check.body.error.field).toBe("conditions.cA0");
  });

  it("refuses a signed-out caller with 401", async () => {
    const anon = new Client(t.app);
    await anon.refreshCsrf();
    const res = await anon.post("/api/kinetics/fit", { trace: { t: TIMES, V: volumes }, epsilonA: EPSILON, order: 1 });
    expect(res.status).toBe(401);
  });

  function series() {
    return { t: TIMES, V: volumes };
  }
});
