import { eq } from "drizzle-orm";
import type { Db, DbOrTx } from "../db/client.js";
import { batches, campaigns, masterRecordVersions, rateModelVersions, vessels } from "../db/schema.js";
import { recordAudit, type Actor } from "./audit.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import { planBatch } from "../../shared/planning/batchPlan.js";
import type { BatchPlanInput, CampaignCreateInput } from "../../shared/schemas/campaigns.js";
import type { MasterRecordContent } from "../../shared/schemas/masterRecords.js";

async function loadCampaignParts(db: DbOrTx, campaignId: string) {
  const [campaign] = await db.select().from(campaigns).where(eq(campaigns.id, campaignId));
  if (!campaign) throw notFound("That campaign");
  const [model] = await db.select().from(rateModelVersions).where(eq(rateModelVersions.id, campaign.rateModelVersionId));
  const [record] = await db.select().from(masterRecordVersions).where(eq(masterRecordVersions.id, campaign.masterRecordVersionId));
  return { campaign, model, record };
}

/** Creates campaigns on approved versions and plans their batches, refusing unsafe plans. */
export function createBatchPlanner(db: Db) {
  async function preview(campaignId: string, input: Omit<BatchPlanInput, "code">, tx: DbOrTx = db) {
    const { campaign, model, record } = await loadCampaignParts(tx, campaignId);
    const [vessel] = await tx.select().from(vessels).where(eq(vessels.id, input.vesselId));
    if (!vessel) throw new HttpError(422, "unknown-vessel", "vesselId: no vessel has this id.", "vesselId");
    const plan = planBatch(input, vessel, { epsilonA: model.epsilonA, yA0: model.yA0 }, record.content as MasterRecordContent);
    return { campaign, model, record, vessel, plan };
  }

  return {
    preview,
    async createCampaign(actor: Actor, input: CampaignCreateInput) {
      return db.transaction(async (tx) => {
        const [model] = await tx.select().from(rateModelVersions).where(eq(rateModelVersions.id, input.rateModelVersionId));
        if (!model) throw new HttpError(422, "unknown-rate-model", "rateModelVersionId: no rate-model version has this id.", "rateModelVersionId");
        if (model.status !== "approved") throw new HttpError(422, "rate-model-not-approved", `rateModelVersionId: version ${model.version} is ${model.status}; a campaign runs on an approved version.`, "rateModelVersionId");
        const [record] = await tx.select().from(masterRecordVersions).where(eq(masterRecordVersions.id, input.masterRecordVersionId));
        if (!record) throw new HttpError(422, "unknown-master-record", "masterRecordVersionId: no master-record version has this id.", "masterRecordVersionId");
        if (record.status !== "approved") throw new HttpError(422, "master-record-not-approved", `masterRecordVersionId: version ${record.version} is ${record.status}; a campaign runs on an approved version.`, "masterRecordVersionId");
        const [row] = await tx.insert(campaigns).values({ ...input, createdBy: actor.id! }).onConflictDoNothing({ target: campaigns.code }).returning();
        if (!row) throw conflict("code-taken", `A campaign coded ${input.code} exists already.`);
        await recordAudit(tx, actor, { action: "campaign-created", entityType: "campaign", entityId: row.id, after: input });
        return row;
      });
    },
    async planBatch(actor: Actor, campaignId: string, input: BatchPlanInput) {
      return db.transaction(async (tx) => {
        const { model, record, vessel, plan } = await preview(campaignId, input, tx);
        if (plan.problems.length > 0) {
          throw new HttpError(422, "plan-refused", plan.problems.map((p) => p.message).join(" "), plan.problems[0].field, { problems: plan.problems, plan });
        }
        const [row] = await tx
          .insert(batches)
          .values({
            code: input.code,
            campaignId,
            vesselId: vessel.id,
            masterRecordVersionId: record.id,
            rateModelVersionId: model.id,
            v0L: plan.v0L,
            temperatureK: plan.temperatureK,
            pressurePa: plan.pressurePa,
            entered: { v0: input.v0, temperature: input.temperature, pressure: input.pressure },
            plan,
            createdBy: actor.id!,
          })
          .onConflictDoNothing({ target: batches.code })
          .returning();
        if (!row) throw conflict("code-taken", `A batch coded ${input.code} exists already.`);
        await recordAudit(tx, actor, { action: "batch-planned", entityType: "batch", entityId: row.id, after: { code: row.code, campaignId, vessel: vessel.tag, plan, pinned: { masterRecordVersionId: record.id, rateModelVersionId: model.id } } });
        return row;
      });
    },
  };
}
