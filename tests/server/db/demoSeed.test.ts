import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { seedDemo } from "../../../server/db/seed.js";
import { seedDemoMasterData } from "../../../server/db/seedMasterData.js";
import { seedDemoBatches } from "../../../server/db/seedDemoBatches.js";
import { createCredentialChecker } from "../../../server/commands/credentialChecker.js";
import { createNotifier } from "../../../server/commands/notifier.js";
import { auditEvents, batches, campaigns, people, rateModelVersions } from "../../../server/db/schema.js";
import { trainingProblem } from "../../../server/commands/trainingRecorder.js";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function seedAll() {
  const db = t.database.db;
  await seedDemo(db);
  const check = createCredentialChecker({ db, mail: t.mail, lockoutThreshold: 5, appUrl: "http://127.0.0.1:3000" });
  await seedDemoMasterData(db, check);
  await seedDemoBatches(db, { storage: t.storage, check, notify: createNotifier(t.mail, "http://127.0.0.1:3000"), uploadMaxBytes: 25e6 });
}

describe("the demo", () => {
  it("seeds campaign HF-24 with batches in every state, and a second seed changes nothing", async () => {
    await seedAll();
    const db = t.database.db;
    const [campaign] = await db.select().from(campaigns).where(eq(campaigns.code, "HF-24"));
    const states = Object.fromEntries((await db.select({ code: batches.code, state: batches.state }).from(batches).where(eq(batches.campaignId, campaign.id))).map((b) => [b.code, b.state]));
    expect(states).toEqual({
      "HF-24-B1": "released",
      "HF-24-B2": "released",
      "HF-24-B3": "released",
      "HF-24-P1": "running",
      "HF-24-P2": "review",
      "HF-24-P3": "held",
      "HF-24-F1": "planned",
      "HF-24-F2": "planned",
      "HF-24-F3": "planned",
    });
    // The people who executed the batches are trained on the campaign's master record; the second operator's training lapsed.
    const demoPerson = async (email: string) => (await db.select().from(people).where(eq(people.email, email)))[0];
    for (const email of ["operator@harrowfen.example", "supervisor@harrowfen.example", "quality@harrowfen.example"]) {
      expect(await trainingProblem(db, (await demoPerson(email)).id, campaign.masterRecordVersionId), email).toBeNull();
    }
    expect(await trainingProblem(db, (await demoPerson("operator2@harrowfen.example")).id, campaign.masterRecordVersionId)).toMatchObject({ code: "training-expired" });
    const versions = await db.select({ version: rateModelVersions.version, status: rateModelVersions.status, basedOn: rateModelVersions.basedOnBatchIds }).from(rateModelVersions).where(eq(rateModelVersions.modelId, (await db.select().from(rateModelVersions).where(eq(rateModelVersions.id, campaign.rateModelVersionId)))[0].modelId));
    expect(versions.find((v) => v.version === 2)).toMatchObject({ status: "draft" });
    expect(versions.find((v) => v.version === 2)!.basedOn).toHaveLength(3);
    const [{ n: before }] = await db.select({ n: count() }).from(auditEvents);
    await seedAll();
    const [{ n: after }] = await db.select({ n: count() }).from(auditEvents);
    expect(after).toBe(before);
  }, 120_000);
});
