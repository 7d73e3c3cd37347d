import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, asc, eq, like, or } from "drizzle-orm";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync, rmSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { PDFParse } from "pdf-parse";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { buildPlannedBatch } from "../../factories.js";
import { BatchDriver, firstOrderCsv } from "../../support/batchDriver.js";
import { auditEvents, batchRecordDocuments, batchTraces, batches as batchesTable, kineticsChecks, signatures, stepEntries } from "../../../server/db/schema.js";

let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  t = await startTestApp();
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("sup", ["supervisor"]);
  await d.add("qa", ["quality"]);
  await d.add("qa2", ["quality"]);
  await d.add("qaop", ["quality", "operator"]);
});
afterAll(() => t.close());

const K_MODEL = 2.0e-3; // the demo model's k at 250 °C, 1/s
const review = (batchId: string) => d.clients.qa.get(`/api/batches/${batchId}/review`);
const release = (who: string, batchId: string) => d.release(who, batchId);
const refusalCodes = (res: { body: { error?: { refusals?: { code: string }[] } } }) => (res.body.error?.refusals ?? []).map((r) => r.code).sort();
async function reviewAll(batchId: string, who = "qa") {
  for (const e of (await review(batchId)).body.exceptions.filter((x: { reviewable: boolean; reviewed: unknown }) => x.reviewable && !x.reviewed)) {
    const res = await d.clients[who].post(`/api/batches/${batchId}/review/exceptions/${encodeURIComponent(e.key)}`, { password: d.people[who].password, comment: "seen" });
    expect(res.status).toBe(200);
  }
}

describe("the kinetics gate", () => {
  it("runs the check on entering review and lets quality release a batch within the model", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    const trace = await d.runToReview(batch.id, K_MODEL);
    const r = await review(batch.id);
    expect(r.body.check).toMatchObject({ verdict: "within", reasons: [], libraryVersion: expect.any(String), traceHashes: [trace.sha256] });
    expect(r.body.check.kObserved).toBeCloseTo(K_MODEL, 8);
    expect(r.body.exceptions).toEqual([]);
    const res = await release("qa", batch.id);
    expect(res.status).toBe(200);
    expect(res.body.batch.state).toBe("released");
    const [doc] = await t.database.db.select().from(batchRecordDocuments).where(eq(batchRecordDocuments.batchId, batch.id));
    expect(doc.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(res.body.attachments.some((a: { file: { sha256: string } }) => a.file.sha256 === doc.sha256)).toBe(true);
  });

  it("refuses release while the batch is outside the model, until a closed deviation covers it", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await d.runToReview(batch.id, K_MODEL * 1.3); // runs hot
    const r = await review(batch.id);
    expect(r.body.check.verdict).toBe("outside");
    expect(r.body.check.reasons.map((x: { code: string }) => x.code)).toContain("k-outside-tolerance");
    const refused = await release("qa", batch.id);
    expect(refused.status).toBe(409);
    expect(refusalCodes(refused)).toEqual(expect.arrayContaining(["kinetics-outside", "open-deviation"]));

    const view = (await d.clients.qa.get(`/api/batches/${batch.id}`)).body;
    const dev = view.deviations.find((x: { source: string }) => x.source === "kinetics");
    expect(dev).toMatchObject({ status: "open", severity: "major" });
    await d.clients.sup.post(`/api/deviations/${dev.id}/investigate`, { rootCause: "Jacket controller read 3 K low", action: "Controller recalibrated; product tested and within specification", coversKinetics: true, revision: dev.revision });
    expect((await d.clients.qa.post(`/api/deviations/${dev.id}/close`, { password: d.people.qa.password, revision: dev.revision + 1 })).status).toBe(200);
    await reviewAll(batch.id);
    const res = await release("qa", batch.id);
    expect(res.status).toBe(200);
    expect(res.body.batch.state).toBe("released");
  });

  it("runs the check again when a new trace arrives after it", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await d.runToReview(batch.id, K_MODEL);
    const before = await t.database.db.select().from(kineticsChecks).where(eq(kineticsChecks.batchId, batch.id));
    expect(before).toHaveLength(1);
    const late = await d.upload("op", firstOrderCsv(K_MODEL, 22, { n: 80 }), "late-logger.csv");
    expect((await d.clients.op.post(`/api/batches/${batch.id}/traces`, { fileId: late.id })).status).toBe(201);
    const after = await t.database.db.select().from(kineticsChecks).where(eq(kineticsChecks.batchId, batch.id));
    expect(after).toHaveLength(2);
    expect((await review(batch.id)).body.check.traceHashes).toHaveLength(2);
  });
});

