import type { Db, Tx } from "../db/client.js";
import { batchAttachments, stepEntries } from "../db/schema.js";
import { and, eq, inArray } from "drizzle-orm";
import { loadBatchRecord, stepEntityId, stepSignedContent, STEP_ENTITY, type StepState } from "./batchRecord.js";
import { recordAudit } from "./audit.js";
import { confirmSigner, recordSignature } from "./signatureRecorder.js";
import { requireTraining } from "./trainingRecorder.js";
import type { CheckCredentials } from "./credentialChecker.js";
import type { Notifier } from "./notifier.js";
import { announce } from "../services/live.js";
import { conflict, fromZod, HttpError, notFound } from "../http/errors.js";
import { entrySchemaFor, outOfLimitKeys } from "../../shared/execution/entrySchema.js";
import type { SignedInPerson } from "../policies/access.js";
import type { Phase } from "../../shared/schemas/masterRecords.js";
import type { Role } from "../../shared/schemas/roles.js";

/** The batch state in which each phase's steps are executed. */
export const PHASE_STATE: Record<Phase, string> = { charge: "charging", run: "running", sample: "sampling", release: "review" };
const ORDER = ["planned", "charging", "running", "sampling", "review"];
const PERFORMERS: Record<Phase, Role[]> = { charge: ["operator", "supervisor"], run: ["operator", "supervisor"], sample: ["operator", "supervisor"], release: ["quality"] };

export interface StepRecorderDeps {
  db: Db;
  check: CheckCredentials;
  notify: Notifier;
}

interface EntryInput {
  values: Record<string, unknown>;
  comments: Record<string, string>;
  password: string;
  reason?: string;
}

