import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { startOwnServices, type OwnServices } from "../../support/ownServices.js";
import { BatchDriver } from "../../support/batchDriver.js";
import { buildPlannedBatch } from "../../factories.js";
import { auditEvents, signatures } from "../../../server/db/schema.js";
import { STEP_ENTITY, stepEntityId } from "../../../server/commands/batchRecord.js";

// Two supervisors sign "verified" on the same critical step at the same moment: the batch row
// lock decides; one signature stands and the other person is told it is already verified.
let services: OwnServices;
let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  services = await startOwnServices("isobatch-fault-verify-");
  t = await startTestApp({ databaseUrl: services.databaseUrl, s3Endpoint: services.s3Endpoint, smtpUrl: services.smtpUrl, bucket: "isobatch-fault-verify" });
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("supA", ["supervisor"]);
  await d.add("supB", ["supervisor"]);
});
afterAll(async () => {
  await t?.close();
  await services?.stop();
});

describe("two supervisors verifying the same critical step at once", () => {
  it("keeps exactly one verified signature; the other supervisor gets 409 already-verified", async () => {
    // Several rounds, so the two requests really overlap in at least some of them.
    for (let round = 0; round < 5; round++) {
      const { batch } = await buildPlannedBatch(t.database.db);
      expect((await d.move("op", batch.id, "START_CHARGING")).status).toBe(200);
      expect((await d.perform("op", batch.id, "reliefCheck")).status).toBe(201);

      const [a, b] = await Promise.all([d.verify("supA", batch.id, "reliefCheck"), d.verify("supB", batch.id, "reliefCheck")]);
      const statuses = [a.status, b.status].sort();
      expect(statuses).toEqual([200, 409]);
      const loser = a.status === 409 ? a : b;
      expect(loser.body.error.code).toBe("already-verified");

      const entity = and(eq(signatures.entityType, STEP_ENTITY), eq(signatures.entityId, stepEntityId(batch.id, "reliefCheck")), eq(signatures.meaning, "verified"));
      const verified = await t.database.db.select().from(signatures).where(entity);
      expect(verified).toHaveLength(1);
      const winner = a.status === 200 ? d.people.supA : d.people.supB;
      expect(verified[0].signerId).toBe(winner.id);
      const audited = await t.database.db.select().from(auditEvents).where(and(eq(auditEvents.action, "signed-verified"), eq(auditEvents.entityId, stepEntityId(batch.id, "reliefCheck"))));
      expect(audited).toHaveLength(1);
    }
  });
});
