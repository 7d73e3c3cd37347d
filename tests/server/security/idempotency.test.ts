import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { buildPlannedBatch } from "../../factories.js";
import { BatchDriver } from "../../support/batchDriver.js";
import { batchSamples, deviations, stepEntries, batches } from "../../../server/db/schema.js";

let t: TestApp;
let d: BatchDriver;
beforeAll(async () => {
  t = await startTestApp();
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("sup", ["supervisor"]);
});
afterAll(() => t.close());

const twice = async (path: string, body: object) => {
  const key = randomUUID();
  const send = () => d.clients.op.agent.post(path).set("X-CSRF-Token", d.clients.op.csrf).set("Idempotency-Key", key).send(body);
  const first = await send();
  const second = await send();
  return { first, second, key };
};

describe("a retried request is applied once and answered as the first time", () => {
  it("for a lifecycle move, a step entry, a deviation and a sample", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    const move = await twice(`/api/batches/${batch.id}/events`, { move: "START_CHARGING", revision: batch.revision });
    expect(move.first.status).toBe(200);
    expect(move.second.status).toBe(200); // not 409: it is the same request again
    expect(move.second.headers["idempotent-replay"]).toBe("true");
    expect(move.second.body).toEqual(move.first.body);
    expect((await t.database.db.select().from(batches).where(eq(batches.id, batch.id)))[0].revision).toBe(batch.revision + 1);

    const entry = await twice(`/api/batches/${batch.id}/steps/chargeN2/entries`, { values: { n2Mass: 8.5 }, comments: {}, password: d.people.op.password });
    expect([entry.first.status, entry.second.status]).toEqual([201, 201]);
    expect(await t.database.db.select().from(stepEntries).where(eq(stepEntries.batchId, batch.id))).toHaveLength(1);

    const dev = await twice(`/api/batches/${batch.id}/deviations`, { title: "Gauge unreadable", description: "The local gauge glass is fogged.", severity: "minor" });
    expect(dev.second.body).toEqual(dev.first.body);
    expect(await t.database.db.select().from(deviations).where(eq(deviations.batchId, batch.id))).toHaveLength(1);

    await d.chargeAndRun((await buildPlannedBatch(t.database.db)).batch.id);
    const running = (await t.database.db.select().from(batches).where(eq(batches.state, "running")))[0];
    const sample = await twice(`/api/batches/${running.id}/samples`, { sampledAt: new Date().toISOString(), volume: { value: 30, unit: "L" } });
    expect(sample.second.body).toEqual(sample.first.body);
    expect(await t.database.db.select().from(batchSamples).where(eq(batchSamples.batchId, running.id))).toHaveLength(1);
  });

  it("refuses a key used again for another request, and a malformed key", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    const key = randomUUID();
    await d.clients.op.agent.post(`/api/batches/${batch.id}/deviations`).set("X-CSRF-Token", d.clients.op.csrf).set("Idempotency-Key", key).send({ title: "One", description: "first", severity: "minor" });
    const other = await d.clients.op.agent.post(`/api/batches/${batch.id}/events`).set("X-CSRF-Token", d.clients.op.csrf).set("Idempotency-Key", key).send({ move: "START_CHARGING", revision: 1 });
    expect(other.status).toBe(422);
    expect(other.body.error.field).toBe("Idempotency-Key");
    const bad = await d.clients.op.agent.post(`/api/batches/${batch.id}/deviations`).set("X-CSRF-Token", d.clients.op.csrf).set("Idempotency-Key", "x y").send({});
    expect(bad.status).toBe(400);
  });
});
