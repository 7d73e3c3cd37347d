import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { and, eq } from "drizzle-orm";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildApprovedMasterRecord, buildPerson, type BuiltPerson } from "../../factories.js";
import { BatchDriver } from "../../support/batchDriver.js";
import { mailOutbox, signatures, trainingRecords } from "../../../server/db/schema.js";
import { DEMO_MASTER_RECORD_DRAFT } from "../../../server/db/demoScenario.js";
import type { Role } from "../../../shared/schemas/roles.js";
import type { TrainingRecordView } from "../../../shared/schemas/training.js";
import { listenForChanges } from "../../support/liveListener.js";

let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  t = await startTestApp();
  d = new BatchDriver(t.app, t.database.db);
  for (const [name, roles] of [["op", ["operator"]], ["sup", ["supervisor"]], ["qa", ["quality"]], ["eng", ["engineer"]]] as [string, Role[]][]) await d.add(name, roles);
});
afterAll(() => t.close());

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

async function signedIn(roles: Role[]): Promise<{ person: BuiltPerson; client: Client }> {
  const person = await buildPerson(t.database.db, { roles, untrained: true });
  const client = new Client(t.app);
  await client.signIn(person.email, person.password);
  return { person, client };
}

async function recorded(personId: string, masterRecordVersionId: string, dates = { trainedOn: day(-3), validUntil: day(200) }) {
  const res = await d.clients.sup.post("/api/training", { personId, masterRecordVersionId, ...dates, note: "walk-through", password: d.people.sup.password });
  expect(res.status).toBe(201);
  return res.body.record as TrainingRecordView;
}

