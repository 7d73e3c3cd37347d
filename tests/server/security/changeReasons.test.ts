import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { gt } from "drizzle-orm";
import { Client, startTestApp, type TestApp } from "../../support/testApp.js";
import { buildApprovedMasterRecord, buildApprovedRateModel, buildPerson, buildPlannedBatch } from "../../factories.js";
import { BatchDriver } from "../../support/batchDriver.js";
import { auditEvents } from "../../../server/db/schema.js";
import { DEMO_VESSELS } from "../../../server/db/demoScenario.js";

// A change to a record needs its reason, and the reason is kept with the audit row
// (EU GMP Annex 11 §9, "audit trails": reason for change or deletion of GMP-relevant data).

let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  t = await startTestApp();
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("sup", ["supervisor"]);
  await d.add("qa", ["quality"]);
  await d.add("eng", ["engineer"]);
  await d.add("admin", ["admin"]);
});
afterAll(() => t.close());

interface Change {
  who: string;
  method: "post" | "put";
  path: string;
  body: Record<string, unknown>;
}

const lastSeq = async () => (await t.database.db.select({ seq: auditEvents.seq }).from(auditEvents).orderBy(auditEvents.seq)).at(-1)?.seq ?? 0;
const send = (c: Change, body: object) => (c.method === "put" ? d.clients[c.who].send("put", c.path, body) : d.clients[c.who].post(c.path, body));

/** Without a reason: 400 naming `reason`, and nothing audited. With one: done, and the reason is in the audit row. */
async function expectReasonRequired(change: Change) {
  const before = await lastSeq();
  const refused = await send(change, change.body);
  expect(refused.status, `${change.path} without a reason`).toBe(400);
  expect(refused.body.error.field).toBe("reason");
  expect(await t.database.db.select().from(auditEvents).where(gt(auditEvents.seq, before))).toEqual([]);
  const reason = `reason for ${change.path.split("/").slice(-1)[0]} ${Math.random().toString(36).slice(2, 8)}`;
  const done = await send(change, { ...change.body, reason });
  expect(done.status, `${change.path} with a reason: ${JSON.stringify(done.body).slice(0, 200)}`).toBeLessThan(300);
  const rows = await t.database.db.select().from(auditEvents).where(gt(auditEvents.seq, before));
  expect(rows.map((r) => r.reason)).toContain(reason);
}

const revisionOf = async (batchId: string) => (await d.clients.op.get(`/api/batches/${batchId}`)).body.batch.revision as number;

describe("every mutating route declares what it does to the records", () => {
  it("names an effect on each POST, PUT, PATCH and DELETE route", () => {
    const mutating = t.routes.filter((r) => r.method !== "get");
    expect(mutating.length).toBeGreaterThan(30);
    expect(mutating.filter((r) => !r.effect).map((r) => `${r.method.toUpperCase()} ${r.path}`)).toEqual([]);
  });

  it("refuses every route that changes a record with 400 naming reason when the body has none", async () => {
    const everyone = await buildPerson(t.database.db, { roles: ["operator", "supervisor", "quality", "engineer", "admin"] });
    const c = new Client(t.app);
    await c.signIn(everyone.email, everyone.password);
    const changes = t.routes.filter((r) => r.effect === "changes");
    expect(changes.length).toBeGreaterThanOrEqual(10);
    for (const route of changes) {
      const path = route.path.replace(/:[a-zA-Z]+/g, "00000000-0000-4000-8000-000000000000");
      const res = await c.send(route.method as "post" | "put", path, { password: everyone.password });
      expect([res.status, res.body.error?.field], `${route.method.toUpperCase()} ${route.path}`).toEqual([400, "reason"]);
    }
  });
});

