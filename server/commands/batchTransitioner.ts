import { and, eq } from "drizzle-orm";
import type { Db, Tx } from "../db/client.js";
import { batches } from "../db/schema.js";
import { loadBatchRecord } from "./batchRecord.js";
import { factsFor } from "./batchFacts.js";
import { recordAudit } from "./audit.js";
import { confirmSigner, recordSignature } from "./signatureRecorder.js";
import type { CheckCredentials } from "./credentialChecker.js";
import type { Notifier } from "./notifier.js";
import { announce } from "../services/live.js";
import { conflict, HttpError } from "../http/errors.js";
import { decideMove } from "../../shared/machines/batchLifecycle.js";
import type { BatchState, HoldableState } from "../../shared/machines/batchMoves.js";
import type { BatchEventInput } from "../../shared/schemas/batches.js";
import type { SignedInPerson } from "../policies/access.js";
import type { SignatureMeaning } from "../../shared/schemas/common.js";
import type { KineticsGate } from "./kineticsGate.js";

const SIGNED_MOVES: Partial<Record<BatchEventInput["move"], SignatureMeaning>> = { RESUME: "resumed", RELEASE: "released", REJECT: "rejected" };

export interface TransitionerDeps {
  db: Db;
  check: CheckCredentials;
  notify: Notifier;
  gate?: KineticsGate;
  /** Runs in the move's transaction once the new state is written (the kinetics check at review, the record at release). */
  afterMove?: (tx: Tx, batchId: string, person: SignedInPerson, to: BatchState) => Promise<void>;
}

/**
 * Applies one lifecycle move. The machine decides from the persisted state and the facts read
 * in the same transaction; the new state, its audit row, any signature and any mail are
 * written together, and a stale revision answers 409 with the current state.
 */
export function createBatchTransitioner(deps: TransitionerDeps) {
  return async function applyMove(person: SignedInPerson, batchId: string, input: BatchEventInput) {
    const meaning = SIGNED_MOVES[input.move];
    if (meaning) await confirmSigner(deps.check, person, input.password!);
    return deps.db.transaction(async (tx) => {
      const record = await loadBatchRecord(tx, batchId, { forUpdate: true });
      const { batch } = record;
      if (batch.revision !== input.revision) {
        throw conflict("stale-revision", `Someone moved this batch a moment ago: it is now ${batch.state} (revision ${batch.revision}). Look again before you act.`, { state: batch.state, revision: batch.revision });
      }
      const gateFacts = deps.gate ? await deps.gate.factsFor(tx, record, { verifyFiles: input.move === "RELEASE" }) : undefined;
      const facts = factsFor(record, person, gateFacts?.kinetics, gateFacts?.unreviewedExceptions);
      const decision = decideMove(batch.state as BatchState, (batch.heldFrom as HoldableState | null) ?? null, input.move, facts);
      if (!decision.allowed) {
        // Missing the role is a permission refusal; anything else is the batch not being ready.
        const status = decision.refusals.every((r) => r.code === "role-missing") ? 403 : 409;
        throw new HttpError(status, "move-refused", decision.refusals.map((r) => r.message).join(" "), undefined, { refusals: decision.refusals, state: batch.state, revision: batch.revision });
      }
      const next = decision.next;
      const [updated] = await tx
        .update(batches)
        .set({ state: next.state, heldFrom: next.heldFrom, holdReason: input.move === "HOLD" ? input.reason! : null, revision: batch.revision + 1 })
        .where(and(eq(batches.id, batchId), eq(batches.revision, batch.revision)))
        .returning();
      if (!updated) throw conflict("stale-revision", "Someone moved this batch a moment ago. Look again before you act.");
      if (meaning) {
        await recordSignature(tx, person, { meaning, entityType: "batch", entityId: batchId, content: { batchId, code: batch.code, move: input.move, from: batch.state, to: next.state, revision: updated.revision }, comment: input.comment ?? input.reason ?? null });
      }
      await recordAudit(tx, person, { action: `batch-${input.move.toLowerCase().replace(/_/g, "-")}`, entityType: "batch", entityId: batchId, before: { state: batch.state, heldFrom: batch.heldFrom, revision: batch.revision }, after: { state: next.state, heldFrom: next.heldFrom, revision: updated.revision }, reason: input.reason ?? input.comment ?? null });
      await deps.afterMove?.(tx, batchId, person, next.state);
      await notifyMove(tx, deps.notify, input, batch.code, batchId, person);
      await announce(tx, { kind: "batch", id: batchId });
      return { state: updated.state, revision: updated.revision };
    });
  };
}

async function notifyMove(tx: Tx, notify: Notifier, input: BatchEventInput, code: string, batchId: string, person: SignedInPerson) {
  if (input.move === "HOLD") {
    await notify.toRole(tx, "supervisor", `Isobatch: batch ${code} is on hold`, `${person.name} put batch ${code} on hold.\nReason: ${input.reason}\n\nResuming needs a supervisor's signature:\n${notify.link(batchId)}\n`);
  }
  if (input.move === "SUBMIT_FOR_REVIEW") {
    await notify.toRole(tx, "quality", `Isobatch: batch ${code} is ready for review`, `Batch ${code} has reached review.\n\n${notify.link(batchId)}\n`);
  }
}

export type ApplyMove = ReturnType<typeof createBatchTransitioner>;
