import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { auditEvents } from "../../../server/db/schema.js";

let t: TestApp;
let eng: Client, qa: Client, op: Client;
beforeAll(async () => {
  t = await startTestApp();
  const sign = async (roles: ("engineer" | "quality" | "operator")[]) => {
    const p = await buildPerson(t.database.db, { roles });
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    return c;
  };
  [eng, qa, op] = [await sign(["engineer"]), await sign(["quality"]), await sign(["operator"])];
});
afterAll(() => t.close());

let n = 0;
const vessel = (over: object = {}) => ({
  tag: `TV-${Date.now() % 100000}-${++n}`,
  description: "Test piston vessel",
  mawp: { value: 10, unit: "bar(g)" },
  reliefSetPressure: { value: 8.5, unit: "bar(g)" },
  minVolume: { value: 4, unit: "L" },
  maxVolume: { value: 0.04, unit: "m³" },
  boreArea: { value: 314.16, unit: "cm²" },
  ...over,
});

describe("vessels", () => {
  it("stores quantities in SI and remembers the units entered", async () => {
    const res = await eng.post("/api/vessels", vessel());
    expect(res.status).toBe(201);
    const v = res.body.vessel;
    // bar(g) → Pa absolute with the standard atmosphere, 101 325 Pa (common practice).
    expect(v.mawpPa).toBeCloseTo(10 * 100000 + 101325, 6);
    expect(v.reliefSetPa).toBeCloseTo(8.5 * 100000 + 101325, 6);
    expect(v.maxVolumeL).toBeCloseTo(40, 9);
    expect(v.boreAreaM2).toBeCloseTo(0.031416, 9);
    expect(v.entered).toEqual({ pressureUnit: "bar(g)", volumeUnit: "m³", areaUnit: "cm²" });
    expect(v.status).toBe("in-service");
  });

  it("refuses a relief set pressure above the MAWP, naming the field", async () => {
    const res = await eng.post("/api/vessels", vessel({ reliefSetPressure: { value: 12, unit: "bar(g)" } }));
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "relief-above-mawp", field: "reliefSetPressure" });
  });

  it("refuses an unknown unit and a duplicate tag", async () => {
    const badUnit = await eng.post("/api/vessels", vessel({ mawp: { value: 10, unit: "atm" } }));
    expect(badUnit.status).toBe(400);
    expect(badUnit.body.error.field).toBe("mawp.unit");
    const body = vessel();
    expect((await eng.post("/api/vessels", body)).status).toBe(201);
    const dup = await eng.post("/api/vessels", body);
    expect(dup.status).toBe(409);
  });

  it("lets only quality take a vessel out of service, with a reason, audited", async () => {
    const v = (await eng.post("/api/vessels", vessel())).body.vessel;
    expect((await eng.post(`/api/vessels/${v.id}/status`, { status: "out-of-service", reason: "relief valve overdue" })).status).toBe(403);
    expect((await op.post(`/api/vessels/${v.id}/status`, { status: "out-of-service", reason: "relief valve overdue" })).status).toBe(403);
    const res = await qa.post(`/api/vessels/${v.id}/status`, { status: "out-of-service", reason: "relief valve overdue" });
    expect(res.status).toBe(200);
    expect(res.body.vessel.status).toBe("out-of-service");
    const [row] = await t.database.db.select().from(auditEvents).where(eq(auditEvents.entityId, v.id)).then((rows) => rows.filter((r) => r.action === "vessel-taken-out-of-service"));
    expect(row.reason).toBe("relief valve overdue");
  });

  it("edits a vessel only with a reason and the current revision", async () => {
    const v = (await eng.post("/api/vessels", vessel())).body.vessel;
    const input = vessel({ tag: v.tag, description: "Pilot piston vessel, new seals" });
    expect((await eng.send("put", `/api/vessels/${v.id}`, { ...input, revision: v.revision })).status).toBe(400);
    const ok = await eng.send("put", `/api/vessels/${v.id}`, { ...input, revision: v.revision, reason: "seals replaced" });
    expect(ok.status).toBe(200);
    expect(ok.body.vessel.revision).toBe(v.revision + 1);
    const stale = await eng.send("put", `/api/vessels/${v.id}`, { ...input, revision: v.revision, reason: "again" });
    expect(stale.status).toBe(409);
  });
});