describe("a change to a record needs a reason", () => {
  it("vessels: edit and status", async () => {
    const input = { ...DEMO_VESSELS[1], tag: `V-R-${Math.random().toString(36).slice(2, 7)}` };
    const vessel = (await d.clients.eng.post("/api/vessels", input)).body.vessel;
    await expectReasonRequired({ who: "eng", method: "put", path: `/api/vessels/${vessel.id}`, body: { ...input, description: "new seals", revision: vessel.revision } });
    await expectReasonRequired({ who: "qa", method: "post", path: `/api/vessels/${vessel.id}/status`, body: { status: "out-of-service" } });
  });

  it("drafts of rate models and master records", async () => {
    const model = await buildApprovedRateModel(t.database.db);
    const modelDraft = (await d.clients.eng.post(`/api/rate-models/${model.familyId}/versions`, { content: model.content })).body.version;
    await expectReasonRequired({ who: "eng", method: "put", path: `/api/rate-models/versions/${modelDraft.id}`, body: { content: { ...model.content, kRef: 0.0022 }, revision: modelDraft.revision } });
    const record = await buildApprovedMasterRecord(t.database.db);
    const recordDraft = (await d.clients.eng.post(`/api/master-records/${record.familyId}/versions`, { content: record.content })).body.version;
    await expectReasonRequired({ who: "eng", method: "put", path: `/api/master-records/versions/${recordDraft.id}`, body: { content: { ...record.content, title: "revised" }, revision: recordDraft.revision } });
  });

  it("batch records: a correction, a hold, a resumption and a rejection", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await expectReasonRequired({ who: "op", method: "post", path: `/api/batches/${batch.id}/steps/chargeN2/corrections`, body: { values: { n2Mass: 8.4 }, comments: {}, password: d.people.op.password } });
    await expectReasonRequired({ who: "op", method: "post", path: `/api/batches/${batch.id}/events`, body: { move: "HOLD", revision: await revisionOf(batch.id) } });
    await expectReasonRequired({ who: "sup", method: "post", path: `/api/batches/${batch.id}/events`, body: { move: "RESUME", revision: await revisionOf(batch.id), password: d.people.sup.password } });
    await d.runToReview(batch.id, 2.0e-3);
    await expectReasonRequired({ who: "qa", method: "post", path: `/api/batches/${batch.id}/events`, body: { move: "REJECT", revision: await revisionOf(batch.id), password: d.people.qa.password } });
  });

  it("people: roles, deactivation, reactivation, unlocking and password reset", async () => {
    const person = await buildPerson(t.database.db, { roles: ["operator"] });
    await expectReasonRequired({ who: "admin", method: "put", path: `/api/people/${person.id}/roles`, body: { roles: ["operator", "supervisor"] } });
    await expectReasonRequired({ who: "admin", method: "post", path: `/api/people/${person.id}/deactivate`, body: {} });
    await expectReasonRequired({ who: "admin", method: "post", path: `/api/people/${person.id}/reactivate`, body: {} });
    const locked = await buildPerson(t.database.db, { roles: ["operator"], lockedAt: new Date(), failedSignIns: 5 });
    await expectReasonRequired({ who: "admin", method: "post", path: `/api/people/${locked.id}/unlock`, body: {} });
    await expectReasonRequired({ who: "admin", method: "post", path: `/api/people/${person.id}/reset-password`, body: { temporaryPassword: "Harrow-Fen-temporary-42" } });
  });

  it("training: withdrawing a training record", async () => {
    const record = await buildApprovedMasterRecord(t.database.db);
    const trainee = await buildPerson(t.database.db, { roles: ["operator"], untrained: true });
    const today = new Date().toISOString().slice(0, 10);
    const training = await d.clients.sup.post("/api/training", { personId: trainee.id, masterRecordVersionId: record.id, trainedOn: today, validUntil: today, password: d.people.sup.password });
    expect(training.status).toBe(201);
    await expectReasonRequired({ who: "sup", method: "post", path: `/api/training/${training.body.record.id}/withdraw`, body: { password: d.people.sup.password } });
  });
});
