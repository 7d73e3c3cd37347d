import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson, type BuiltPerson } from "../../factories.js";
import { DEMO_MASTER_RECORD } from "../../../server/db/demoScenario.js";

let t: TestApp;
let eng: Client, qa: Client;
let quality: BuiltPerson;
beforeAll(async () => {
  t = await startTestApp();
  const engineer = await buildPerson(t.database.db, { roles: ["engineer"] });
  quality = await buildPerson(t.database.db, { roles: ["quality"] });
  eng = new Client(t.app);
  await eng.signIn(engineer.email, engineer.password);
  qa = new Client(t.app);
  await qa.signIn(quality.email, quality.password);
});
afterAll(() => t.close());

let n = 0;
const create = (content: unknown) => eng.post("/api/master-records", { code: `MR-${Date.now() % 100000}-${++n}`, title: "DMX batch (test)", content });
const content = DEMO_MASTER_RECORD.content;

describe("master records", () => {
  it("drafts a record with steps and fields per phase, and quality approves it with a signature", async () => {
    const res = await create(content);
    expect(res.status).toBe(201);
    expect(res.body.version.content.phases.charge.map((s: { key: string }) => s.key)).toEqual(["reliefCheck", "chargeDmx", "chargeN2"]);
    const approved = await qa.post(`/api/master-records/versions/${res.body.version.id}/approve`, { password: quality.password });
    expect(approved.status).toBe(200);
    expect(approved.body.version.signatures[0]).toMatchObject({ meaning: "approved", signerName: quality.name, matchesContent: true });
  });

  it("refuses a number field whose low limit is above its high limit, naming the field", async () => {
    const bad = structuredClone(content);
    const field = bad.phases.charge[1].fields[1] as { low: number; high: number };
    field.low = 9;
    field.high = 1;
    const res = await create(bad);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe("content.phases.charge.1.fields.1.low");
  });

  it("refuses repeated step keys and a choice with one option", async () => {
    const dup = structuredClone(content);
    dup.phases.run[0].key = "reliefCheck";
    expect((await create(dup)).body.error.field).toBe("content.phases");
    const oneChoice = structuredClone(content);
    (oneChoice.phases.charge[0].fields[0] as { choices: string[] }).choices = ["only"];
    const res = await create(oneChoice);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe("content.phases.charge.0.fields.0.choices");
  });

  it("refuses a target conversion above the maximum conversion", async () => {
    const res = await create({ ...content, maxConversion: 0.9, targetConversion: 0.95 });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe("content.targetConversion");
  });
});
