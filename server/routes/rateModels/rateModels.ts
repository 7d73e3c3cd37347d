import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { createVersionedDocuments, type VersionView } from "../../commands/versionedDocuments.js";
import { rateModelKind } from "../../commands/rateModelKind.js";
import { RateModelCreateSchema, RateModelDraftSchema, RateModelDraftUpdateSchema, rateConstantUnit, type RateModelContent, type RateModelVersionView } from "../../../shared/schemas/rateModels.js";
import { SignatureSchema } from "../../../shared/schemas/common.js";
import { ModelProposalSchema } from "../../../shared/schemas/rateModels.js";
import { proposeModelUpdate } from "../../commands/modelProposer.js";
import { changesRecord, createsRecord, signsRecord } from "../../http/recordEffects.js";

/** The API's view of a rate-model version. */
export function presentRateModel(v: VersionView<RateModelContent>): RateModelVersionView {
  const { row, familyId, ...rest } = v;
  return {
    ...rest,
    modelId: familyId,
    derived: { epsilonA: Number(row.epsilonA), delta: Number(row.delta), yA0: Number(row.yA0), kUnit: rateConstantUnit(v.content.order) },
    basedOnBatchIds: (row.basedOnBatchIds as string[]) ?? [],
  };
}

/** /api/rate-models: engineers draft, quality approves with a signature. */
export function rateModelRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/rate-models", registry);
  const docs = createVersionedDocuments(ctx.db, ctx.checkCredentials, rateModelKind);
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  r.get("/", signedIn, async (req, res) => {
    res.json({ versions: (await docs.list(me(req))).map(presentRateModel) });
  });
  r.post("/", allow("engineer"), createsRecord, validate(RateModelCreateSchema), async (req, res) => {
    res.status(201).json({ version: presentRateModel(await docs.createFamily(me(req), req.body)) });
  });
  r.get("/:id/versions", signedIn, async (req, res) => {
    res.json({ versions: (await docs.versionsOf(idParam(req), me(req))).map(presentRateModel) });
  });
  r.post("/:id/versions", allow("engineer"), createsRecord, validate(RateModelDraftSchema), async (req, res) => {
    res.status(201).json({ version: presentRateModel(await docs.createDraft(me(req), idParam(req), req.body.content)) });
  });
  r.get("/versions/:id", signedIn, async (req, res) => {
    res.json({ version: presentRateModel(await docs.get(idParam(req), me(req))) });
  });
  r.put("/versions/:id", allow("engineer"), changesRecord, validate(RateModelDraftUpdateSchema), async (req, res) => {
    res.json({ version: presentRateModel(await docs.updateDraft(me(req), idParam(req), req.body.content, req.body.reason, req.body.revision)) });
  });
  r.post("/versions/:id/approve", allow("quality"), signsRecord, validate(SignatureSchema), async (req, res) => {
    res.json({ version: presentRateModel(await docs.approve(me(req), idParam(req), req.body.password, req.body.comment)) });
  });
  r.post("/versions/:id/proposal", allow("engineer"), createsRecord, validate(ModelProposalSchema), async (req, res) => {
    const result = await proposeModelUpdate(ctx.db, docs, me(req), idParam(req), req.body.batchIds, req.body.save);
    res.status(result.draft ? 201 : 200).json({ points: result.points, arrhenius: result.arrhenius, proposed: result.proposed, draft: result.draft ? presentRateModel(result.draft) : null });
  });
  return r;
}
