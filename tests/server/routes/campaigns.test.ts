import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildCampaign, buildPerson, buildVessel } from "../../factories.js";
import { auditEvents, batches, vessels } from "../../../server/db/schema.js";

let t: TestApp;
let eng: Client;
beforeAll(async () => {
  t = await startTestApp();
  const p = await buildPerson(t.database.db, { roles: ["engineer"] });
  eng = new Client(t.app);
  await eng.signIn(p.email, p.password);
});
afterAll(() => t.close());

const at = (v0: number, pressureBarA = 2, vesselId: string) => ({ vesselId, v0: { value: v0, unit: "L" }, temperature: { value: 250, unit: "°C" }, pressure: { value: pressureBarA, unit: "bar(a)" } });

describe("campaigns and batch plans", () => {
  it("plans a batch: final volume V0(1 + εA·Xmax), CA0 at P and T, charges scaled per litre of V0", async () => {
    const { campaign } = await buildCampaign(t.database.db);
    const vessel = await buildVessel(t.database.db);
    const res = await eng.post(`/api/campaigns/${campaign.id}/batches`, { code: `B-${Date.now()}`, ...at(22, 2, vessel.id) });
    expect(res.status).toBe(201);
    const plan = res.body.batch.plan;
    expect(plan.finalVolumeL).toBeCloseTo(22 * 1.7, 10);
    // CA0 = yA0·P/(R·T) with R = 8.314462618 J/(mol·K), CODATA 2018: 0.7 × 200 000 / (8.314462618 × 523.15) mol/m³.
    expect(plan.cA0MolPerL).toBeCloseTo((0.7 * 200000) / (8.314462618 * 523.15) / 1000, 12);
    const dmx = plan.charges.find((c: { fieldKey: string }) => c.fieldKey === "dmxMass");
    expect(dmx.scaled.low).toBeCloseTo(5.3 * 22, 10);
    expect(dmx.scaled.high).toBeCloseTo(5.52 * 22, 10);
    const [row] = await t.database.db.select().from(batches).where(eq(batches.id, res.body.batch.id));
    expect(row.state).toBe("planned");
    expect(await t.database.db.select().from(auditEvents).where(eq(auditEvents.entityId, row.id))).toHaveLength(1);
  });

  it("refuses a plan whose final volume leaves the vessel's rated range, saying so in words", async () => {
    const { campaign } = await buildCampaign(t.database.db);
    const vessel = await buildVessel(t.database.db);
    const code = `B-${Date.now()}-big`;
    const res = await eng.post(`/api/campaigns/${campaign.id}/batches`, { code, ...at(30, 2, vessel.id) });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("plan-refused");
    expect(res.body.error.problems.map((p: { code: string }) => p.code)).toContain("final-volume-above-rated-max");
    expect(res.body.error.message).toMatch(/51\.00 L, above .* rated maximum of 40\.00 L/);
    expect(await t.database.db.select().from(batches).where(eq(batches.code, code))).toHaveLength(0);
  });

  it("refuses a shrinking reaction whose final volume falls below the rated minimum", async () => {
    // A + B → C in the gas phase from an equimolar feed: δ = −1, yA0 = 0.5, εA = −0.5 (common practice).
    const { campaign } = await buildCampaign(t.database.db, {
      reaction: { reactants: [{ species: "A", coefficient: 1, phase: "gas" }, { species: "B", coefficient: 1, phase: "gas" }], products: [{ species: "C", coefficient: 1, phase: "gas" }] },
      keySpecies: "A",
      feed: { A: 0.5, B: 0.5 },
    });
    const vessel = await buildVessel(t.database.db);
    const res = await eng.post(`/api/campaigns/${campaign.id}/plan-preview`, at(6, 2, vessel.id));
    expect(res.status).toBe(200);
    expect(res.body.plan.epsilonA).toBeCloseTo(-0.5, 12);
    expect(res.body.plan.finalVolumeL).toBeCloseTo(3, 12);
    expect(res.body.plan.problems.map((p: { code: string }) => p.code)).toEqual(["final-volume-below-rated-min"]);
  });

  it("refuses a pressure above the MAWP and a vessel out of service", async () => {
    const { campaign } = await buildCampaign(t.database.db);
    const vessel = await buildVessel(t.database.db, { mawp: { value: 3, unit: "bar(a)" }, reliefSetPressure: { value: 2.8, unit: "bar(a)" } });
    const hot = await eng.post(`/api/campaigns/${campaign.id}/plan-preview`, at(10, 3.5, vessel.id));
    expect(hot.body.plan.problems.map((p: { code: string }) => p.code)).toEqual(["pressure-above-mawp"]);
    const offline = await buildVessel(t.database.db);
    await t.database.db.update(vessels).set({ status: "out-of-service" }).where(eq(vessels.id, offline.id));
    const res = await eng.post(`/api/campaigns/${campaign.id}/batches`, { code: `B-${Date.now()}-off`, ...at(10, 2, offline.id) });
    expect(res.status).toBe(422);
    expect(res.body.error.problems.map((p: { code: string }) => p.code)).toEqual(["vessel-out-of-service"]);
  });

  it("creates a campaign only on approved versions", async () => {
    const { rateModel, masterRecord } = await buildCampaign(t.database.db);
    const ok = await eng.post("/api/campaigns", { code: `C-${Date.now()}`, process: "DMX cracking", masterRecordVersionId: masterRecord.id, rateModelVersionId: rateModel.id });
    expect(ok.status).toBe(201);
    const draft = await eng.post("/api/rate-models", { code: `D-${Date.now()}`, title: "draft only", content: rateModel.content });
    const refused = await eng.post("/api/campaigns", { code: `C-${Date.now()}-x`, process: "DMX cracking", masterRecordVersionId: masterRecord.id, rateModelVersionId: draft.body.version.id });
    expect(refused.status).toBe(422);
    expect(refused.body.error.field).toBe("rateModelVersionId");
  });
});
