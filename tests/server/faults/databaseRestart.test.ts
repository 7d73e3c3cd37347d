import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { startOwnServices, type OwnServices } from "../../support/ownServices.js";
import { BatchDriver } from "../../support/batchDriver.js";
import { buildPlannedBatch } from "../../factories.js";
import { checkSampleAudit } from "../../support/sampleAudit.js";
import { verifyAuditChain } from "../../../server/commands/auditVerifier.js";

// PostgreSQL restarted under a stream of sample recordings: each request either succeeds or
// fails cleanly with 503, the app reconnects by itself, and nothing is half-written.
let services: OwnServices;
let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  services = await startOwnServices("isobatch-fault-db-");
  t = await startTestApp({ databaseUrl: services.databaseUrl, s3Endpoint: services.s3Endpoint, smtpUrl: services.smtpUrl, bucket: "isobatch-fault-db" });
  await t.storage.ensureBucket();
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("sup", ["supervisor"]);
});
afterAll(async () => {
  await t?.close();
  await services?.stop();
});

interface Answer {
  status: number;
  body: any;
  text: string;
  at: "before" | "down" | "after";
}

describe("PostgreSQL restarted in the middle of a stream of requests", () => {
  it("answers 503 database-unavailable while it is down, reconnects by itself, and leaves no half-written sample", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    await d.chargeAndRun(batch.id);
    const answers: Answer[] = [];
    let phase: Answer["at"] = "before";
    let running = true;
    let recoveredAt = 0;
    const sample = () => ({ sampledAt: new Date().toISOString(), volume: { value: 30.5, unit: "L" }, labResult: "MON 97.1 % (GC)" });
    const stream = async () => {
      while (running) {
        const res = await d.clients.op.post(`/api/batches/${batch.id}/samples`, sample());
        answers.push({ status: res.status, body: res.body, text: res.text, at: phase });
        if (phase === "after" && res.status === 201 && !recoveredAt) recoveredAt = Date.now();
        if (res.status !== 201) await new Promise((r) => setTimeout(r, 50));
      }
    };
    const streams = Array.from({ length: 4 }, stream);

    await new Promise((r) => setTimeout(r, 800));
    phase = "down";
    await services.stopPostgres();
    await new Promise((r) => setTimeout(r, 1500));
    await services.startPostgres();
    phase = "after";
    const restartedAt = Date.now();
    while (!recoveredAt && Date.now() - restartedAt < 30_000) await new Promise((r) => setTimeout(r, 100));
    await new Promise((r) => setTimeout(r, 300));
    running = false;
    await Promise.all(streams);

    const byPhase = (at: Answer["at"]) => answers.filter((a) => a.at === at);
    expect(byPhase("before").filter((a) => a.status === 201).length).toBeGreaterThan(0);
    const refused = answers.filter((a) => a.status !== 201);
    expect(refused.length).toBeGreaterThan(0); // the outage was seen
    for (const a of refused) {
      expect(a.status).toBe(503);
      expect(a.body.error.code).toBe("database-unavailable");
      expect(a.text).not.toMatch(/\bat .+:\d+:\d+|node_modules|stack/i);
    }
    expect(recoveredAt, "a request succeeds again after PostgreSQL is back, without restarting the app").toBeGreaterThan(0);
    expect(byPhase("after").at(-1)?.status).toBe(201);

    const acknowledged = answers.filter((a) => a.status === 201).map((a) => a.body.sample.id as string);
    const report = await checkSampleAudit(t.database.db, [batch.id], acknowledged);
    expect(report.missing).toEqual([]);
    expect(report.withoutAudit).toEqual([]);
    expect(report.stored).toBeGreaterThanOrEqual(acknowledged.length);
    const chain = await verifyAuditChain(t.database.db);
    expect(chain).toMatchObject({ ok: true });
  });
});
