import { demoEntries } from "./batchDriver.js";
import type { HttpSession } from "./httpSession.js";
import type { BuiltPerson } from "../factories.js";

export interface Signer {
  session: HttpSession;
  person: BuiltPerson;
}

async function expectStatus(what: string, pending: Promise<{ status: number; text: string }>, status: number) {
  const res = await pending;
  if (res.status !== status) throw new Error(`${what}: expected ${status}, got ${res.status} ${res.text.slice(0, 300)}`);
}

async function move(who: Signer, batchId: string, name: string) {
  const view = await who.session.get(`/api/batches/${batchId}`);
  await expectStatus(name, who.session.post(`/api/batches/${batchId}/events`, { move: name, revision: view.body.batch.revision }), 200);
}

/** planned → charging → running over HTTP: the charge steps performed by `op`, the critical ones verified by `sup`. */
export async function bringToRunning(op: Signer, sup: Signer, batchId: string): Promise<void> {
  const entries = demoEntries() as Record<string, object>;
  await move(op, batchId, "START_CHARGING");
  for (const key of ["reliefCheck", "chargeDmx", "chargeN2"]) {
    await expectStatus(`perform ${key}`, op.session.post(`/api/batches/${batchId}/steps/${key}/entries`, { comments: {}, ...entries[key], password: op.person.password }), 201);
  }
  for (const key of ["reliefCheck", "chargeDmx"]) {
    await expectStatus(`verify ${key}`, sup.session.post(`/api/batches/${batchId}/steps/${key}/verify`, { password: sup.person.password }), 200);
  }
  await move(op, batchId, "START_RUN");
}
