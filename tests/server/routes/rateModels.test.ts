import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import pg from "pg";
import { inject } from "vitest";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson, type BuiltPerson } from "../../factories.js";
import { auditEvents, signatures } from "../../../server/db/schema.js";
import { DEMO_RATE_MODEL } from "../../../server/db/demoScenario.js";

let t: TestApp;
let engineer: BuiltPerson, quality: BuiltPerson, qualityEngineer: BuiltPerson;
let eng: Client, qa: Client;
beforeAll(async () => {
  t = await startTestApp();
  engineer = await buildPerson(t.database.db, { roles: ["engineer"] });
  quality = await buildPerson(t.database.db, { roles: ["quality"] });
  qualityEngineer = await buildPerson(t.database.db, { roles: ["quality", "engineer"] });
  eng = new Client(t.app);
  await eng.signIn(engineer.email, engineer.password);
  qa = new Client(t.app);
  await qa.signIn(quality.email, quality.password);
});
afterAll(() => t.close());

let n = 0;
const newModel = (client: Client, content = DEMO_RATE_MODEL.content) => client.post("/api/rate-models", { code: `DMX-T${++n}-${Date.now() % 100000}`, title: "DMX cracking (test)", content });

describe("rate models", () => {
  it("lets an engineer draft a model and derives εA from reaction and feed", async () => {
    const res = await newModel(eng);
    expect(res.status).toBe(201);
    // DMX → 2 MON with 30 % inert nitrogen: δ = 1, yA0 = 0.7, εA = 0.7 (common practice: εA = yA0·δ).
    expect(res.body.version.derived).toMatchObject({ epsilonA: 0.7, delta: 1, yA0: 0.7, kUnit: "1/s" });
    expect(res.body.version).toMatchObject({ version: 1, status: "draft" });
    expect(res.body.version.abilities.edit).toBe(true);
  });

  it("names the field when the feed does not sum to one", async () => {
    const res = await newModel(eng, { ...DEMO_RATE_MODEL.content, feed: { DMX: 0.7, N2: 0.2 } });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe("content.feed");
  });

  it("refuses a key species that is not a reactant, naming the field", async () => {
    const res = await newModel(eng, { ...DEMO_RATE_MODEL.content, keySpecies: "MON" });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe("content.keySpecies");
  });

  it("keeps non-engineers from drafting", async () => {
    expect((await newModel(qa)).status).toBe(403);
  });

  it("refuses approval by the person who drafted the version", async () => {
    const drafter = new Client(t.app);
    await drafter.signIn(qualityEngineer.email, qualityEngineer.password);
    const draft = await newModel(drafter);
    const res = await drafter.post(`/api/rate-models/versions/${draft.body.version.id}/approve`, { password: qualityEngineer.password });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("own-draft");
    expect(await t.database.db.select().from(signatures).where(eq(signatures.entityId, draft.body.version.id))).toHaveLength(0);
  });

  it("refuses a wrong signing password, signs nothing, and counts it towards the lockout", async () => {
    const draft = await newModel(eng);
    const signer = await buildPerson(t.database.db, { roles: ["quality"] });
    const c = new Client(t.app);
    await c.signIn(signer.email, signer.password);
    const res = await c.post(`/api/rate-models/versions/${draft.body.version.id}/approve`, { password: "not my password" });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "signature-password-wrong", field: "password" });
    expect(await t.database.db.select().from(signatures).where(eq(signatures.entityId, draft.body.version.id))).toHaveLength(0);
    const failures = await t.database.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, signer.id), eq(auditEvents.action, "signature-failed")));
    expect(failures).toHaveLength(1);
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await c.post(`/api/rate-models/versions/${draft.body.version.id}/approve`, { password: `wrong ${i}` })).status);
    expect(statuses).toEqual([422, 422, 422, 423]); // the fifth failure locks the account
    // A locked person is signed out at once, so even the right password signs nothing now.
    const after = await c.post(`/api/rate-models/versions/${draft.body.version.id}/approve`, { password: signer.password });
    expect(after.status).toBe(401);
    expect(await t.database.db.select().from(signatures).where(eq(signatures.entityId, draft.body.version.id))).toHaveLength(0);
  });

  it("signs nothing after the session expired", async () => {
    const quick = await startTestApp({ settings: { sessionIdleMinutes: 1 / 60 } });
    try {
      const author = await buildPerson(quick.database.db, { roles: ["engineer"] });
      const approver = await buildPerson(quick.database.db, { roles: ["quality"] });
      const a = new Client(quick.app);
      await a.signIn(author.email, author.password);
      const draft = await newModel(a);
      const q = new Client(quick.app);
      await q.signIn(approver.email, approver.password);
      await new Promise((r) => setTimeout(r, 1500));
      const res = await q.post(`/api/rate-models/versions/${draft.body.version.id}/approve`, { password: approver.password });
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe("session-expired");
      expect(await quick.database.db.select().from(signatures).where(eq(signatures.entityId, draft.body.version.id))).toHaveLength(0);
    } finally {
      await quick.close();
    }
  });

  it("approves with a signature, supersedes the previous version, and never edits an approved one", async () => {
    const v1 = (await newModel(eng)).body.version;
    const a1 = await qa.post(`/api/rate-models/versions/${v1.id}/approve`, { password: quality.password, comment: "fit for HF-24" });
    expect(a1.status).toBe(200);
    expect(a1.body.version.status).toBe("approved");
    const [sig] = a1.body.version.signatures;
    expect(sig).toMatchObject({ signerName: quality.name, meaning: "approved", comment: "fit for HF-24", matchesContent: true });
    expect(new Date(sig.signedAt).toISOString()).toBe(sig.signedAt);

    const edit = await eng.send("put", `/api/rate-models/versions/${v1.id}`, { content: { ...v1.content, kRef: 0.003 }, reason: "try to edit", revision: v1.revision });
    expect(edit.status).toBe(409);
    expect(edit.body.error.code).toBe("not-a-draft");

    const v2 = await eng.post(`/api/rate-models/${v1.modelId}/versions`, { content: { ...v1.content, kRef: 0.0021 } });
    expect(v2.status).toBe(201);
    expect(v2.body.version.version).toBe(2);
    const second = await eng.post(`/api/rate-models/${v1.modelId}/versions`, { content: v1.content });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("draft-exists");

    const noReason = await eng.send("put", `/api/rate-models/versions/${v2.body.version.id}`, { content: { ...v1.content, kRef: 0.0022 }, revision: 1 });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.field).toBe("reason");
    const stale = await eng.send("put", `/api/rate-models/versions/${v2.body.version.id}`, { content: v1.content, reason: "typo", revision: 99 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale-revision");
    const edited = await eng.send("put", `/api/rate-models/versions/${v2.body.version.id}`, { content: { ...v1.content, kRef: 0.0022 }, reason: "k from the latest fit", revision: 1 });
    expect(edited.status).toBe(200);
    expect(edited.body.version.content.kRef).toBe(0.0022);

    expect((await qa.post(`/api/rate-models/versions/${v2.body.version.id}/approve`, { password: quality.password })).status).toBe(200);
    const all = (await eng.get(`/api/rate-models/${v1.modelId}/versions`)).body.versions;
    expect(all.map((v: { version: number; status: string }) => [v.version, v.status])).toEqual([
      [2, "approved"],
      [1, "superseded"],
    ]);
    const trail = await t.database.db.select().from(auditEvents).where(eq(auditEvents.entityId, v2.body.version.id));
    expect(trail.map((e) => e.action)).toEqual(expect.arrayContaining(["rate-model-version-drafted", "rate-model-version-draft-changed", "signed-approved", "rate-model-version-approved"]));
    expect(trail.find((e) => e.action === "rate-model-version-draft-changed")!.reason).toBe("k from the latest fit");
  });

  it("shows a signature as no longer matching when the signed content changes underneath it", async () => {
    const v = (await newModel(eng)).body.version;
    await qa.post(`/api/rate-models/versions/${v.id}/approve`, { password: quality.password });
    const raw = new pg.Client({ connectionString: inject("databaseUrl") });
    await raw.connect();
    try {
      await raw.query("update rate_model_versions set content = jsonb_set(content, '{kRef}', '0.005') where id = $1", [v.id]);
    } finally {
      await raw.end();
    }
    const res = await qa.get(`/api/rate-models/versions/${v.id}`);
    expect(res.body.version.signatures[0].matchesContent).toBe(false);
  });
});