describe("review by exception", () => {
  it("puts an out-of-limit entry and a correction first, and refuses release until quality reviews them", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.move("op", batch.id, "START_CHARGING");
    await d.perform("op", batch.id, "reliefCheck");
    await d.perform("op", batch.id, "chargeDmx", { values: { dmxLot: "L7", dmxMass: 124 }, comments: { dmxMass: "over-delivered by the cylinder" } });
    await d.perform("op", batch.id, "chargeN2");
    await d.clients.op.post(`/api/batches/${batch.id}/steps/chargeN2/corrections`, { values: { n2Mass: 8.6 }, reason: "scale re-read", password: d.people.op.password });
    for (const key of ["reliefCheck", "chargeDmx"]) await d.verify("sup", batch.id, key);
    await d.move("op", batch.id, "START_RUN");
    await d.runToReview(batch.id, K_MODEL);
    const list = (await review(batch.id)).body.exceptions;
    expect(list.map((e: { kind: string }) => e.kind).sort()).toEqual(["correction", "out-of-limit"]);
    expect(list.find((e: { kind: string }) => e.kind === "out-of-limit").detail).toMatchObject({ field: "dmxMass", value: 124, comment: "over-delivered by the cylinder" });
    expect(list.find((e: { kind: string }) => e.kind === "correction").detail).toMatchObject({ reason: "scale re-read", oldValues: { n2Mass: 8.5 }, newValues: { n2Mass: 8.6 } });
    const refused = await release("qa", batch.id);
    expect(refusalCodes(refused)).toEqual(["exceptions-unreviewed"]);
    const wrong = await d.clients.qa.post(`/api/batches/${batch.id}/review/exceptions/${encodeURIComponent(list[0].key)}`, { password: "wrong" });
    expect(wrong.status).toBe(422);
    await reviewAll(batch.id);
    expect((await review(batch.id)).body.exceptions.every((e: { reviewed: { meaning: string } }) => e.reviewed.meaning === "reviewed")).toBe(true);
    expect((await release("qa", batch.id)).status).toBe(200);
  });

  it("refuses release by someone who executed steps of the batch", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id, "qaop", "sup");
    await d.runToReview(batch.id, K_MODEL, "qaop", "sup");
    const res = await release("qaop", batch.id);
    expect(res.status).toBe(409);
    expect(refusalCodes(res)).toEqual(["own-execution"]);
    expect((await release("qa2", batch.id)).status).toBe(200);
  });

  it("rejects with a reason and a signature", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await d.runToReview(batch.id, K_MODEL);
    expect((await d.move("qa", batch.id, "REJECT", { password: d.people.qa.password })).body.error.field).toBe("reason");
    const res = await d.move("qa", batch.id, "REJECT", { password: d.people.qa.password, reason: "sample bulb leaked; no valid analysis" });
    expect(res.status).toBe(200);
    expect(res.body.batch.state).toBe("rejected");
  });
});

describe("the yield", () => {
  it("opens a deviation at review when the final conversion is below the master record's limits", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await d.runToReview(batch.id, K_MODEL, "op", "sup", { n: 20 }); // stopped after 10 min: X ≈ 0.70
    const view = (await d.clients.qa.get(`/api/batches/${batch.id}`)).body;
    const dev = view.deviations.find((x: { source: string }) => x.source === "yield");
    expect(dev).toMatchObject({ status: "open", severity: "major" });
    expect(dev.description).toMatch(/0\.69\d of the theoretical; the master record accepts 0\.93 to 1\.02/);
    expect(refusalCodes(await release("qa", batch.id))).toContain("open-deviation");
  });
});

