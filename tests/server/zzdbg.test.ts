import { it } from "vitest";
import { randomUUID } from "node:crypto";
import { startTestApp, Client } from "../support/testApp.js";
import { buildPerson } from "../factories.js";
it("timing", async () => {
  const t = await startTestApp();
  const p = await buildPerson(t.database.db, { roles: ["engineer"] });
  const c = new Client(t.app); await c.signIn(p.email, p.password);
  for (const route of t.routes) {
    if (route.method === "delete" && route.path === "/api/session") continue;
    const path = route.path.replace(/:[a-zA-Z]+/g, randomUUID());
    const s = performance.now();
    const res = route.method === "get" ? await c.get(path) : await c.send(route.method, path, {});
    const ms = performance.now() - s;
    if (ms > 200) console.log("SLOW", route.method, route.path, res.status, ms.toFixed(0));
  }
  await t.close();
}, 120000);
