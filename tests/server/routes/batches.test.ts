import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { buildPlannedBatch } from "../../factories.js";
import { BatchDriver, demoEntries, firstOrderCsv } from "../../support/batchDriver.js";
import { auditEvents, batches, mailOutbox, people as peopleTable, stepEntries } from "../../../server/db/schema.js";
import type { Role } from "../../../shared/schemas/roles.js";
import { listenForChanges } from "../../support/liveListener.js";

let t: TestApp;
let d: BatchDriver;
let people: BatchDriver["people"];
let clients: BatchDriver["clients"];
beforeAll(async () => {
  t = await startTestApp();
  d = new BatchDriver(t.app, t.database.db);
  for (const [name, roles] of [["op", ["operator"]], ["op2", ["operator"]], ["sup", ["supervisor"]], ["sup2", ["supervisor"]], ["qa", ["quality"]], ["eng", ["engineer"]]] as [string, Role[]][]) await d.add(name, roles);
  ({ people, clients } = d);
});
afterAll(() => t.close());

const entries = demoEntries();
const perform = (who: string, batchId: string, stepKey: string, body?: object) => d.perform(who, batchId, stepKey, body);
const verify = (who: string, batchId: string, stepKey: string) => d.verify(who, batchId, stepKey);
const step = (view: { steps: { key: string }[] }, key: string) => view.steps.find((s) => s.key === key) as any;
const chargeAndRun = (batchId: string) => d.chargeAndRun(batchId);
const now = () => new Date().toISOString();

