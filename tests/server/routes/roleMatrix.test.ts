import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { ROLES, type Role } from "../../../shared/schemas/roles.js";
import { ACCESS, permits } from "../../../server/policies/access.js";

let t: TestApp;
const clients = new Map<Role, Client>();
beforeAll(async () => {
  t = await startTestApp();
  for (const role of ROLES) {
    const p = await buildPerson(t.database.db, { roles: [role] });
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    clients.set(role, c);
  }
});
afterAll(() => t.close());

// Express keeps routes in nested layer stacks; walk them all.
function routeLayers(stack: any[]): any[] {
  return stack.flatMap((layer) => (layer.route ? [layer.route] : layer.handle?.stack ? routeLayers(layer.handle.stack) : []));
}

const concrete = (path: string) => path.replace(/:[a-zA-Z]+/g, randomUUID());
// The live stream never ends by itself: read its status, then hang up.
const isStream = (path: string) => path === "/api/live";
function call(c: Client, method: string, path: string) {
  if (method === "get" && isStream(path)) return c.agent.get(path).buffer(false).parse((res, done) => { res.once("data", () => (res as unknown as { destroy(): void }).destroy()); res.once("close", () => done(null, null)); res.once("end", () => done(null, null)); });
  return method === "get" ? c.get(path) : c.send(method as "post", path, {});
}
const isSignOut = (r: { method: string; path: string }) => r.method === "delete" && r.path === "/api/session";

describe("role matrix", () => {
  it("every route in the app declares its access as its first handler", () => {
    const routes = routeLayers((t.app as any).router.stack);
    expect(routes.length).toBeGreaterThan(10);
    const undeclared = routes.filter((r) => !r.stack[0]?.handle?.[ACCESS]).map((r) => r.path);
    expect(undeclared).toEqual([]);
    expect(routes.length).toBe(t.routes.length);
  });

  it("declares the training routes: read by everyone signed in, recorded and withdrawn by admins and supervisors", () => {
    const access = (method: string, path: string) => t.routes.find((r) => r.method === method && r.path === path)?.access;
    expect(access("get", "/api/training")).toEqual({ kind: "signed-in" });
    expect(access("post", "/api/training")).toEqual({ kind: "roles", roles: ["admin", "supervisor"] });
    expect(access("post", "/api/training/:id/withdraw")).toEqual({ kind: "roles", roles: ["admin", "supervisor"] });
  });

  it("answers each role on each route as its policy says: 403 when not allowed, never 401/403 when allowed", async () => {
    const wrong: string[] = [];
    for (const route of t.routes.filter((r) => !isSignOut(r))) {
      for (const role of ROLES) {
        const c = clients.get(role)!;
        const path = concrete(route.path);
        const res = await call(c, route.method, path);
        const allowed = permits(route.access, { id: "x", email: "x", name: "x", roles: [role], mustChangePassword: false });
        const denied = res.status === 403 || res.status === 401;
        // A sign-in attempt while signed in may answer 400/401 for the empty body; that is not a policy refusal.
        const policyRefusal = denied && ["forbidden", "not-signed-in"].includes(res.body?.error?.code);
        if (allowed === policyRefusal) wrong.push(`${route.method.toUpperCase()} ${route.path} as ${role}: ${res.status} ${res.body?.error?.code ?? ""}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it("answers 401 on every non-public route when signed out", async () => {
    const anon = new Client(t.app);
    await anon.refreshCsrf();
    const wrong: string[] = [];
    for (const route of t.routes.filter((r) => r.access.kind !== "public")) {
      const path = concrete(route.path);
      const res = await call(anon, route.method, path);
      if (res.status !== 401) wrong.push(`${route.method.toUpperCase()} ${route.path}: ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });
});
