import { eq, inArray } from "drizzle-orm";
import type { Db } from "./client.js";
import { campaigns, masterRecords, people, rateModels, vessels } from "./schema.js";
import { createVesselRegistrar } from "../commands/vesselRegistrar.js";
import { createVersionedDocuments } from "../commands/versionedDocuments.js";
import { rateModelKind } from "../commands/rateModelKind.js";
import { masterRecordKind } from "../commands/masterRecordKind.js";
import { createBatchPlanner } from "../commands/batchPlanner.js";
import type { CheckCredentials } from "../commands/credentialChecker.js";
import { toSignedInPerson } from "../http/session.js";
import { DEMO_PASSWORD } from "./seed.js";
import { DEMO_CAMPAIGN, DEMO_MASTER_RECORD, DEMO_MASTER_RECORD_DRAFT, DEMO_RATE_MODEL, DEMO_VESSELS } from "./demoScenario.js";

/**
 * Seeds the demo's master data through the same commands people use: the engineer registers
 * and drafts, quality approves with a real password signature. Skips whatever exists already.
 */
export async function seedDemoMasterData(db: Db, check: CheckCredentials): Promise<void> {
  const rows = await db.select().from(people).where(inArray(people.email, ["engineer@harrowfen.example", "quality@harrowfen.example"]));
  const engineerRow = rows.find((r) => r.email.startsWith("engineer"));
  const qualityRow = rows.find((r) => r.email.startsWith("quality"));
  if (!engineerRow || !qualityRow) return;
  const engineer = toSignedInPerson(engineerRow);
  const quality = toSignedInPerson(qualityRow);

  const registrar = createVesselRegistrar(db);
  for (const v of DEMO_VESSELS) {
    if (!(await db.query.vessels.findFirst({ where: eq(vessels.tag, v.tag) }))) await registrar.register(engineer, v);
  }

  const models = createVersionedDocuments(db, check, rateModelKind);
  if (!(await db.query.rateModels.findFirst({ where: eq(rateModels.code, DEMO_RATE_MODEL.code) }))) {
    const v1 = await models.createFamily(engineer, DEMO_RATE_MODEL);
    await models.approve(quality, v1.id, DEMO_PASSWORD, "Approved for campaign HF-24 (demo).");
  }
  const records = createVersionedDocuments(db, check, masterRecordKind);
  if (!(await db.query.masterRecords.findFirst({ where: eq(masterRecords.code, DEMO_MASTER_RECORD.code) }))) {
    const v1 = await records.createFamily(engineer, DEMO_MASTER_RECORD);
    await records.approve(quality, v1.id, DEMO_PASSWORD, "Approved for campaign HF-24 (demo).");
    await records.createDraft(engineer, v1.familyId, DEMO_MASTER_RECORD_DRAFT);
  }

  if (await db.query.campaigns.findFirst({ where: eq(campaigns.code, DEMO_CAMPAIGN.code) })) return;
  const approvedModel = (await models.list(engineer)).find((v) => v.code === DEMO_RATE_MODEL.code && v.status === "approved")!;
  const approvedRecord = (await records.list(engineer)).find((v) => v.code === DEMO_MASTER_RECORD.code && v.status === "approved")!;
  const planner = createBatchPlanner(db);
  const campaign = await planner.createCampaign(engineer, { code: DEMO_CAMPAIGN.code, process: DEMO_CAMPAIGN.process, masterRecordVersionId: approvedRecord.id, rateModelVersionId: approvedModel.id });
  const vesselRows = await db.select().from(vessels);
  for (const { vesselTag, ...plan } of DEMO_CAMPAIGN.batches) {
    await planner.planBatch(engineer, campaign.id, { ...plan, vesselId: vesselRows.find((v) => v.tag === vesselTag)!.id });
  }
}
