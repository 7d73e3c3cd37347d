import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { and, count, eq } from "drizzle-orm";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson, buildPlannedBatch } from "../../factories.js";
import { auditEvents, trainingRecords } from "../../../server/db/schema.js";

let t: TestApp;
let c: Client;
let ids: Record<string, string>;
beforeAll(async () => {
  t = await startTestApp();
  // One person holding every role, so no request is stopped at the policy before its body is read.
  const p = await buildPerson(t.database.db, { roles: ["operator", "supervisor", "quality", "engineer", "admin"] });
  c = new Client(t.app);
  await c.signIn(p.email, p.password);
  const { batch, campaign, vessel, rateModel, masterRecord } = await buildPlannedBatch(t.database.db);
  // The factories trained everyone active on the new master record, this person included.
  const [training] = await t.database.db.select({ id: trainingRecords.id }).from(trainingRecords).where(and(eq(trainingRecords.personId, p.id), eq(trainingRecords.masterRecordVersionId, masterRecord.id)));
  ids = { batch: batch.id, campaign: campaign.id, vessel: vessel.id, rateModel: rateModel.id, masterRecord: masterRecord.id, training: training.id };
});
afterAll(() => t.close());

// Real ids where a route names one, so bodies reach the handlers rather than a 404.
function concrete(path: string) {
  return path
    .replace("/api/batches/:id", `/api/batches/${ids.batch}`)
    .replace("/api/campaigns/:id", `/api/campaigns/${ids.campaign}`)
    .replace("/api/vessels/:id", `/api/vessels/${ids.vessel}`)
    .replace("/api/rate-models/versions/:id", `/api/rate-models/versions/${ids.rateModel}`)
    .replace("/api/master-records/versions/:id", `/api/master-records/versions/${ids.masterRecord}`)
    .replace("/api/training/:id", `/api/training/${ids.training}`)
    .replace(":stepKey", "reliefCheck")
    .replace(":key", "out-of-limit%3Ax")
    .replace(/:[a-zA-Z]+/g, "00000000-0000-4000-8000-000000000000");
}

const jsonish = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: "small" }, fc.constant(null), fc.boolean(), fc.double(), fc.integer(), fc.string(), fc.constantFrom("", "NaN", "-1", "1e309", "𝛆", "<script>", "'; drop table people; --"), fc.array(tie("value"), { maxLength: 4 }), fc.dictionary(fc.string({ maxLength: 8 }), tie("value"), { maxKeys: 5 })),
})).value;

describe("every route's body, fuzzed", () => {
  it("never answers 500 or shows a stack trace, whatever the body", async () => {
    const mutating = t.routes.filter((r) => r.method !== "get" && !(r.method === "delete" && r.path === "/api/session"));
    expect(mutating.length).toBeGreaterThan(20);
    const before = (await t.database.db.select({ n: count() }).from(auditEvents))[0].n;
    const failures: string[] = [];
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...mutating), jsonish, async (route, body) => {
        const path = concrete(route.path);
        const res = await c.agent[route.method as "post"](path).set("X-CSRF-Token", c.csrf).set("Content-Type", "application/json").send(JSON.stringify(body) ?? "null");
        const text = JSON.stringify(res.body ?? "");
        if (res.status >= 500 || /\bat .*\.(ts|js):\d+/.test(text)) failures.push(`${route.method.toUpperCase()} ${route.path} ${JSON.stringify(body).slice(0, 120)} → ${res.status} ${text.slice(0, 200)}`);
        return true;
      }),
      { numRuns: 400, seed: 20261201 },
    );
    expect(failures).toEqual([]);
    // Refused requests persist nothing: the only audit rows written are signature failures and sign-in side effects.
    const rows = await t.database.db.select({ action: auditEvents.action }).from(auditEvents);
    const added = rows.slice(Number(before));
    expect(added.filter((r) => !/failed|locked/.test(r.action)).map((r) => r.action)).toEqual([]);
  }, 120_000);
});