describe("signing rate limit", () => {
  it("refuses a burst of signing attempts with 429 and signs nothing", async () => {
    const limited = await startTestApp({ settings: { signaturesPerMinute: 3 } });
    try {
      const author = await buildPerson(limited.database.db, { roles: ["engineer"] });
      const approver = await buildPerson(limited.database.db, { roles: ["quality"] });
      const a = new Client(limited.app);
      await a.signIn(author.email, author.password);
      const draft = (await newModel(a)).body.version;
      const q = new Client(limited.app);
      await q.signIn(approver.email, approver.password);
      const statuses = [];
      for (let i = 0; i < 4; i++) statuses.push((await q.post(`/api/rate-models/versions/${draft.id}/approve`, { password: `guess ${i}` })).status);
      expect(statuses).toEqual([422, 422, 422, 429]);
      expect(await limited.database.db.select().from(signatures).where(eq(signatures.entityId, draft.id))).toHaveLength(0);
    } finally {
      await limited.close();
    }
  });
});

describe("signatures stay bound to their record", () => {
  it("shows a signature copied onto another record as not matching it", async () => {
    const a = (await newModel(eng)).body.version;
    const b = (await newModel(eng)).body.version;
    await qa.post(`/api/rate-models/versions/${a.id}/approve`, { password: quality.password });
    const [original] = await t.database.db.select().from(signatures).where(eq(signatures.entityId, a.id));
    // Someone with database access copies the signature row onto record b.
    const { id: _id, signedAt: _at, ...copy } = original;
    await t.database.db.insert(signatures).values({ ...copy, entityId: b.id });
    const view = (await qa.get(`/api/rate-models/versions/${b.id}`)).body.version;
    expect(view.signatures).toHaveLength(1);
    expect(view.signatures[0].matchesContent).toBe(false);
    expect((await qa.get(`/api/rate-models/versions/${a.id}`)).body.version.signatures[0].matchesContent).toBe(true);
  });

  it("never deletes a person, so an id is never reused", async () => {
    const raw = new pg.Client({ connectionString: inject("databaseUrl") });
    await raw.connect();
    try {
      await expect(raw.query("delete from people where id = $1", [engineer.id])).rejects.toThrow(/never deleted/);
    } finally {
      await raw.end();
    }
  });
});
