import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { auditEvents, mailOutbox, people } from "../../../server/db/schema.js";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const auditFor = (personId: string, action: string) =>
  t.database.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, personId), eq(auditEvents.action, action)));

describe("sign-in", () => {
  it("signs a person in with the right password and shows them in GET /api/session", async () => {
    const p = await buildPerson(t.database.db, { roles: ["operator", "supervisor"] });
    const c = new Client(t.app);
    const res = await c.signIn(p.email.toUpperCase(), p.password);
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: p.id, email: p.email, roles: ["operator", "supervisor"] });
    const me = await c.get("/api/session");
    expect(me.body.user.id).toBe(p.id);
    expect(me.body.csrfToken).toBe(c.csrf);
    expect(await auditFor(p.id, "signed-in")).toHaveLength(1);
  });

  it("gives a new session id at sign-in (no fixation)", async () => {
    const p = await buildPerson(t.database.db);
    const c = new Client(t.app);
    const before = await c.refreshCsrf();
    const cookieBefore = String(before.headers["set-cookie"]);
    const res = await c.signIn(p.email, p.password);
    const cookieAfter = String(res.headers["set-cookie"]);
    const sid = (s: string) => /isobatch\.sid=([^;]+)/.exec(s)?.[1];
    expect(sid(cookieBefore)).toBeTruthy();
    expect(sid(cookieAfter)).toBeTruthy();
    expect(sid(cookieAfter)).not.toBe(sid(cookieBefore));
    expect(cookieAfter).toMatch(/HttpOnly/i);
    expect(cookieAfter).toMatch(/SameSite=Lax/i);
  });

  it("refuses a wrong password with 401 and audits the failure", async () => {
    const p = await buildPerson(t.database.db);
    const res = await new Client(t.app).signIn(p.email, "not the password at all");
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("bad-credentials");
    expect(await auditFor(p.id, "sign-in-failed")).toHaveLength(1);
  });

  it("names the field of a malformed sign-in", async () => {
    const c = new Client(t.app);
    await c.refreshCsrf();
    const res = await c.post("/api/session", { email: "not-an-email", password: "x" });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe("email");
  });

  it("locks the account after five failures in a row, audits the lock and mails the admins", async () => {
    const admin = await buildPerson(t.database.db, { roles: ["admin"] });
    const p = await buildPerson(t.database.db);
    const c = new Client(t.app);
    const statuses = [];
    for (let i = 0; i < 5; i++) statuses.push((await c.signIn(p.email, `wrong-${i}`)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 423]);
    const right = await c.signIn(p.email, p.password);
    expect(right.status).toBe(423);
    expect(right.body.error.code).toBe("account-locked");
    expect(await auditFor(p.id, "sign-in-failed")).toHaveLength(5);
    expect(await auditFor(p.id, "account-locked")).toHaveLength(1);
    const queued = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, admin.email));
    expect(queued.some((m) => m.subject.includes("account locked"))).toBe(true);

    // An admin unlocks it, with a reason; then the right password works again.
    const a = new Client(t.app);
    await a.signIn(admin.email, admin.password);
    const noReason = await a.post(`/api/people/${p.id}/unlock`, {});
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.field).toBe("reason");
    const unlock = await a.post(`/api/people/${p.id}/unlock`, { reason: "spoke to the operator; mistyped" });
    expect(unlock.status).toBe(200);
    expect(unlock.body.person.locked).toBe(false);
    const [unlockAudit] = await auditFor(p.id, "account-unlocked");
    expect(unlockAudit.reason).toBe("spoke to the operator; mistyped");
    expect((await c.signIn(p.email, p.password)).status).toBe(200);
  });

  it("resets the failure count after a good sign-in", async () => {
    const p = await buildPerson(t.database.db);
    const c = new Client(t.app);
    for (let i = 0; i < 4; i++) await c.signIn(p.email, "wrong password here");
    expect((await c.signIn(p.email, p.password)).status).toBe(200);
    const [row] = await t.database.db.select().from(people).where(eq(people.id, p.id));
    expect(row.failedSignIns).toBe(0);
  });

  it("refuses a deactivated account and signs its open sessions out", async () => {
    const admin = await buildPerson(t.database.db, { roles: ["admin"] });
    const p = await buildPerson(t.database.db);
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    const a = new Client(t.app);
    await a.signIn(admin.email, admin.password);
    expect((await a.post(`/api/people/${p.id}/deactivate`, { reason: "left the site" })).status).toBe(200);
    expect((await c.get("/api/session")).body.user).toBeNull();
    const again = await new Client(t.app).signIn(p.email, p.password);
    expect(again.status).toBe(403);
    expect(again.body.error.code).toBe("account-inactive");
  });

  it("signs out with DELETE /api/session", async () => {
    const p = await buildPerson(t.database.db);
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    expect((await c.send("delete", "/api/session")).status).toBe(204);
    await c.refreshCsrf();
    expect((await c.get("/api/session")).body.user).toBeNull();
    expect(await auditFor(p.id, "signed-out")).toHaveLength(1);
  });
});

