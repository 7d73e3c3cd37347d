import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { inject } from "vitest";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { recordAudit } from "../../../server/commands/audit.js";
import { verifyAuditChain } from "../../../server/commands/auditVerifier.js";

let t: TestApp;
let raw: pg.Client;
beforeAll(async () => {
  t = await startTestApp();
  raw = new pg.Client({ connectionString: inject("databaseUrl") });
  await raw.connect();
});
afterAll(async () => {
  await raw.end();
  await t.close();
});

describe("audit trail", () => {
  it("is append-only: PostgreSQL refuses UPDATE, DELETE and TRUNCATE", async () => {
    const p = await buildPerson(t.database.db);
    await t.database.db.transaction((tx) => recordAudit(tx, p, { action: "probe", entityType: "test", entityId: p.id }));
    await expect(raw.query("update audit_events set reason = 'changed' where entity_id = $1", [p.id])).rejects.toThrow(/append-only/);
    await expect(raw.query("delete from audit_events where entity_id = $1", [p.id])).rejects.toThrow(/append-only/);
    await expect(raw.query("truncate audit_events")).rejects.toThrow(/append-only/);
    const left = await raw.query("select count(*)::int as n from audit_events where entity_id = $1", [p.id]);
    expect(left.rows[0].n).toBe(1);
  });

  it("chains every row to the one before, also when many transactions write at once", async () => {
    const p = await buildPerson(t.database.db);
    await Promise.all(Array.from({ length: 40 }, (_, i) => t.database.db.transaction((tx) => recordAudit(tx, p, { action: "concurrent", entityType: "test", entityId: `${p.id}-${i}`, after: { i } }))));
    const report = await verifyAuditChain(t.database.db);
    expect(report).toMatchObject({ ok: true });
    const rows = await raw.query("select seq, prev_hash, hash from audit_events order by seq");
    for (let i = 1; i < rows.rows.length; i++) expect(rows.rows[i].prev_hash).toBe(rows.rows[i - 1].hash);
  });

  it("finds a tampered row through GET /api/audit/verify", async () => {
    const q = await buildPerson(t.database.db, { roles: ["quality"] });
    const c = new Client(t.app);
    await c.signIn(q.email, q.password);
    expect((await c.get("/api/audit/verify")).body.ok).toBe(true);
    const target = await raw.query("select seq from audit_events where entity_id = $1 and action = 'signed-in'", [q.id]);
    const seq = target.rows[0].seq;
    // Someone with the table owner's rights switches the guard off and edits history.
    await raw.query("alter table audit_events disable trigger audit_events_append_only");
    try {
      await raw.query("update audit_events set actor_name = 'Someone Else' where seq = $1", [seq]);
    } finally {
      await raw.query("alter table audit_events enable trigger audit_events_append_only");
    }
    try {
      const res = await c.get("/api/audit/verify");
      expect(res.status).toBe(200);
      expect(res.body.ok).toBe(false);
      expect(Number(res.body.brokenAt.seq)).toBe(Number(seq));
      expect(res.body.brokenAt.reason).toMatch(/content/);
    } finally {
      // Put the row back so the other test files in this run see an intact chain.
      await raw.query("alter table audit_events disable trigger audit_events_append_only");
      await raw.query("update audit_events set actor_name = $2 where seq = $1", [seq, q.name]);
      await raw.query("alter table audit_events enable trigger audit_events_append_only");
    }
    expect((await c.get("/api/audit/verify")).body.ok).toBe(true);
  });

  it("lists the trail for an entity to quality", async () => {
    const q = await buildPerson(t.database.db, { roles: ["quality"] });
    const c = new Client(t.app);
    await c.signIn(q.email, q.password);
    const res = await c.get(`/api/audit?entityType=person&entityId=${q.id}`);
    expect(res.status).toBe(200);
    expect(res.body.events.map((e: { action: string }) => e.action)).toContain("signed-in");
    const bad = await c.get("/api/audit?limit=abc");
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe("limit");
  });
});
