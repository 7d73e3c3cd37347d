import { eq, sql } from "drizzle-orm";
import type { Db, DbOrTx } from "../db/client.js";
import { batches, deviations } from "../db/schema.js";
import { recordAudit, SYSTEM_ACTOR, type Actor } from "./audit.js";
import { confirmSigner, recordSignature } from "./signatureRecorder.js";
import type { CheckCredentials } from "./credentialChecker.js";
import type { Notifier } from "./notifier.js";
import { announce } from "../services/live.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import type { SignedInPerson } from "../policies/access.js";

type DeviationRow = typeof deviations.$inferSelect;

export interface RaiseInput {
  title: string;
  description: string;
  severity: "minor" | "major" | "critical";
  stepKey?: string;
  source?: string;
}

/** Exactly what closing a deviation signs. */
const closedContent = (d: DeviationRow) => ({ id: d.id, batchId: d.batchId, title: d.title, description: d.description, severity: d.severity, rootCause: d.rootCause, action: d.action, coversKinetics: d.coversKinetics });

/** Raises a deviation in the caller's transaction (by a person or by a check) and tells the supervisors. */
export async function raiseDeviation(tx: DbOrTx, notify: Notifier, actor: Actor, batchId: string, input: RaiseInput): Promise<DeviationRow> {
  const [batch] = await tx.select({ code: batches.code }).from(batches).where(eq(batches.id, batchId));
  if (!batch) throw notFound("That batch");
  const [row] = await tx
    .insert(deviations)
    .values({ batchId, stepKey: input.stepKey ?? null, source: input.source ?? "person", title: input.title, description: input.description, severity: input.severity, raisedBy: actor.id })
    .returning();
  await recordAudit(tx, actor, { action: "deviation-raised", entityType: "deviation", entityId: row.id, after: { batchId, title: row.title, description: row.description, severity: row.severity, source: row.source, stepKey: row.stepKey } });
  await notify.toRole(tx, "supervisor", `Isobatch: deviation on ${batch.code} — ${row.title}`, `${actor === SYSTEM_ACTOR ? "Isobatch" : actor.name} raised a ${row.severity} deviation on batch ${batch.code}:\n${row.description}\n\nIt needs investigating:\n${notify.link(batchId)}\n`);
  await announce(tx, { kind: "batch", id: batchId });
  return row;
}

/** Deviations: raised by anyone on the batch, investigated by a supervisor, closed by quality with a signature. */
export function createDeviationRecorder(deps: { db: Db; check: CheckCredentials; notify: Notifier }) {
  async function locked(tx: DbOrTx, id: string, revision: number) {
    const [row] = await tx.select().from(deviations).where(eq(deviations.id, id)).for("update");
    if (!row) throw notFound("That deviation");
    if (row.revision !== revision) throw conflict("stale-revision", "Someone changed this deviation since you opened it. Look again.", { currentRevision: row.revision, status: row.status });
    return row;
  }
  return {
    raise: (person: SignedInPerson, batchId: string, input: RaiseInput) => deps.db.transaction((tx) => raiseDeviation(tx, deps.notify, person, batchId, { ...input, source: "person" })),
    investigate: (person: SignedInPerson, id: string, input: { rootCause: string; action: string; coversKinetics: boolean; revision: number }) =>
      deps.db.transaction(async (tx) => {
        const row = await locked(tx, id, input.revision);
        if (row.status === "closed") throw conflict("deviation-closed", "This deviation is closed.");
        const [updated] = await tx
          .update(deviations)
          .set({ status: "investigated", rootCause: input.rootCause, action: input.action, coversKinetics: input.coversKinetics, investigatedBy: person.id, investigatedAt: sql`now()`, revision: row.revision + 1 })
          .where(eq(deviations.id, id))
          .returning();
        await recordAudit(tx, person, { action: "deviation-investigated", entityType: "deviation", entityId: id, before: { status: row.status, rootCause: row.rootCause, action: row.action }, after: { status: "investigated", rootCause: input.rootCause, action: input.action, coversKinetics: input.coversKinetics } });
        const [batch] = await tx.select({ code: batches.code }).from(batches).where(eq(batches.id, row.batchId));
        await deps.notify.toRole(tx, "quality", `Isobatch: deviation on ${batch.code} needs closing — ${row.title}`, `${person.name} investigated the deviation "${row.title}" on batch ${batch.code}.\nRoot cause: ${input.rootCause}\nAction: ${input.action}\n\nIt waits for quality to close it:\n${deps.notify.link(row.batchId)}\n`);
        await announce(tx, { kind: "batch", id: row.batchId });
        return updated;
      }),
    async close(person: SignedInPerson, id: string, input: { password: string; comment?: string; revision: number }) {
      const [current] = await deps.db.select().from(deviations).where(eq(deviations.id, id));
      if (!current) throw notFound("That deviation");
      if (current.status !== "investigated") throw conflict("not-investigated", current.status === "closed" ? "This deviation is already closed." : "A supervisor must investigate this deviation (root cause and action) before it can be closed.");
      if (current.raisedBy === person.id) throw new HttpError(403, "own-deviation", "You raised this deviation, so someone else in quality must close it.");
      await confirmSigner(deps.check, person, input.password);
      return deps.db.transaction(async (tx) => {
        const row = await locked(tx, id, input.revision);
        if (row.status !== "investigated") throw conflict("not-investigated", "This deviation changed a moment ago; look again.");
        const [updated] = await tx.update(deviations).set({ status: "closed", closedBy: person.id, closedAt: sql`now()`, revision: row.revision + 1 }).where(eq(deviations.id, id)).returning();
        await recordSignature(tx, person, { meaning: "closed", entityType: "deviation", entityId: id, content: closedContent(updated), comment: input.comment });
        await recordAudit(tx, person, { action: "deviation-closed", entityType: "deviation", entityId: id, before: { status: "investigated" }, after: { status: "closed" }, reason: input.comment ?? null });
        await announce(tx, { kind: "batch", id: row.batchId });
        return updated;
      });
    },
  };
}

export { closedContent as deviationSignedContent };