describe("executing a batch", () => {
  it("charges with a critical step verified by a second person, and refuses to leave an incomplete phase", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    expect((await d.move("eng", batch.id, "START_CHARGING")).body.error.refusals[0].code).toBe("role-missing");
    expect((await d.move("op", batch.id, "START_CHARGING")).status).toBe(200);

    const performed = await perform("op", batch.id, "reliefCheck");
    expect(performed.status).toBe(201);
    const relief = step(performed.body, "reliefCheck");
    expect(relief.status).toBe("awaiting-verification");
    expect(relief.signatures[0]).toMatchObject({ meaning: "performed", signerName: people.op.name, matchesContent: true });
    const waiting = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, people.sup.email));
    expect(waiting.some((m) => m.subject.includes("waits for your verification") && m.textBody.includes(`/batches/${batch.id}`))).toBe(true);

    const early = await d.move("op", batch.id, "START_RUN");
    expect(early.status).toBe(409);
    expect(early.body.error.refusals.map((r: { code: string }) => r.code)).toEqual(["phase-incomplete"]);
    expect(early.body.error.message).toMatch(/Confirm relief protection/);

    expect((await perform("op", batch.id, "reliefCheck")).body.error.code).toBe("already-performed");
    expect((await verify("op", batch.id, "reliefCheck")).status).toBe(403); // operators do not verify
    const verified = await verify("sup", batch.id, "reliefCheck");
    expect(step(verified.body, "reliefCheck").status).toBe("complete");
    expect(step(verified.body, "reliefCheck").verifiedBy.name).toBe(people.sup.name);
  });

  it("never lets a person verify their own entry", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    expect((await perform("sup", batch.id, "reliefCheck")).status).toBe(201);
    const own = await verify("sup", batch.id, "reliefCheck");
    expect(own.status).toBe(403);
    expect(own.body.error.code).toBe("own-entry");
    expect((await verify("sup2", batch.id, "reliefCheck")).status).toBe(200);
  });

  it("validates entries against the step's fields, scaled to V0, and accepts an out-of-limit value only with a comment", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    const wrongType = await perform("op", batch.id, "chargeDmx", { values: { dmxLot: "L1", dmxMass: "lots" } });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.error.field).toBe("values.dmxMass");
    const unknown = await perform("op", batch.id, "chargeDmx", { values: { dmxLot: "L1", dmxMass: 119, extra: 1 } });
    expect(unknown.status).toBe(400);
    // 5.3–5.52 g per litre of V0 at V0 = 22 L: 116.6–121.44 g.
    const high = await perform("op", batch.id, "chargeDmx", { values: { dmxLot: "L1", dmxMass: 125 } });
    expect(high.status).toBe(400);
    expect(high.body.error.field).toBe("comments.dmxMass");
    expect(high.body.error.message).toMatch(/116\.6 to 121\.44/);
    const withComment = await perform("op", batch.id, "chargeDmx", { values: { dmxLot: "L1", dmxMass: 125 }, comments: { dmxMass: "cylinder over-delivered; supervisor informed" } });
    expect(withComment.status).toBe(201);
    expect(step(withComment.body, "chargeDmx").entries[0].outOfLimit).toEqual(["dmxMass"]);
    const badChoice = await perform("op", batch.id, "reliefCheck", { values: { reliefStatus: "maybe", leakTestPressure: 2.5 } });
    expect(badChoice.body.error.field).toBe("values.reliefStatus");
  });

  it("refuses a wrong signing password and records nothing", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    const res = await clients.op.post(`/api/batches/${batch.id}/steps/reliefCheck/entries`, { ...entries.reliefCheck, password: "not the password" });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe("password");
    expect(await t.database.db.select().from(stepEntries).where(eq(stepEntries.batchId, batch.id))).toHaveLength(0);
    // Leave the shared operator's failure count as it was for the tests that follow.
    await t.database.db.update(peopleTable).set({ failedSignIns: 0 }).where(eq(peopleTable.id, people.op.id));
  });

  it("corrects an entry as a new version with a reason; the old signatures stop matching and verification is needed again", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    await perform("op", batch.id, "chargeDmx");
    await verify("sup", batch.id, "chargeDmx");
    const noReason = await clients.op.post(`/api/batches/${batch.id}/steps/chargeDmx/corrections`, { values: { dmxLot: "DMX-L-0420", dmxMass: 119 }, password: people.op.password });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.field).toBe("reason");
    const res = await clients.op.post(`/api/batches/${batch.id}/steps/chargeDmx/corrections`, { values: { dmxLot: "DMX-L-0420", dmxMass: 119 }, reason: "lot number mistyped", password: people.op.password });
    expect(res.status).toBe(201);
    const s = step(res.body, "chargeDmx");
    expect(s.entries.map((e: { version: number; values: { dmxLot: string } }) => [e.version, e.values.dmxLot])).toEqual([
      [1, "DMX-L-0419"],
      [2, "DMX-L-0420"],
    ]);
    expect(s.entries[1].reason).toBe("lot number mistyped");
    const byMeaning = s.signatures.map((g: { meaning: string; matchesContent: boolean }) => [g.meaning, g.matchesContent]);
    expect(byMeaning).toEqual([
      ["performed", false],
      ["verified", false],
      ["performed", true],
    ]);
    expect(s.status).toBe("awaiting-verification");
    const rows = await t.database.db.select().from(stepEntries).where(and(eq(stepEntries.batchId, batch.id), eq(stepEntries.stepKey, "chargeDmx")));
    expect(rows).toHaveLength(2); // nothing overwritten
  });

  it("puts a batch on hold with a reason, mails the supervisors, and resumes only with a supervisor's signature", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await chargeAndRun(batch.id);
    expect((await d.move("op", batch.id, "HOLD")).body.error.field).toBe("reason");
    const held = await d.move("op", batch.id, "HOLD", { reason: "temperature controller alarm" });
    expect(held.status).toBe(200);
    expect(held.body.batch).toMatchObject({ state: "held", heldFrom: "running", holdReason: "temperature controller alarm" });
    const mails = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, people.sup.email));
    expect(mails.some((m) => m.subject.includes(`${batch.code} is on hold`))).toBe(true);
    expect((await d.move("op", batch.id, "RESUME", { password: people.op.password, reason: "controller replaced" })).status).toBe(403);
    expect((await d.move("sup", batch.id, "RESUME", { password: people.sup.password })).body.error.field).toBe("reason");
    expect((await d.move("sup", batch.id, "RESUME", { reason: "controller replaced" })).body.error.field).toBe("password");
    const resumed = await d.move("sup", batch.id, "RESUME", { password: people.sup.password, reason: "controller replaced" });
    expect(resumed.status).toBe(200);
    expect(resumed.body.batch.state).toBe("running");
  });

  it("lets exactly one of many simultaneous moves win; the others get 409 with the current state", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    const results = await Promise.all(Array.from({ length: 8 }, () => clients.op.post(`/api/batches/${batch.id}/events`, { move: "START_CHARGING", revision: batch.revision })));
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(7);
    const loser = results.find((r) => r.status === 409)!;
    expect(loser.body.error).toMatchObject({ code: "stale-revision", state: "charging", revision: batch.revision + 1 });
    const [row] = await t.database.db.select().from(batches).where(eq(batches.id, batch.id));
    expect(row.revision).toBe(batch.revision + 1);
    expect(await t.database.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, batch.id), eq(auditEvents.action, "batch-start-charging")))).toHaveLength(1);
  });

  it("raises a deviation, has a supervisor investigate it and quality close it with a signature", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    const bad = await clients.op.post(`/api/batches/${batch.id}/deviations`, { title: "x", severity: "huge" });
    expect(bad.status).toBe(400);
    const raised = await clients.op.post(`/api/batches/${batch.id}/deviations`, { title: "Seal weeping", description: "Slight weep at the piston seal during the leak test.", severity: "major", stepKey: "reliefCheck" });
    expect(raised.status).toBe(201);
    const id = raised.body.deviation.id;
    expect((await clients.qa.post(`/api/deviations/${id}/close`, { password: people.qa.password, revision: 1 })).body.error.code).toBe("not-investigated");
    expect((await clients.op.post(`/api/deviations/${id}/investigate`, { rootCause: "worn seal", action: "replaced", revision: 1 })).status).toBe(403);
    const investigated = await clients.sup.post(`/api/deviations/${id}/investigate`, { rootCause: "Worn seal", action: "Seal replaced, leak test repeated", revision: 1 });
    expect(investigated.status).toBe(200);
    const toQuality = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, people.qa.email));
    expect(toQuality.some((m) => m.subject.includes("needs closing"))).toBe(true);
    const wrong = await clients.qa.post(`/api/deviations/${id}/close`, { password: "nope", revision: 2 });
    expect(wrong.status).toBe(422);
    const closed = await clients.qa.post(`/api/deviations/${id}/close`, { password: people.qa.password, comment: "accepted", revision: 2 });
    expect(closed.status).toBe(200);
    expect(closed.body.deviation.status).toBe("closed");
    const open = await clients.qa.get("/api/deviations");
    expect(open.body.deviations.some((d: { id: string }) => d.id === id)).toBe(false);
  });

  it("shows the person's queues: signatures due for supervisors", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    await perform("op", batch.id, "reliefCheck");
    const q = await clients.sup.get("/api/queues");
    expect(q.body.awaitingVerification.some((w: { batchId: string; stepKey: string }) => w.batchId === batch.id && w.stepKey === "reliefCheck")).toBe(true);
    expect(q.body.inProgress.some((b: { id: string }) => b.id === batch.id)).toBe(true);
  });
});