describe("training records", () => {
  it("signs exactly who was trained on what and for which days, and mails the trainee through the outbox", async () => {
    const mr = await buildApprovedMasterRecord(t.database.db);
    const { person } = await signedIn(["operator"]);
    const record = await recorded(person.id, mr.id);
    const [sig] = await t.database.db.select().from(signatures).where(and(eq(signatures.entityType, "training-record"), eq(signatures.entityId, record.id)));
    expect(sig).toMatchObject({ meaning: "training-recorded", signerId: d.people.sup.id });
    // The signed content's hash by RFC 8785 canonical JSON (the canonicalize package) and SHA-256 (node:crypto).
    const signed = { trainingRecordId: record.id, personId: person.id, personName: person.name, masterRecordVersionId: mr.id, masterRecordCode: mr.code, masterRecordVersion: mr.version, trainedOn: day(-3), validUntil: day(200), note: "walk-through" };
    expect(sig.contentHash).toBe(createHash("sha256").update(canonicalize(signed)!, "utf8").digest("hex"));
    const mail = await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, person.email));
    expect(mail.some((m) => m.subject.includes(`${mr.code} version ${mr.version}`) && m.textBody.includes(`valid until ${day(200)}`))).toBe(true);
  });

  it("announces recorded and withdrawn training on the live feed, naming the trainee", async () => {
    const mr = await buildApprovedMasterRecord(t.database.db);
    const { person } = await signedIn(["operator"]);
    const { heard, stop } = await listenForChanges(t.database.pool);
    try {
      const record = await recorded(person.id, mr.id);
      const change = JSON.stringify({ kind: "training", id: person.id });
      await expect.poll(() => heard.filter((h) => h === change).length).toBe(1);
      expect((await d.clients.sup.post(`/api/training/${record.id}/withdraw`, { reason: "recorded on the wrong version", password: d.people.sup.password })).status).toBe(200);
      await expect.poll(() => heard.filter((h) => h === change).length).toBe(2);
    } finally {
      stop();
    }
  });

  it("refuses a superseded version, saying which version is current, and a draft", async () => {
    const v1 = await buildApprovedMasterRecord(t.database.db);
    const draft = await d.clients.eng.post(`/api/master-records/${v1.familyId}/versions`, { content: DEMO_MASTER_RECORD_DRAFT });
    expect(draft.status).toBe(201);
    const { person } = await signedIn(["operator"]);
    const onDraft = await d.clients.sup.post("/api/training", { personId: person.id, masterRecordVersionId: draft.body.version.id, trainedOn: day(-1), validUntil: day(9), password: d.people.sup.password });
    expect(onDraft.status).toBe(422);
    expect(onDraft.body.error).toMatchObject({ code: "version-not-approved", field: "masterRecordVersionId" });
    expect((await d.clients.qa.post(`/api/master-records/versions/${draft.body.version.id}/approve`, { password: d.people.qa.password })).status).toBe(200);
    const res = await d.clients.sup.post("/api/training", { personId: person.id, masterRecordVersionId: v1.id, trainedOn: day(-1), validUntil: day(9), password: d.people.sup.password });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: "version-superseded", field: "masterRecordVersionId" });
    expect(res.body.error.message).toContain("version 2 is the current one");
  });

  it("refuses an unknown or deactivated trainee, naming personId", async () => {
    const mr = await buildApprovedMasterRecord(t.database.db);
    const gone = await buildPerson(t.database.db, { active: false, untrained: true });
    for (const personId of ["00000000-0000-4000-8000-000000000000", gone.id]) {
      const res = await d.clients.sup.post("/api/training", { personId, masterRecordVersionId: mr.id, trainedOn: day(-1), validUntil: day(9), password: d.people.sup.password });
      expect(res.status).toBe(422);
      expect(res.body.error.field).toBe("personId");
    }
  });

  it("lists everyone's records for supervisors, each with its status, and only one's own for an operator", async () => {
    const mr = await buildApprovedMasterRecord(t.database.db);
    const a = await signedIn(["operator"]);
    const b = await signedIn(["operator"]);
    const current = await recorded(a.person.id, mr.id);
    await recorded(a.person.id, mr.id, { trainedOn: day(-500), validUntil: day(-140) });
    await recorded(b.person.id, mr.id);

    const all = await d.clients.sup.get(`/api/training?masterRecordVersionId=${mr.id}`);
    expect(all.status).toBe(200);
    // Everyone active was trained on the new version as a fixture; a and b were made untrained.
    const ours = all.body.records.filter((r: TrainingRecordView) => [a.person.id, b.person.id].includes(r.person.id));
    expect(ours.map((r: TrainingRecordView) => `${r.person.name} ${r.status}`).sort()).toEqual([`${a.person.name} current`, `${a.person.name} expired`, `${b.person.name} current`].sort());
    expect(all.body.records.find((r: TrainingRecordView) => r.id === current.id)).toMatchObject({ masterRecord: { code: mr.code, version: mr.version }, recordedBy: { name: d.people.sup.name }, trainedOn: day(-3), validUntil: day(200) });
    expect(all.body.people.some((p: { id: string }) => p.id === b.person.id)).toBe(true);

    const own = await a.client.get("/api/training");
    expect(own.status).toBe(200);
    expect(own.body.records.map((r: TrainingRecordView) => r.person.id)).toEqual([a.person.id, a.person.id]);
    expect(own.body.people).toBeUndefined();
    expect((await a.client.get(`/api/training?personId=${b.person.id}`)).status).toBe(403);
    const bad = await d.clients.sup.get("/api/training?personId=someone");
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe("personId");
  });

  it("keeps every record in the database: no DELETE or TRUNCATE, no UPDATE but one withdrawal", async () => {
    const mr = await buildApprovedMasterRecord(t.database.db);
    const { person } = await signedIn(["operator"]);
    const record = await recorded(person.id, mr.id);
    const pool = t.database.pool;
    await expect(pool.query("delete from training_records where id = $1", [record.id])).rejects.toThrow(/never removed/);
    await expect(pool.query("truncate training_records")).rejects.toThrow(/never removed/);
    await expect(pool.query("update training_records set valid_until = valid_until + 365 where id = $1", [record.id])).rejects.toThrow(/only ever withdrawn/);
    await expect(pool.query("update training_records set withdrawn_at = now(), withdrawn_by = person_id, withdraw_reason = 'x', note = 'changed' where id = $1", [record.id])).rejects.toThrow(/only ever withdrawn/);
    await pool.query("update training_records set withdrawn_at = now(), withdrawn_by = recorded_by, withdraw_reason = 'left the team' where id = $1", [record.id]);
    await expect(pool.query("update training_records set withdraw_reason = 'another reason' where id = $1", [record.id])).rejects.toThrow(/only ever withdrawn/);
    const [row] = await t.database.db.select().from(trainingRecords).where(eq(trainingRecords.id, record.id));
    expect(row).toMatchObject({ validUntil: day(200), withdrawReason: "left the team", note: "walk-through" });
  });
});
