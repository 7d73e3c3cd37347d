import { and, desc, eq } from "drizzle-orm";
import { z } from "zod";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { parseQuery, validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { batches, campaigns, vessels } from "../../db/schema.js";
import { loadBatchRecord } from "../../commands/batchRecord.js";
import { createBatchTransitioner } from "../../commands/batchTransitioner.js";
import { createStepRecorder } from "../../commands/stepRecorder.js";
import { createDeviationRecorder } from "../../commands/deviationRecorder.js";
import { createBatchFiles } from "../../commands/batchFiles.js";
import { combinedTrace } from "../../commands/batchTrace.js";
import { presentBatch } from "./presenter.js";
import { AttachmentAddSchema, BatchEventSchema, DeviationRaiseSchema, SampleRecordSchema, StepCorrectSchema, StepPerformSchema, StepVerifySchema, TraceAddSchema } from "../../../shared/schemas/batches.js";
import { BATCH_STATES } from "../../../shared/machines/batchMoves.js";
import { predictVolume } from "../../../shared/kinetics/prediction.js";
import { checkConditionsFor, modelKAt } from "../../../shared/execution/modelAtBatch.js";
import { forecastTarget } from "../../../shared/execution/forecast.js";
import { createBatchReviewer } from "../../commands/batchReviewer.js";
import { reviewRoutes } from "./review.js";
import { changesRecord, createsRecord, movesBatch, signsRecord } from "../../http/recordEffects.js";

const ListQuery = z.object({ state: z.enum(BATCH_STATES).optional(), campaignId: z.uuid().optional() });
const stepKey = (req: { params: Record<string, unknown> }) => String(req.params.stepKey).slice(0, 40);

/** /api/batches: the batch page, its lifecycle moves, step entries, deviations, files, trace and samples. */
export function batchRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/batches", registry);
  const deps = { db: ctx.db, check: ctx.checkCredentials, notify: ctx.notify };
  const reviewer = createBatchReviewer({ ...deps, storage: ctx.storage });
  const gate = reviewer.gate;
  const applyMove = createBatchTransitioner({ ...deps, gate, afterMove: reviewer.afterMove });
  const steps = createStepRecorder(deps);
  const deviationRecorder = createDeviationRecorder(deps);
  const filesOf = createBatchFiles({ db: ctx.db, storage: ctx.storage, notify: ctx.notify });
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;
  const view = async (id: string, person: SignedInPerson) => {
    const record = await loadBatchRecord(ctx.db, id);
    return presentBatch(ctx.db, record, person, gate ? await gate.factsFor(ctx.db, record) : undefined);
  };
  const onBatch = allow("operator", "supervisor", "quality", "engineer");

  r.get("/", signedIn, async (req, res) => {
    const q = parseQuery(ListQuery, req.query);
    const rows = await ctx.db
      .select({ id: batches.id, code: batches.code, state: batches.state, revision: batches.revision, v0L: batches.v0L, campaignId: batches.campaignId, campaignCode: campaigns.code, vesselTag: vessels.tag, createdAt: batches.createdAt })
      .from(batches)
      .innerJoin(campaigns, eq(campaigns.id, batches.campaignId))
      .innerJoin(vessels, eq(vessels.id, batches.vesselId))
      .where(and(q.state ? eq(batches.state, q.state) : undefined, q.campaignId ? eq(batches.campaignId, q.campaignId) : undefined))
      .orderBy(desc(batches.createdAt));
    res.json({ batches: rows.map((b) => ({ ...b, createdAt: b.createdAt.toISOString() })) });
  });
  r.get("/:id", signedIn, async (req, res) => {
    res.json(await view(idParam(req), me(req)));
  });
  r.post("/:id/events", onBatch, movesBatch, validate(BatchEventSchema), async (req, res) => {
    const id = idParam(req);
    await applyMove(me(req), id, req.body);
    res.json(await view(id, me(req)));
  });
  r.post("/:id/steps/:stepKey/entries", allow("operator", "supervisor", "quality"), createsRecord, validate(StepPerformSchema), async (req, res) => {
    const id = idParam(req);
    await steps.perform(me(req), id, stepKey(req), req.body);
    res.status(201).json(await view(id, me(req)));
  });
  r.post("/:id/steps/:stepKey/corrections", allow("operator", "supervisor", "quality"), changesRecord, validate(StepCorrectSchema), async (req, res) => {
    const id = idParam(req);
    await steps.correct(me(req), id, stepKey(req), req.body);
    res.status(201).json(await view(id, me(req)));
  });
  r.post("/:id/steps/:stepKey/verify", allow("supervisor"), signsRecord, validate(StepVerifySchema), async (req, res) => {
    const id = idParam(req);
    await steps.verify(me(req), id, stepKey(req), req.body.password, req.body.comment);
    res.json(await view(id, me(req)));
  });
  r.post("/:id/deviations", onBatch, createsRecord, validate(DeviationRaiseSchema), async (req, res) => {
    const id = idParam(req);
    const deviation = await deviationRecorder.raise(me(req), id, req.body);
    res.status(201).json({ deviation: { id: deviation.id, status: deviation.status, revision: deviation.revision } });
  });
  r.post("/:id/attachments", onBatch, createsRecord, validate(AttachmentAddSchema), async (req, res) => {
    const id = idParam(req);
    const added = await filesOf.attach(me(req), id, req.body);
    res.status(201).json({ attachment: { id: added.id, fileId: added.fileId, sha256: added.file.sha256 } });
  });
  r.post("/:id/traces", allow("operator", "supervisor", "engineer"), createsRecord, validate(TraceAddSchema), async (req, res) => {
    res.status(201).json({ trace: await filesOf.addTrace(me(req), idParam(req), req.body) });
  });
  r.post("/:id/samples", allow("operator", "supervisor"), createsRecord, validate(SampleRecordSchema), async (req, res) => {
    const sample = await filesOf.recordSample(me(req), idParam(req), req.body);
    res.status(201).json({ sample: { id: sample.id, volumeL: sample.volumeL, sampledAt: sample.sampledAt.toISOString() } });
  });
  r.get("/:id/trace", signedIn, async (req, res) => {
    const id = idParam(req);
    const record = await loadBatchRecord(ctx.db, id);
    const trace = await combinedTrace(ctx.db, id);
    const { batch, model, masterRecord } = record;
    const conditions = checkConditionsFor(batch, model.yA0);
    const kModel = modelKAt(model.content, batch.temperatureK);
    const modelAt = { order: model.content.order, k: kModel, epsilonA: model.epsilonA, V0: batch.v0L, cA0: conditions.cA0 };
    const predicted = trace.t.length ? Array.from(predictVolume(modelAt, trace.t)) : [];
    const forecast = forecastTarget({ trace, order: model.content.order, epsilonA: model.epsilonA, v0L: batch.v0L, cA0: conditions.cA0!, kModel, targetConversion: masterRecord.content.targetConversion });
    res.json({ trace: { t: trace.t, V: trace.V, T: trace.T ?? null, P: trace.P ?? null, files: trace.files }, predicted, kModel, forecast });
  });
  reviewRoutes(r, ctx, reviewer, view);
  return r;
}
