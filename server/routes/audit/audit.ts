import { and, desc, eq, sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow } from "../../policies/access.js";
import { parseQuery } from "../../http/validate.js";
import { auditEvents } from "../../db/schema.js";
import { verifyAuditChain } from "../../commands/auditVerifier.js";

const AuditQuery = z.object({
  entityType: z.string().max(60).optional(),
  entityId: z.string().max(200).optional(),
  limit: z.coerce.number({ error: "must be a number" }).int().min(1, "must be at least 1").max(1000, "must be at most 1000").default(200),
});

/** /api/audit: read the trail and check its hash chain (quality, admin). */
export function auditRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/audit", registry);

  r.get("/", allow("quality", "admin"), async (req, res) => {
    const q = parseQuery(AuditQuery, req.query);
    const where: SQL[] = [];
    if (q.entityType) where.push(eq(auditEvents.entityType, q.entityType));
    if (q.entityId) where.push(eq(auditEvents.entityId, q.entityId));
    const rows = await ctx.db.select().from(auditEvents).where(where.length ? and(...where) : sql`true`).orderBy(desc(auditEvents.seq)).limit(q.limit);
    res.json({
      events: rows.map((e) => ({ seq: e.seq, occurredAt: e.occurredAt.toISOString(), actorId: e.actorId, actorName: e.actorName, action: e.action, entityType: e.entityType, entityId: e.entityId, before: e.before, after: e.after, reason: e.reason, hash: e.hash })),
    });
  });

  r.get("/verify", allow("quality", "admin"), async (_req, res) => {
    res.json(await verifyAuditChain(ctx.db));
  });
  return r;
}
