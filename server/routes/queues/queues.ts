import { eq, inArray } from "drizzle-orm";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { signedIn, type SignedInPerson } from "../../policies/access.js";
import { batches, deviations } from "../../db/schema.js";
import { loadBatchRecord } from "../../commands/batchRecord.js";

/** /api/queues: each person's own work — batches in progress, signatures due, reviews and deviations. */
export function queueRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/queues", registry);
  r.get("/", signedIn, async (req, res) => {
    const me = req.user as SignedInPerson;
    const active = await ctx.db.select().from(batches).where(inArray(batches.state, ["charging", "running", "sampling", "held", "review"]));
    const brief = (b: typeof batches.$inferSelect) => ({ id: b.id, code: b.code, state: b.state, revision: b.revision });
    const awaitingVerification: { batchId: string; batchCode: string; stepKey: string; title: string; performedBy: string | null }[] = [];
    if (me.roles.includes("supervisor")) {
      for (const b of active.filter((x) => x.state !== "review")) {
        const record = await loadBatchRecord(ctx.db, b.id);
        for (const s of record.steps) {
          if (s.status === "awaiting-verification" && s.current?.enteredBy !== me.id) awaitingVerification.push({ batchId: b.id, batchCode: b.code, stepKey: s.step.key, title: s.step.title, performedBy: s.performedBy });
        }
      }
    }
    const devs = await ctx.db.select({ d: deviations, code: batches.code }).from(deviations).innerJoin(batches, eq(batches.id, deviations.batchId)).where(inArray(deviations.status, ["open", "investigated"]));
    const dev = ({ d, code }: (typeof devs)[number]) => ({ id: d.id, batchId: d.batchId, batchCode: code, title: d.title, severity: d.severity, status: d.status });
    res.json({
      inProgress: active.filter((b) => ["charging", "running", "sampling", "held"].includes(b.state)).map(brief),
      held: active.filter((b) => b.state === "held").map(brief),
      awaitingVerification,
      inReview: active.filter((b) => b.state === "review").map(brief),
      deviationsToInvestigate: devs.filter((x) => x.d.status === "open").map(dev),
      deviationsToClose: devs.filter((x) => x.d.status === "investigated").map(dev),
    });
  });
  return r;
}
