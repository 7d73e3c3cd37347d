import { sql } from "drizzle-orm";
import type { RouteContext } from "../../services/types.js";
import type { RouteDeclaration } from "../../http/policyRouter.js";
import { policyRouter } from "../../http/policyRouter.js";
import { anyone } from "../../policies/access.js";

const withTimeout = <T>(p: Promise<T>, ms: number) =>
  Promise.race([p, new Promise<never>((_, fail) => setTimeout(() => fail(new Error(`no answer within ${ms} ms`)), ms).unref())]);

async function probe(check: () => Promise<unknown>): Promise<string> {
  try {
    await withTimeout(check(), 3000);
    return "ok";
  } catch (err) {
    return `down: ${(err as Error).message || "no answer"}`.slice(0, 200);
  }
}

/** GET /api/health: the database, the file store and the mail server, each named. */
export function healthRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/health", registry);
  r.get("/", anyone, async (_req, res) => {
    const [db, storage, mail] = await Promise.all([probe(() => ctx.db.execute(sql`select 1`)), probe(() => ctx.storage.check()), probe(() => ctx.mail.check())]);
    const ok = db === "ok" && storage === "ok" && mail === "ok";
    res.status(ok ? 200 : 503).json({ status: ok ? "ok" : "degraded", db, storage, mail });
  });
  return r;
}
