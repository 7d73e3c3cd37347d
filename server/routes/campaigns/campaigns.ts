import { asc, desc, eq, inArray } from "drizzle-orm";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { notFound } from "../../http/errors.js";
import { batches, campaigns, masterRecordVersions, masterRecords, rateModelVersions, rateModels, vessels } from "../../db/schema.js";
import { createBatchPlanner } from "../../commands/batchPlanner.js";
import { campaignTrends } from "../../commands/campaignTrends.js";
import { BatchPlanSchema, CampaignCreateSchema } from "../../../shared/schemas/campaigns.js";
import { computesOnly, createsRecord } from "../../http/recordEffects.js";

const planners = (p: SignedInPerson) => p.roles.includes("engineer") || p.roles.includes("supervisor");

/** /api/campaigns: campaigns on approved versions, and their planned batches. */
export function campaignRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/campaigns", registry);
  const planner = createBatchPlanner(ctx.db);
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  async function present(rows: (typeof campaigns.$inferSelect)[], viewer: SignedInPerson) {
    if (rows.length === 0) return [];
    const ids = rows.map((c) => c.id);
    const models = await ctx.db.select({ id: rateModelVersions.id, version: rateModelVersions.version, status: rateModelVersions.status, code: rateModels.code, epsilonA: rateModelVersions.epsilonA }).from(rateModelVersions).innerJoin(rateModels, eq(rateModels.id, rateModelVersions.modelId)).where(inArray(rateModelVersions.id, rows.map((c) => c.rateModelVersionId)));
    const records = await ctx.db.select({ id: masterRecordVersions.id, version: masterRecordVersions.version, status: masterRecordVersions.status, code: masterRecords.code }).from(masterRecordVersions).innerJoin(masterRecords, eq(masterRecords.id, masterRecordVersions.masterRecordId)).where(inArray(masterRecordVersions.id, rows.map((c) => c.masterRecordVersionId)));
    const planned = await ctx.db.select({ b: batches, vesselTag: vessels.tag }).from(batches).innerJoin(vessels, eq(vessels.id, batches.vesselId)).where(inArray(batches.campaignId, ids)).orderBy(asc(batches.createdAt));
    return rows.map((c) => ({
      id: c.id,
      code: c.code,
      process: c.process,
      createdAt: c.createdAt.toISOString(),
      rateModel: models.find((m) => m.id === c.rateModelVersionId),
      masterRecord: records.find((m) => m.id === c.masterRecordVersionId),
      batches: planned
        .filter((p) => p.b.campaignId === c.id)
        .map(({ b, vesselTag }) => ({ id: b.id, code: b.code, state: b.state, vesselId: b.vesselId, vesselTag, v0L: b.v0L, temperatureK: b.temperatureK, pressurePa: b.pressurePa, entered: b.entered, plan: b.plan, createdAt: b.createdAt.toISOString() })),
      abilities: { planBatch: planners(viewer) },
    }));
  }

  r.get("/", signedIn, async (req, res) => {
    res.json({ campaigns: await present(await ctx.db.select().from(campaigns).orderBy(desc(campaigns.createdAt)), me(req)) });
  });
  r.post("/", allow("engineer"), createsRecord, validate(CampaignCreateSchema), async (req, res) => {
    const row = await planner.createCampaign(me(req), req.body);
    res.status(201).json({ campaign: (await present([row], me(req)))[0] });
  });
  r.get("/:id", signedIn, async (req, res) => {
    const rows = await ctx.db.select().from(campaigns).where(eq(campaigns.id, idParam(req)));
    if (rows.length === 0) throw notFound("That campaign");
    res.json({ campaign: (await present(rows, me(req)))[0] });
  });
  r.post("/:id/plan-preview", allow("engineer", "supervisor"), computesOnly, validate(BatchPlanSchema.omit({ code: true })), async (req, res) => {
    const { plan } = await planner.preview(idParam(req), req.body);
    res.json({ plan });
  });
  r.post("/:id/batches", allow("engineer", "supervisor"), createsRecord, validate(BatchPlanSchema), async (req, res) => {
    const row = await planner.planBatch(me(req), idParam(req), req.body);
    res.status(201).json({ batch: { id: row.id, code: row.code, state: row.state, plan: row.plan } });
  });
  r.get("/:id/trends", signedIn, async (req, res) => {
    res.json(await campaignTrends(ctx.db, idParam(req)));
  });
  r.get("/:id/results.csv", signedIn, async (req, res) => {
    const trends = await campaignTrends(ctx.db, idParam(req));
    const rows = ["batch,vessel,v0 (L),state,temperature (K),k observed,k low 95%,k high 95%,k model at T,deviation (%),verdict"];
    for (const b of trends.batches) rows.push([b.code, b.vesselTag, b.v0L, b.state, b.temperatureK.toFixed(3), b.check?.kObserved ?? "", b.check?.kObservedCI95[0] ?? "", b.check?.kObservedCI95[1] ?? "", b.kModelAtT, b.check?.deviationPct ?? "", b.check?.verdict ?? "not checked"].join(","));
    res.set({ "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="${trends.campaign.code}-results.csv"` }).send(rows.join("\n") + "\n");
  });
  return r;
}
