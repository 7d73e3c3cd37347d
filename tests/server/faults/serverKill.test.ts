import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startOwnServices, type OwnServices } from "../../support/ownServices.js";
import { startAppProcess, type AppProcess } from "../../support/appProcess.js";
import { freePort } from "../../support/freePort.js";
import { HttpSession } from "../../support/httpSession.js";
import { bringToRunning, type Signer } from "../../support/runningBatch.js";
import { checkSampleAudit } from "../../support/sampleAudit.js";
import { buildPerson, buildPlannedBatch } from "../../factories.js";
import { createDatabase, type Database } from "../../../server/db/client.js";
import { verifyAuditChain } from "../../../server/commands/auditVerifier.js";

// The server process is killed outright (SIGKILL) while operators record samples: after a
// restart every sample it acknowledged is there with its audit row, and the chain is whole.
let services: OwnServices;
let database: Database;
let app: AppProcess | undefined;
let port: number;
let env: Record<string, string>;
beforeAll(async () => {
  services = await startOwnServices("isobatch-fault-kill-");
  database = createDatabase(services.databaseUrl);
  port = await freePort();
  env = {
    DATABASE_URL: services.databaseUrl,
    S3_ENDPOINT: services.s3Endpoint,
    SMTP_URL: services.smtpUrl,
    STORAGE_DIR: services.dir,
    SEED_DEMO: "false",
    SESSION_SECRET: "fault-test-session-secret-long-enough-0123456789",
    LOG_LEVEL: "warn",
  };
});
afterAll(async () => {
  await app?.kill("SIGTERM").catch(() => app?.kill("SIGKILL"));
  await database?.close();
  await services?.stop();
});

describe("the server process killed with SIGKILL in the middle of a load", () => {
  it("has every acknowledged sample, with its audit row, after a restart", async () => {
    const db = database.db;
    const opPerson = await buildPerson(db, { roles: ["operator"] });
    const supPerson = await buildPerson(db, { roles: ["supervisor"] });
    const { batch } = await buildPlannedBatch(db);
    app = await startAppProcess(port, env);
    const op: Signer = { person: opPerson, session: await new HttpSession(app.url).signIn(opPerson.email, opPerson.password) };
    const sup: Signer = { person: supPerson, session: await new HttpSession(app.url).signIn(supPerson.email, supPerson.password) };
    await bringToRunning(op, sup, batch.id);

    const acknowledged: string[] = [];
    const refusals: number[] = [];
    let transportErrors = 0;
    const stream = async () => {
      for (;;) {
        try {
          const res = await op.session.post(`/api/batches/${batch.id}/samples`, { sampledAt: new Date().toISOString(), volume: { value: 30.5, unit: "L" }, labResult: "MON 97.1 % (GC)" });
          if (res.status === 201) acknowledged.push(res.body.sample.id);
          else refusals.push(res.status);
        } catch {
          transportErrors++; // the server is gone
          return;
        }
      }
    };
    const streams = Array.from({ length: 8 }, stream);
    const started = Date.now();
    while (acknowledged.length < 40 && Date.now() - started < 15_000) await new Promise((r) => setTimeout(r, 50));
    await app.kill("SIGKILL");
    await Promise.all(streams);
    expect(acknowledged.length).toBeGreaterThanOrEqual(40);
    expect(refusals).toEqual([]);
    expect(transportErrors).toBe(8); // every stream was cut off by the kill

    app = await startAppProcess(port, env);
    // The session lives in PostgreSQL, so the same operator goes on after the restart.
    const again = await op.session.post(`/api/batches/${batch.id}/samples`, { sampledAt: new Date().toISOString(), volume: { value: 30.6, unit: "L" } });
    expect(again.status).toBe(201);
    acknowledged.push(again.body.sample.id);

    const report = await checkSampleAudit(db, [batch.id], acknowledged);
    expect(report.missing).toEqual([]);
    expect(report.withoutAudit).toEqual([]);
    const view = await op.session.get(`/api/batches/${batch.id}`);
    const listed = new Set(view.body.samples.map((s: { id: string }) => s.id));
    expect(acknowledged.filter((id) => !listed.has(id))).toEqual([]);
    expect(await verifyAuditChain(db)).toMatchObject({ ok: true });
  });
});
