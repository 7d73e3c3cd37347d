import { desc, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { parseQuery, validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { batches, deviations } from "../../db/schema.js";
import { createDeviationRecorder } from "../../commands/deviationRecorder.js";
import { DeviationCloseSchema, DeviationInvestigateSchema } from "../../../shared/schemas/batches.js";
import { createsRecord, signsRecord } from "../../http/recordEffects.js";

const ListQuery = z.object({ status: z.enum(["open", "investigated", "closed", "not-closed"]).default("not-closed") });

/** /api/deviations: the deviations screen; investigate (supervisor) and close with a signature (quality). */
export function deviationRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/deviations", registry);
  const recorder = createDeviationRecorder({ db: ctx.db, check: ctx.checkCredentials, notify: ctx.notify });
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;
  const present = (d: typeof deviations.$inferSelect, batchCode: string) => ({ id: d.id, batchId: d.batchId, batchCode, stepKey: d.stepKey, source: d.source, title: d.title, description: d.description, severity: d.severity, status: d.status, rootCause: d.rootCause, action: d.action, coversKinetics: d.coversKinetics, raisedAt: d.raisedAt.toISOString(), closedAt: d.closedAt?.toISOString() ?? null, revision: d.revision });

  r.get("/", signedIn, async (req, res) => {
    const q = parseQuery(ListQuery, req.query);
    const statuses = q.status === "not-closed" ? (["open", "investigated"] as const) : ([q.status] as const);
    const rows = await ctx.db.select({ d: deviations, code: batches.code }).from(deviations).innerJoin(batches, eq(batches.id, deviations.batchId)).where(inArray(deviations.status, [...statuses])).orderBy(desc(deviations.raisedAt));
    res.json({ deviations: rows.map(({ d, code }) => present(d, code)) });
  });
  r.post("/:id/investigate", allow("supervisor"), createsRecord, validate(DeviationInvestigateSchema), async (req, res) => {
    const d = await recorder.investigate(me(req), idParam(req), req.body);
    res.json({ deviation: { id: d.id, status: d.status, revision: d.revision } });
  });
  r.post("/:id/close", allow("quality"), signsRecord, validate(DeviationCloseSchema), async (req, res) => {
    const d = await recorder.close(me(req), idParam(req), req.body);
    res.json({ deviation: { id: d.id, status: d.status, revision: d.revision } });
  });
  return r;
}
