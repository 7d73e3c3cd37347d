import { expect } from "vitest";
import type { Express } from "express";
import type { Db } from "../../server/db/client.js";
import { Client } from "./testApp.js";
import { buildPerson, type BuiltPerson } from "../factories.js";
import type { Role } from "../../shared/schemas/roles.js";

const now = () => new Date().toISOString();
/** Good entries for the demo master record's steps at V0 = 22 L. */
export const demoEntries = () => ({
  reliefCheck: { values: { reliefStatus: "In service, tag current", leakTestPressure: 2.5 } },
  chargeDmx: { values: { dmxLot: "DMX-L-0419", dmxMass: 119.0 } }, // 5.41 g per litre × 22 L
  chargeN2: { values: { n2Mass: 8.5 } },
  pressurise: { values: { temperature: 250.1, pressure: 2.0, startedAt: now() } },
  runEnd: { values: { endedAt: now(), finalVolume: 36.9 } },
  sampleGas: { values: { sampleId: "BULB-7", sampledAt: now() } },
  releaseChecklist: { values: { analysisReviewed: "Reviewed, within specification" } },
});

/**
 * First-order rise at constant P and T, V = V0(1 + εA(1 − e^(−kt))) with εA = 0.7, logged
 * every 30 s as a CSV (common practice). `P` overrides the pressure at a time.
 */
export function firstOrderCsv(k: number, V0: number, opts: { P?: (t: number) => number; n?: number; temperatureC?: number } = {}) {
  const lines = ["time (s),volume (L),temperature (°C),pressure (bar(a))"];
  for (let i = 0; i <= (opts.n ?? 60); i++) {
    const time = i * 30;
    lines.push(`${time},${(V0 * (1 + 0.7 * (1 - Math.exp(-k * time)))).toFixed(5)},${(opts.temperatureC ?? 250).toFixed(2)},${(opts.P?.(time) ?? 2.0).toFixed(4)}`);
  }
  return lines.join("\n") + "\n";
}

/** Signed-in people of each role, and the moves and entries a test needs to drive a batch. */
export class BatchDriver {
  people: Record<string, BuiltPerson> = {};
  clients: Record<string, Client> = {};
  constructor(private app: Express, private db: Db) {}

  async add(name: string, roles: Role[]) {
    this.people[name] = await buildPerson(this.db, { roles, name: `Driver ${name} ${Math.random().toString(36).slice(2, 6)}` });
    this.clients[name] = new Client(this.app);
    await this.clients[name].signIn(this.people[name].email, this.people[name].password);
    return this;
  }
  async move(who: string, batchId: string, move: string, extra: object = {}) {
    const c = this.clients[who];
    const current = await c.get(`/api/batches/${batchId}`);
    return c.post(`/api/batches/${batchId}/events`, { move, revision: current.body.batch.revision, ...extra });
  }
  perform(who: string, batchId: string, stepKey: string, body?: object) {
    const entries = demoEntries() as Record<string, object>;
    return this.clients[who].post(`/api/batches/${batchId}/steps/${stepKey}/entries`, { comments: {}, ...(body ?? entries[stepKey]), password: this.people[who].password });
  }
  verify(who: string, batchId: string, stepKey: string) {
    return this.clients[who].post(`/api/batches/${batchId}/steps/${stepKey}/verify`, { password: this.people[who].password });
  }
  async upload(who: string, text: string | Buffer, name = "logger.csv") {
    const c = this.clients[who];
    const res = await c.agent.post("/api/files").set("X-CSRF-Token", c.csrf).attach("file", Buffer.from(text), name);
    return res.body.file as { id: string; sha256: string };
  }
  /** Quality's release: the release checklist, then the signed move. */
  async release(who: string, batchId: string) {
    const view = await this.clients[who].get(`/api/batches/${batchId}`);
    const checklist = view.body.steps?.find((s: { key: string; status: string }) => s.key === "releaseChecklist");
    if (checklist && checklist.status === "not-started") await this.perform(who, batchId, "releaseChecklist");
    return this.move(who, batchId, "RELEASE", { password: this.people[who].password, comment: "released" });
  }
  /** planned → running, with every charge step performed by `op` and verified by `sup`. */
  async chargeAndRun(batchId: string, op = "op", sup = "sup") {
    expect((await this.move(op, batchId, "START_CHARGING")).status).toBe(200);
    for (const key of ["reliefCheck", "chargeDmx", "chargeN2"]) expect((await this.perform(op, batchId, key)).status).toBe(201);
    for (const key of ["reliefCheck", "chargeDmx"]) expect((await this.verify(sup, batchId, key)).status).toBe(200);
    expect((await this.move(op, batchId, "START_RUN")).status).toBe(200);
  }
  /** running → review with a trace of rate constant k (1/s). */
  async runToReview(batchId: string, k: number, op = "op", sup = "sup", traceOpts: Parameters<typeof firstOrderCsv>[2] = {}) {
    const file = await this.upload(op, firstOrderCsv(k, 22, traceOpts));
    expect((await this.clients[op].post(`/api/batches/${batchId}/traces`, { fileId: file.id })).status).toBe(201);
    expect((await this.perform(op, batchId, "pressurise")).status).toBe(201);
    expect((await this.verify(sup, batchId, "pressurise")).status).toBe(200);
    expect((await this.perform(op, batchId, "runEnd")).status).toBe(201);
    expect((await this.move(op, batchId, "START_SAMPLING")).status).toBe(200);
    expect((await this.perform(op, batchId, "sampleGas")).status).toBe(201);
    const res = await this.move(op, batchId, "SUBMIT_FOR_REVIEW");
    expect(res.status).toBe(200);
    return file;
  }
}
