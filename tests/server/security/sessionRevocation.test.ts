import { afterAll, beforeAll, describe, expect, inject, it, vi } from "vitest";
import pg from "pg";
import request from "supertest";
import { Client, startTestApp, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";

// Sessions read from the database are reused for a few seconds. These tests hold that a sign-out,
// a deactivation, a lock or a change of roles still takes effect on the person's next request
// (21 CFR 11.300(b) and (d); OWASP ASVS 4.0.3 V3.3.1 and V3.3.3: sessions end when the account
// changes), whether the change is made through this server or straight in the database, as
// another app server would.

let t: TestApp;
let admin: Client;
let outside: pg.Client;
let sessionReads = 0;
beforeAll(async () => {
  t = await startTestApp();
  const pool = t.database.pool;
  const query = pool.query.bind(pool) as (...args: unknown[]) => unknown;
  (pool as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
    if ((args[0] as { name?: string })?.name === "session_with_person") sessionReads++;
    return query(...args);
  };
  const a = await buildPerson(t.database.db, { roles: ["admin"] });
  admin = new Client(t.app);
  await admin.signIn(a.email, a.password);
  outside = new pg.Client({ connectionString: inject("databaseUrl") });
  await outside.connect();
  await until(() => t.sessionCache.active);
});
afterAll(async () => {
  await outside.end();
  await t.close();
});

/** Waits until `done` holds (vitest's waitUntil); the milliseconds it took. */
async function until(done: () => boolean | Promise<boolean>, timeout = 3000) {
  const start = Date.now();
  await vi.waitUntil(done, { timeout, interval: 10 });
  return Date.now() - start;
}

async function signedIn(roles: ("operator" | "supervisor")[] = ["operator"]) {
  const p = await buildPerson(t.database.db, { roles });
  const c = new Client(t.app);
  const res = await c.signIn(p.email, p.password);
  expect(res.status).toBe(200);
  const cookie = String(res.headers["set-cookie"]).split(";")[0];
  expect((await c.get("/api/session")).body.user?.id).toBe(p.id);
  return { p, c, cookie };
}

/**
 * Reads until one request is served from the cache. The sign-in's own announcement (its update
 * of the person) may reach the server after the first read was cached and drop it once.
 */
async function untilCached(c: Client) {
  await until(async () => {
    const before = sessionReads;
    await whoAmI(c);
    return sessionReads === before;
  });
}

const whoAmI = async (c: Client) => (await c.get("/api/session")).body.user as { id: string; roles: string[] } | null;

describe("session reuse", () => {
  it("serves a busy client's requests without reading its session each time", async () => {
    const { p, c } = await signedIn();
    await untilCached(c);
    const before = sessionReads;
    for (let i = 0; i < 5; i++) expect((await whoAmI(c))?.id).toBe(p.id);
    expect(sessionReads - before).toBe(0);
  });

  it("ends the session on the next request after a deactivation through the app", async () => {
    const { p, c } = await signedIn();
    const res = await admin.post(`/api/people/${p.id}/deactivate`, { reason: "left the site" });
    expect(res.status).toBe(200);
    expect(await whoAmI(c)).toBeNull();
    expect((await c.get("/api/vessels")).status).toBe(401);
  });

  it("shows new roles on the next request after they change", async () => {
    const { p, c } = await signedIn(["operator", "supervisor"]);
    const res = await admin.send("put", `/api/people/${p.id}/roles`, { roles: ["operator"], reason: "moved to the floor" });
    expect(res.status).toBe(200);
    expect((await whoAmI(c))?.roles).toEqual(["operator"]);
  });

  it("refuses a signed-out session's cookie at once", async () => {
    const { c, cookie } = await signedIn();
    const replay = async () => (await request(t.app).get("/api/session").set("Cookie", cookie)).body.user;
    expect(await replay()).not.toBeNull();
    expect((await c.send("delete", "/api/session")).status).toBeLessThan(300);
    expect(await replay()).toBeNull();
  });

  it("hears a lock made straight in the database, as by another server, well before copies run out", async () => {
    const { p, c } = await signedIn();
    await outside.query("update people set locked_at = now() where id = $1", [p.id]);
    const heardMs = await until(async () => (await whoAmI(c)) === null);
    expect(heardMs).toBeLessThan(1000);
  });

  it("hears sessions removed straight in the database", async () => {
    const { p, c } = await signedIn();
    await outside.query(`delete from "session" where sess -> 'passport' ->> 'user' = $1`, [p.id]);
    expect(await until(async () => (await whoAmI(c)) === null)).toBeLessThan(1000);
  });

  it("reads every session from the database while it cannot hear the announcements, and reuses them again once it can", async () => {
    const { p, c } = await signedIn();
    await outside.query(`select pg_terminate_backend(pid) from pg_stat_activity where query = 'LISTEN isobatch_sessions' and pid <> pg_backend_pid()`);
    await until(() => !t.sessionCache.active);
    // No copy is used now: a change nobody announces is seen at once.
    await outside.query("update people set locked_at = now() where id = $1", [p.id]);
    expect(await whoAmI(c)).toBeNull();
    await until(() => t.sessionCache.active, 5000);
    const again = await signedIn();
    await untilCached(again.c);
    const before = sessionReads;
    expect((await whoAmI(again.c))?.id).toBe(again.p.id);
    expect(sessionReads - before).toBe(0);
  });
});