describe("the executed batch record", () => {
  it("is a PDF whose text holds the signatures and the verdict, and whose first page renders", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await d.runToReview(batch.id, K_MODEL);
    await release("qa", batch.id);
    const res = await d.clients.qa.get(`/api/batches/${batch.id}/record.pdf`).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on("data", (c: Buffer) => parts.push(c));
      r.on("end", () => cb(null, Buffer.concat(parts)));
    });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    const pdf = res.body as Buffer;
    const text = (await new PDFParse({ data: new Uint8Array(pdf) }).getText()).text.replace(/\s+/g, " ");
    expect(text).toContain(`Executed batch record — ${batch.code}`);
    expect(text).toContain(`Signed performed by ${d.people.op.name}`);
    expect(text).toContain(`Signed verified by ${d.people.sup.name}`);
    expect(text).toContain(`Signed released by ${d.people.qa.name}`);
    expect(text).toContain("Verdict: within the model");
    expect(text).toMatch(/SHA-256 [0-9a-f]{64}/);
    expect(text).toContain("Audit trail of this batch");
    // Rendered with pdftoppm (Debian's poppler-utils) to PNG, as a person would look at it.
    const dir = mkdtempSync(join(tmpdir(), "isobatch-pdf-"));
    try {
      writeFileSync(join(dir, "record.pdf"), pdf);
      execFileSync("pdftoppm", ["-png", "-r", "60", "-f", "1", "-l", "1", join(dir, "record.pdf"), join(dir, "page")]);
      const png = readdirSync(dir).find((f) => f.endsWith(".png"))!;
      const bytes = readFileSync(join(dir, png));
      expect(bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))).toBe(true);
      expect(bytes.length).toBeGreaterThan(5000);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe("the complete record as JSON", () => {
  it("holds every entry version, signature, audit row and file hash, exactly as in the database", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    await d.clients.op.post(`/api/batches/${batch.id}/steps/chargeN2/corrections`, { values: { n2Mass: 8.6 }, reason: "scale re-read", password: d.people.op.password });
    await d.runToReview(batch.id, K_MODEL);
    const res = await d.clients.qa.get(`/api/batches/${batch.id}/record.json`);
    expect(res.status).toBe(200);
    const json = JSON.parse(JSON.stringify(res.body));
    const db = t.database.db;
    const entries = await db.select().from(stepEntries).where(eq(stepEntries.batchId, batch.id));
    expect(json.entries).toHaveLength(entries.length);
    for (const e of entries) expect(json.entries.find((x: { id: string }) => x.id === e.id)).toEqual(JSON.parse(JSON.stringify(e)));
    const sigs = await db.select().from(signatures).where(or(and(eq(signatures.entityType, "batch"), eq(signatures.entityId, batch.id)), like(signatures.entityId, `${batch.id}/%`)));
    expect(json.signatures.map((s: { id: string }) => s.id).sort()).toEqual(sigs.map((s) => s.id).sort());
    for (const s of sigs) expect(json.signatures.find((x: { id: string }) => x.id === s.id)).toEqual(JSON.parse(JSON.stringify(s)));
    const audit = await db.select().from(auditEvents).where(or(eq(auditEvents.entityId, batch.id), like(auditEvents.entityId, `${batch.id}/%`))).orderBy(asc(auditEvents.seq));
    expect(json.audit).toEqual(JSON.parse(JSON.stringify(audit)));
    const traces = await db.select({ sha256: batchTraces.sha256 }).from(batchTraces).where(eq(batchTraces.batchId, batch.id));
    expect(json.traces.map((x: { sha256: string }) => x.sha256)).toEqual(traces.map((x) => x.sha256));
    expect(json.batch).toEqual(JSON.parse(JSON.stringify((await db.select().from(batchesTable).where(eq(batchesTable.id, batch.id)))[0])));
  });
});
