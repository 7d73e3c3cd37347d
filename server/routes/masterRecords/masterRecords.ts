import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { createVersionedDocuments, type VersionView } from "../../commands/versionedDocuments.js";
import { masterRecordKind } from "../../commands/masterRecordKind.js";
import { MasterRecordCreateSchema, MasterRecordDraftSchema, MasterRecordDraftUpdateSchema, type MasterRecordContent, type MasterRecordVersionView } from "../../../shared/schemas/masterRecords.js";
import { SignatureSchema } from "../../../shared/schemas/common.js";
import { changesRecord, createsRecord, signsRecord } from "../../http/recordEffects.js";

/** The API's view of a master-record version. */
export function presentMasterRecord(v: VersionView<MasterRecordContent>): MasterRecordVersionView {
  const { row: _row, familyId, ...rest } = v;
  return { ...rest, masterRecordId: familyId };
}

/** /api/master-records: engineers draft, quality approves with a signature. */
export function masterRecordRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/master-records", registry);
  const docs = createVersionedDocuments(ctx.db, ctx.checkCredentials, masterRecordKind);
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  r.get("/", signedIn, async (req, res) => {
    res.json({ versions: (await docs.list(me(req))).map(presentMasterRecord) });
  });
  r.post("/", allow("engineer"), createsRecord, validate(MasterRecordCreateSchema), async (req, res) => {
    res.status(201).json({ version: presentMasterRecord(await docs.createFamily(me(req), req.body)) });
  });
  r.get("/:id/versions", signedIn, async (req, res) => {
    res.json({ versions: (await docs.versionsOf(idParam(req), me(req))).map(presentMasterRecord) });
  });
  r.post("/:id/versions", allow("engineer"), createsRecord, validate(MasterRecordDraftSchema), async (req, res) => {
    res.status(201).json({ version: presentMasterRecord(await docs.createDraft(me(req), idParam(req), req.body.content)) });
  });
  r.get("/versions/:id", signedIn, async (req, res) => {
    res.json({ version: presentMasterRecord(await docs.get(idParam(req), me(req))) });
  });
  r.put("/versions/:id", allow("engineer"), changesRecord, validate(MasterRecordDraftUpdateSchema), async (req, res) => {
    res.json({ version: presentMasterRecord(await docs.updateDraft(me(req), idParam(req), req.body.content, req.body.reason, req.body.revision)) });
  });
  r.post("/versions/:id/approve", allow("quality"), signsRecord, validate(SignatureSchema), async (req, res) => {
    res.json({ version: presentMasterRecord(await docs.approve(me(req), idParam(req), req.body.password, req.body.comment)) });
  });
  return r;
}
