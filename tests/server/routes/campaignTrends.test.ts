import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { buildCampaign, buildPlannedBatch } from "../../factories.js";
import { BatchDriver } from "../../support/batchDriver.js";
import { rateModelVersions } from "../../../server/db/schema.js";
import { eq } from "drizzle-orm";

let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  t = await startTestApp();
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("sup", ["supervisor"]);
  await d.add("qa", ["quality"]);
  await d.add("eng", ["engineer"]);
});
afterAll(() => t.close());

const R = 8.314462618; // J/(mol·K), CODATA 2018 (exact)
const K_REF = 2.0e-3;
const T_REF = 523.15;
const EA = 160_000;
const kAt = (T: number) => K_REF * Math.exp((-EA / R) * (1 / T - 1 / T_REF)); // Arrhenius (common practice)

describe("campaign trends and model updates", () => {
  it("recovers kRef and Ea from released batches at three temperatures, and saves the draft with its batches", async () => {
    const camp = await buildCampaign(t.database.db);
    const temps = [518.15, 523.15, 528.15];
    const ids: string[] = [];
    for (const T of temps) {
      const { batch } = await buildPlannedBatch(t.database.db, { campaign: camp, temperatureC: T - 273.15 });
      await d.chargeAndRun(batch.id);
      await d.runToReview(batch.id, kAt(T), "op", "sup", { temperatureC: T - 273.15, n: 100 }); // long enough to pass the yield limit at the coolest point
      expect((await d.release("qa", batch.id)).status).toBe(200);
      ids.push(batch.id);
    }
    const trends = await d.clients.eng.get(`/api/campaigns/${camp.campaign.id}/trends`);
    expect(trends.body.batches.map((b: { state: string }) => b.state)).toEqual(["released", "released", "released"]);
    for (const [i, b] of trends.body.batches.entries()) {
      expect(b.kModelAtT).toBeCloseTo(kAt(temps[i]), 10);
      expect(b.check.kObserved / kAt(temps[i])).toBeCloseTo(1, 5);
      expect(b.conversion.X.at(-1)).toBeGreaterThan(0.9);
    }

    // Independent computation: ordinary least squares of ln k on (1/T − 1/Tref), written out here.
    const xs = temps.map((T) => 1 / T - 1 / T_REF);
    const ys = temps.map((T) => Math.log(kAt(T)));
    const xm = xs.reduce((a, b) => a + b) / 3;
    const ym = ys.reduce((a, b) => a + b) / 3;
    const slope = xs.reduce((s, x, i) => s + (x - xm) * (ys[i] - ym), 0) / xs.reduce((s, x) => s + (x - xm) ** 2, 0);
    const lnKRef = ym - slope * xm;

    const res = await d.clients.eng.post(`/api/rate-models/versions/${camp.rateModel.id}/proposal`, { batchIds: ids, save: true });
    expect(res.status).toBe(201);
    expect(res.body.arrhenius.kRef).toBeCloseTo(Math.exp(lnKRef), 9);
    expect(res.body.arrhenius.Ea).toBeCloseTo(-slope * R, 0);
    expect(res.body.arrhenius.kRef / K_REF).toBeCloseTo(1, 5);
    expect(res.body.arrhenius.Ea / EA).toBeCloseTo(1, 4);
    expect(res.body.draft).toMatchObject({ status: "draft", version: 2, basedOnBatchIds: ids });
    const [row] = await t.database.db.select().from(rateModelVersions).where(eq(rateModelVersions.id, res.body.draft.id));
    expect(row.basedOnBatchIds).toEqual(ids);

    const csv = await d.clients.eng.get(`/api/campaigns/${camp.campaign.id}/results.csv`);
    expect(csv.headers["content-type"]).toMatch(/text\/csv/);
    expect(csv.text.trim().split("\n")).toHaveLength(4);
    const trace = await d.clients.eng.get(`/api/batches/${ids[0]}/trace.csv`);
    expect(trace.text.split("\n")[0]).toBe("time (s),volume (L),temperature (K),pressure (Pa)");
  }, 90_000);

  it("refuses batches that are not released", async () => {
    const { batch, rateModel } = await buildPlannedBatch(t.database.db);
    const { batch: other } = await buildPlannedBatch(t.database.db);
    const res = await d.clients.eng.post(`/api/rate-models/versions/${rateModel.id}/proposal`, { batchIds: [batch.id, other.id] });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "batch-not-released", field: "batchIds" });
    expect((await d.clients.eng.post(`/api/rate-models/versions/${rateModel.id}/proposal`, { batchIds: [batch.id] })).body.error.field).toBe("batchIds");
  });
});
