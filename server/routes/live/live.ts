import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { signedIn } from "../../policies/access.js";

/** GET /api/live: server-sent events naming what changed, so screens refetch without a reload. */
export function liveRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/live", registry);
  r.get("/", signedIn, (req, res) => {
    res.set({ "Content-Type": "text/event-stream", "Cache-Control": "no-cache, no-transform", Connection: "keep-alive", "X-Accel-Buffering": "no" });
    res.flushHeaders();
    res.write("retry: 3000\n\n");
    const unsubscribe = ctx.changes.subscribe((change) => res.write(`event: change\ndata: ${JSON.stringify(change)}\n\n`));
    const ping = setInterval(() => res.write(": keep-alive\n\n"), 25_000);
    req.on("close", () => {
      clearInterval(ping);
      unsubscribe();
    });
  });
  return r;
}