describe("the trace, attachments and samples", () => {
  const csv = firstOrderCsv;

  it("adds logger traces while running (each file adds, none replaces), with the forecast in words", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await chargeAndRun(batch.id);
    const first = await d.upload("op", csv(2.0e-3, 22, { n: 20 }));
    const added = await clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: first.id });
    expect(added.status).toBe(201);
    expect(added.body.trace).toMatchObject({ points: 21, outsideModel: false, deviationsRaised: [] });
    const trace = await clients.op.get(`/api/batches/${batch.id}/trace`);
    expect(trace.body.trace.t).toHaveLength(21);
    expect(trace.body.forecast.message).toMatch(/^Target conversion 0.95 expected in \d+ min ± \d+ min, from the trace so far/);
    // −ln(1 − 0.95)/k at k = 2.0e-3 1/s is 1497.9 s (first order, common practice).
    expect(trace.body.forecast.targetAtS).toBeCloseTo(-Math.log(0.05) / 2.0e-3, 0);
    const second = await d.upload("op", csv(2.0e-3, 22, { n: 60 }));
    await clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: second.id });
    const both = await clients.op.get(`/api/batches/${batch.id}`);
    expect(both.body.traces).toHaveLength(2);
    expect((await clients.op.get(`/api/batches/${batch.id}/trace`)).body.trace.t).toHaveLength(61);
  });

  it("raises a deviation at once when the pressure passes the relief set pressure", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await chargeAndRun(batch.id);
    const file = await d.upload("op", csv(2.0e-3, 22, { P: (time) => (time === 300 ? 9.9 : 2.0) }));
    const res = await clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: file.id });
    expect(res.body.trace.deviationsRaised).toContain("relief-pressure");
    const view = await clients.op.get(`/api/batches/${batch.id}`);
    expect(view.body.deviations.find((d: { source: string }) => d.source === "relief-pressure")).toMatchObject({ severity: "critical", status: "open" });
  });

  it("mails the batch's engineer when the trace leaves the model", async () => {
    const { batch, engineer } = await buildPlannedBatch(t.database.db);
    await chargeAndRun(batch.id);
    const file = await d.upload("op", csv(3.2e-3, 22)); // runs hot: k 60 % above the model
    const res = await clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: file.id });
    expect(res.body.trace.outsideModel).toBe(true);
    const mails = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, engineer.email));
    expect(mails.some((m) => m.subject.includes("leaves the model"))).toBe(true);
  });

  it("refuses a malformed trace file with the line of each problem, and a trace before the run", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    const early = await d.upload("op", csv(2.0e-3, 22));
    expect((await clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: early.id })).status).toBe(409);
    await chargeAndRun(batch.id);
    const broken = await d.upload("op", "time (s),volume (L)\n0,22\n30,abc\n30,22.5\n");
    const res = await clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: broken.id });
    expect(res.status).toBe(422);
    expect(res.body.error.problems.map((p: { line: number }) => p.line)).toEqual(expect.arrayContaining([3]));
    expect((await clients.op.get(`/api/batches/${batch.id}`)).body.traces).toHaveLength(0);
  });

  it("attaches a photo to a step with its hash, and records a sample", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await chargeAndRun(batch.id);
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), Buffer.from("IHDR"), Buffer.alloc(100, 3)]);
    const photo = (await clients.op.agent.post("/api/files").set("X-CSRF-Token", clients.op.csrf).attach("file", png, "gauge.png")).body.file;
    const att = await clients.op.post(`/api/batches/${batch.id}/attachments`, { fileId: photo.id, stepKey: "pressurise", note: "gauge at start" });
    expect(att.status).toBe(201);
    expect(att.body.attachment.sha256).toBe(photo.sha256);
    expect((await clients.op.post(`/api/batches/${batch.id}/attachments`, { fileId: photo.id, stepKey: "nope" })).body.error.field).toBe("stepKey");
    const sample = await clients.op.post(`/api/batches/${batch.id}/samples`, { sampledAt: now(), volume: { value: 30500, unit: "mL" }, labResult: "MON 97.1 % (GC)" });
    expect(sample.status).toBe(201);
    expect(sample.body.sample.volumeL).toBeCloseTo(30.5, 9);
    const view = (await clients.op.get(`/api/batches/${batch.id}`)).body;
    expect(view.attachments[0]).toMatchObject({ stepKey: "pressurise", file: { name: "gauge.png", sha256: photo.sha256 } });
    expect(view.samples[0].labResult).toBe("MON 97.1 % (GC)");
  });

  it("writes a sample with its audit row and live announcement, and refuses one before the run or on an unknown batch", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    const body = { sampledAt: now(), volume: { value: 30.5, unit: "L" }, labResult: "MON 97.1 % (GC)" };
    const early = await clients.op.post(`/api/batches/${batch.id}/samples`, body);
    expect(early.status).toBe(409);
    expect(early.body.error.message).toContain("it is planned");
    expect((await clients.op.post(`/api/batches/00000000-0000-4000-8000-000000000000/samples`, body)).status).toBe(404);
    await chargeAndRun(batch.id);
    expect((await clients.op.post(`/api/batches/${batch.id}/samples`, { ...body, fileId: "00000000-0000-4000-8000-000000000000" })).body.error.field).toBe("fileId");
    const { heard, stop } = await listenForChanges(t.database.pool);
    try {
      const res = await clients.op.post(`/api/batches/${batch.id}/samples`, body);
      expect(res.status).toBe(201);
      const [row] = await t.database.db.select().from(auditEvents).where(and(eq(auditEvents.action, "sample-recorded"), eq(auditEvents.entityId, batch.id)));
      expect(row.after).toEqual({ sampleId: res.body.sample.id, sampledAt: body.sampledAt, volumeL: 30.5, labResult: "MON 97.1 % (GC)", fileId: null });
      expect(row.actorId).toBe(people.op.id);
      await expect.poll(() => heard).toContainEqual(JSON.stringify({ kind: "batch", id: batch.id }));
      expect((await clients.op.get(`/api/batches/${batch.id}`)).body.samples).toHaveLength(1);
    } finally {
      stop();
    }
  });

  it("takes a batch all the way to review and tells quality", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await chargeAndRun(batch.id);
    expect((await perform("op", batch.id, "pressurise")).status).toBe(201);
    expect((await verify("sup", batch.id, "pressurise")).status).toBe(200);
    expect((await perform("op", batch.id, "runEnd")).status).toBe(201);
    expect((await d.move("op", batch.id, "START_SAMPLING")).status).toBe(200);
    expect((await perform("op", batch.id, "sampleGas")).status).toBe(201);
    const review = await d.move("op", batch.id, "SUBMIT_FOR_REVIEW");
    expect(review.status).toBe(200);
    expect(review.body.batch.state).toBe("review");
    const mails = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, people.qa.email));
    expect(mails.some((m) => m.subject.includes(`${batch.code} is ready for review`))).toBe(true);
  });
});
