import type { RouteContext } from "../../services/types.js";
import type { PolicyRouter } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import type { BatchReviewer } from "../../commands/batchReviewer.js";
import { combinedTrace } from "../../commands/batchTrace.js";
import { loadBatchRecord } from "../../commands/batchRecord.js";
import { SignatureSchema } from "../../../shared/schemas/common.js";
import { batchRecordJson } from "../../commands/batchRecordJson.js";
import { batchYield } from "../../commands/yieldCheck.js";
import { kineticsChecks } from "../../db/schema.js";
import { asc, eq } from "drizzle-orm";
import { createsRecord, signsRecord } from "../../http/recordEffects.js";

const presentCheck = (c: NonNullable<Awaited<ReturnType<BatchReviewer["review"]>>["check"]>) => ({
  id: c.id,
  verdict: c.verdict,
  reasons: c.reasons,
  kObserved: c.kObserved,
  kObservedCI95: [c.kObservedLow, c.kObservedHigh],
  kModel: c.kModel,
  deviationPct: c.deviationPct,
  residualRms: c.residualRms,
  points: c.points,
  maxConversion: c.maxConversion,
  libraryVersion: c.libraryVersion,
  traceHashes: c.traceHashes,
  rateModelVersionId: c.rateModelVersionId,
  ranAt: c.ranAt.toISOString(),
  result: c.result,
});

/** The review routes of /api/batches: exceptions, the kinetics check, the executed record, trace export. */
export function reviewRoutes(r: PolicyRouter, ctx: RouteContext, reviewer: BatchReviewer, view: (id: string, person: SignedInPerson) => Promise<unknown>) {
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  r.get("/:id/review", signedIn, async (req, res) => {
    const { check, exceptions } = await reviewer.review(idParam(req));
    res.json({ check: check ? presentCheck(check) : null, exceptions });
  });
  r.post("/:id/review/exceptions/:key", allow("quality"), signsRecord, validate(SignatureSchema), async (req, res) => {
    const id = idParam(req);
    await reviewer.markReviewed(me(req), id, String(req.params.key).slice(0, 200), req.body.password, req.body.comment);
    const { check, exceptions } = await reviewer.review(id);
    res.json({ check: check ? presentCheck(check) : null, exceptions });
  });
  r.post("/:id/kinetics-check", allow("quality", "engineer"), createsRecord, async (req, res) => {
    const id = idParam(req);
    const row = await reviewer.rerunCheck(me(req), id);
    res.status(201).json({ check: presentCheck(row), batch: await view(id, me(req)) });
  });
  r.get("/:id/record.pdf", signedIn, async (req, res) => {
    const id = idParam(req);
    const { batch } = await loadBatchRecord(ctx.db, id);
    const pdf = await reviewer.recordPdf(id);
    res.set({ "Content-Type": "application/pdf", "Content-Disposition": `inline; filename="${batch.code}-executed-record.pdf"`, "Content-Length": String(pdf.length) }).send(pdf);
  });
  r.get("/:id/record.json", signedIn, async (req, res) => {
    const id = idParam(req);
    const record = await loadBatchRecord(ctx.db, id);
    const checks = await ctx.db.select().from(kineticsChecks).where(eq(kineticsChecks.batchId, id)).orderBy(asc(kineticsChecks.ranAt));
    res.set("Content-Disposition", `attachment; filename="${record.batch.code}-record.json"`).json({ ...(await batchRecordJson(ctx.db, record, checks)), yield: await batchYield(ctx.db, record) });
  });
  r.get("/:id/trace.csv", signedIn, async (req, res) => {
    const id = idParam(req);
    const { batch } = await loadBatchRecord(ctx.db, id);
    const trace = await combinedTrace(ctx.db, id);
    const rows = ["time (s),volume (L),temperature (K),pressure (Pa)"];
    for (let i = 0; i < trace.t.length; i++) rows.push([trace.t[i], trace.V[i], trace.T?.[i] ?? "", trace.P?.[i] ?? ""].join(","));
    res.set({ "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="${batch.code}-trace.csv"` }).send(rows.join("\n") + "\n");
  });
}