/** Performing, correcting and verifying steps, each with its electronic signature. */
export function createStepRecorder(deps: StepRecorderDeps) {
  async function write(person: SignedInPerson, batchId: string, stepKey: string, input: EntryInput, kind: "perform" | "correct") {
    await confirmSigner(deps.check, person, input.password);
    return deps.db.transaction(async (tx) => {
      const record = await loadBatchRecord(tx, batchId, { forUpdate: true });
      const s = findStep(record.steps, stepKey);
      if (!PERFORMERS[s.phase].some((r) => person.roles.includes(r))) throw new HttpError(403, "forbidden", `Steps of the ${s.phase} phase are performed by ${PERFORMERS[s.phase].join(" or ")}.`);
      await requireTraining(tx, person.id, record.batch.masterRecordVersionId);
      const state = record.batch.state;
      if (kind === "perform") {
        if (state !== PHASE_STATE[s.phase]) throw conflict("wrong-phase", `"${s.step.title}" belongs to the ${s.phase} phase; the batch is ${state}.`);
        if (s.current) throw conflict("already-performed", `"${s.step.title}" is already performed. To change it, record a correction with a reason.`);
      } else {
        if (!s.current) throw conflict("nothing-to-correct", `"${s.step.title}" has no entry to correct yet.`);
        if (ORDER.indexOf(state) < ORDER.indexOf(PHASE_STATE[s.phase])) throw conflict("wrong-phase", `The batch is ${state}; nothing of the ${s.phase} phase can be corrected yet.`);
        if (!ORDER.includes(state)) throw conflict("batch-closed", `The batch is ${state}; its record can no longer be corrected.`);
      }
      const parsed = entrySchemaFor(s.step, record.batch.v0L).safeParse({ values: input.values, comments: input.comments });
      if (!parsed.success) throw fromZod(parsed.error);
      await checkAttachments(tx, batchId, s, parsed.data.values);
      const version = (s.current?.version ?? 0) + 1;
      const [entry] = await tx
        .insert(stepEntries)
        .values({ batchId, phase: s.phase, stepKey, version, values: parsed.data.values, comments: parsed.data.comments, outOfLimit: outOfLimitKeys(s.step, parsed.data.values, record.batch.v0L), reason: input.reason ?? null, enteredBy: person.id })
        .returning();
      await recordSignature(tx, person, { meaning: "performed", entityType: STEP_ENTITY, entityId: stepEntityId(batchId, stepKey), content: stepSignedContent(batchId, entry), comment: input.reason ?? null });
      await recordAudit(tx, person, {
        action: kind === "perform" ? "step-performed" : "step-corrected",
        entityType: STEP_ENTITY,
        entityId: stepEntityId(batchId, stepKey),
        before: s.current ? { version: s.current.version, values: s.current.values, comments: s.current.comments } : null,
        after: { version, values: entry.values, comments: entry.comments, outOfLimit: entry.outOfLimit },
        reason: input.reason ?? null,
      });
      if (s.step.critical) {
        await deps.notify.toRole(tx, "supervisor", `Isobatch: ${record.batch.code} — "${s.step.title}" waits for your verification`, `${person.name} ${kind === "perform" ? "performed" : "corrected"} the critical step "${s.step.title}" of batch ${record.batch.code}. It needs a second person's verification.\n\n${deps.notify.link(batchId)}\n`);
      }
      await announce(tx, { kind: "batch", id: batchId });
      return entry;
    });
  }

  return {
    perform: (person: SignedInPerson, batchId: string, stepKey: string, input: EntryInput) => write(person, batchId, stepKey, input, "perform"),
    correct: (person: SignedInPerson, batchId: string, stepKey: string, input: EntryInput & { reason: string }) => write(person, batchId, stepKey, input, "correct"),
    async verify(person: SignedInPerson, batchId: string, stepKey: string, password: string, comment?: string) {
      await confirmSigner(deps.check, person, password);
      return deps.db.transaction(async (tx) => {
        const record = await loadBatchRecord(tx, batchId, { forUpdate: true });
        const s = findStep(record.steps, stepKey);
        await requireTraining(tx, person.id, record.batch.masterRecordVersionId);
        if (!s.step.critical) throw conflict("not-critical", `"${s.step.title}" is not a critical step; it needs no verification.`);
        if (!s.current || s.status === "not-started") throw conflict("nothing-to-verify", `"${s.step.title}" has not been performed yet.`);
        if (s.status === "complete") throw conflict("already-verified", `"${s.step.title}" is already verified.`);
        if (s.current.enteredBy === person.id) throw new HttpError(403, "own-entry", "You entered this step, so a second person must verify it.");
        if (!ORDER.includes(record.batch.state)) throw conflict("batch-closed", `The batch is ${record.batch.state}.`);
        const sig = await recordSignature(tx, person, { meaning: "verified", entityType: STEP_ENTITY, entityId: stepEntityId(batchId, stepKey), content: stepSignedContent(batchId, s.current), comment });
        await announce(tx, { kind: "batch", id: batchId });
        return sig;
      });
    },
  };
}

function findStep(steps: StepState[], stepKey: string): StepState {
  const s = steps.find((x) => x.step.key === stepKey);
  if (!s) throw notFound(`A step "${stepKey.slice(0, 40)}" in this batch's master record`);
  return s;
}

// An attachment field must name a file already attached to this batch.
async function checkAttachments(tx: Tx, batchId: string, s: StepState, values: Record<string, unknown>) {
  const ids = s.step.fields.filter((f) => f.kind === "attachment" && typeof values[f.key] === "string").map((f) => values[f.key] as string);
  if (ids.length === 0) return;
  const found = await tx.select({ fileId: batchAttachments.fileId }).from(batchAttachments).where(and(eq(batchAttachments.batchId, batchId), inArray(batchAttachments.fileId, ids)));
  const missing = s.step.fields.find((f) => f.kind === "attachment" && typeof values[f.key] === "string" && !found.some((x) => x.fileId === values[f.key]));
  if (missing) throw new HttpError(422, "attachment-not-on-batch", `values.${missing.key}: attach the file to this batch first.`, `values.${missing.key}`);
}