describe("CSRF", () => {
  it("refuses a state-changing request without the X-CSRF-Token header", async () => {
    const p = await buildPerson(t.database.db);
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    const res = await c.agent.delete("/api/session");
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("csrf-token-missing");
    const wrong = await c.agent.delete("/api/session").set("X-CSRF-Token", "x".repeat(c.csrf.length));
    expect(wrong.status).toBe(403);
    expect((await c.get("/api/session")).body.user?.id).toBe(p.id);
  });

  it("refuses a sign-in without the token", async () => {
    const p = await buildPerson(t.database.db);
    const res = await new Client(t.app).agent.post("/api/session").send({ email: p.email, password: p.password });
    expect(res.status).toBe(403);
  });
});

describe("401 and 403", () => {
  it("answers 401 when signed out and 403 when the role is missing", async () => {
    const anon = new Client(t.app);
    const signedOut = await anon.get("/api/people");
    expect(signedOut.status).toBe(401);
    expect(signedOut.body.error.code).toBe("not-signed-in");
    const p = await buildPerson(t.database.db, { roles: ["operator"] });
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    const forbidden = await c.get("/api/people");
    expect(forbidden.status).toBe(403);
    expect(forbidden.body.error.message).toMatch(/admin/);
  });
});

describe("password change", () => {
  it("makes a person with a reset password choose a new one before anything else", async () => {
    const admin = await buildPerson(t.database.db, { roles: ["admin"] });
    const p = await buildPerson(t.database.db, { roles: ["quality"] });
    const a = new Client(t.app);
    await a.signIn(admin.email, admin.password);
    const reset = await a.post(`/api/people/${p.id}/reset-password`, { temporaryPassword: "temporary-pass-123", reason: "forgot password" });
    expect(reset.status).toBe(200);
    const c = new Client(t.app);
    expect((await c.signIn(p.email, p.password)).status).toBe(401);
    const signIn = await c.signIn(p.email, "temporary-pass-123");
    expect(signIn.body.user.mustChangePassword).toBe(true);
    const blocked = await c.get("/api/audit/verify");
    expect(blocked.status).toBe(403);
    expect(blocked.body.error.code).toBe("password-change-required");
    const short = await c.post("/api/session/password", { currentPassword: "temporary-pass-123", newPassword: "short" });
    expect(short.status).toBe(400);
    expect(short.body.error.field).toBe("newPassword");
    const changed = await c.post("/api/session/password", { currentPassword: "temporary-pass-123", newPassword: "a brand new passphrase" });
    expect(changed.status).toBe(200);
    expect(changed.body.user.mustChangePassword).toBe(false);
    c.csrf = changed.body.csrfToken;
    expect((await c.get("/api/audit/verify")).status).toBe(200);
  });
});

describe("idle expiry", () => {
  it("ends a session idle longer than the limit and says so", async () => {
    const quick = await startTestApp({ settings: { sessionIdleMinutes: 1 / 60 } }); // one second
    try {
      const p = await buildPerson(quick.database.db, { roles: ["admin"] });
      const c = new Client(quick.app);
      await c.signIn(p.email, p.password);
      expect((await c.get("/api/people")).status).toBe(200);
      await new Promise((r) => setTimeout(r, 1500));
      const res = await c.get("/api/people");
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe("session-expired");
      const session = await c.get("/api/session");
      expect(session.body.user).toBeNull();
      expect(session.body.sessionExpired).toBe(true);
    } finally {
      await quick.close();
    }
  });
});

describe("password ageing and reuse", () => {
  it("makes a person whose password is older than the limit choose a new one, and refuses their recent passwords", async () => {
    const p = await buildPerson(t.database.db, { roles: ["operator"], passwordChangedAt: new Date(Date.now() - 91 * 86_400_000) });
    const c = new Client(t.app);
    const res = await c.signIn(p.email, p.password);
    expect(res.status).toBe(200);
    expect(res.body.user.mustChangePassword).toBe(true);
    expect((await t.database.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, p.id), eq(auditEvents.action, "password-expired"))))).toHaveLength(1);
    const same = await c.post("/api/session/password", { currentPassword: p.password, newPassword: p.password });
    expect(same.status).toBe(422);
    expect(same.body.error).toMatchObject({ code: "password-reused", field: "newPassword" });
    const first = await c.post("/api/session/password", { currentPassword: p.password, newPassword: "second passphrase here" });
    expect(first.status).toBe(200);
    c.csrf = first.body.csrfToken;
    const back = await c.post("/api/session/password", { currentPassword: "second passphrase here", newPassword: p.password });
    expect(back.status).toBe(422); // the previous password is in the history
    expect((await c.post("/api/session/password", { currentPassword: "second passphrase here", newPassword: "third passphrase here" })).status).toBe(200);
  });
});
