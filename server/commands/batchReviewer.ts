import { eq } from "drizzle-orm";
import { createHash, randomUUID } from "node:crypto";
import { Readable } from "node:stream";
import type { Db, DbOrTx, Tx } from "../db/client.js";
import { batchAttachments, batchRecordDocuments, files } from "../db/schema.js";
import type { StorageService } from "../services/storage.js";
import type { Notifier } from "./notifier.js";
import type { CheckCredentials } from "./credentialChecker.js";
import { loadBatchRecord, type BatchRecord } from "./batchRecord.js";
import { createKineticsGate, currentCheck, runKineticsCheck } from "./kineticsGate.js";
import { EXCEPTION_ENTITY, exceptionEntityId, exceptionSignedContent, reviewExceptions, unreviewedCount } from "./reviewExceptions.js";
import { renderBatchRecordPdf } from "./batchRecordPdf.js";
import { combinedTrace } from "./batchTrace.js";
import { batchYield, flagYield } from "./yieldCheck.js";
import { confirmSigner, recordSignature } from "./signatureRecorder.js";
import { recordAudit } from "./audit.js";
import { announce } from "../services/live.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import type { SignedInPerson } from "../policies/access.js";
import type { BatchState } from "../../shared/machines/batchMoves.js";

/** Review and release: the kinetics gate, review by exception, and the executed record as a PDF. */
export function createBatchReviewer(deps: { db: Db; storage: StorageService; notify: Notifier; check: CheckCredentials }) {
  const gate = createKineticsGate(async (tx, record, check, verifyFiles) => unreviewedCount(await reviewExceptions(tx, record, check, verifyFiles ? deps.storage : undefined)));

  async function recordPdf(tx: DbOrTx, record: BatchRecord) {
    const check = await currentCheck(tx, record);
    const exceptions = await reviewExceptions(tx, record, check);
    const trace = await combinedTrace(tx, record.batch.id);
    return renderBatchRecordPdf(tx, { record, check, exceptions, trace: { t: trace.t as number[], V: trace.V as number[] }, yield: await batchYield(tx, record) });
  }

  // The released record is stored like any other file, and attached to the batch with its hash.
  async function storeReleasedRecord(tx: Tx, record: BatchRecord, person: SignedInPerson) {
    const pdf = await recordPdf(tx, record);
    const sha256 = createHash("sha256").update(pdf).digest("hex");
    const key = `files/${randomUUID()}`;
    try {
      await deps.storage.put(key, Readable.from([pdf]), "application/pdf");
    } catch {
      throw new HttpError(503, "storage-unavailable", "The file store did not take the executed record, so the batch was not released. Try again in a moment.");
    }
    const [file] = await tx.insert(files).values({ storageKey: key, originalName: `${record.batch.code}-executed-record.pdf`, contentType: "application/pdf", sizeBytes: pdf.length, sha256, uploadedBy: person.id }).returning();
    await tx.insert(batchRecordDocuments).values({ batchId: record.batch.id, fileId: file.id, sha256 });
    await tx.insert(batchAttachments).values({ batchId: record.batch.id, fileId: file.id, note: "Executed batch record, as released", addedBy: person.id });
    await recordAudit(tx, person, { action: "executed-record-issued", entityType: "batch", entityId: record.batch.id, after: { fileId: file.id, sha256, bytes: pdf.length } });
  }

  return {
    gate,
    recordPdf: async (batchId: string) => recordPdf(deps.db, await loadBatchRecord(deps.db, batchId)),
    async afterMove(tx: Tx, batchId: string, person: SignedInPerson, to: BatchState) {
      if (to !== "review" && to !== "released") return;
      const record = await loadBatchRecord(tx, batchId);
      if (to === "review") {
        await runKineticsCheck(tx, deps.notify, record, person);
        await flagYield(tx, deps.notify, record);
      }
      else await storeReleasedRecord(tx, record, person);
    },
    async review(batchId: string, verifyFiles = true) {
      const record = await loadBatchRecord(deps.db, batchId);
      const check = await currentCheck(deps.db, record);
      return { record, check, exceptions: await reviewExceptions(deps.db, record, check, verifyFiles ? deps.storage : undefined) };
    },
    async rerunCheck(person: SignedInPerson, batchId: string) {
      return deps.db.transaction(async (tx) => {
        const record = await loadBatchRecord(tx, batchId, { forUpdate: true });
        if (!["running", "sampling", "review"].includes(record.batch.state)) throw conflict("wrong-phase", `The kinetics check runs on a batch that is running, sampling or in review; this one is ${record.batch.state}.`);
        const row = await runKineticsCheck(tx, deps.notify, record, person);
        await announce(tx, { kind: "batch", id: batchId });
        return row;
      });
    },
    async markReviewed(person: SignedInPerson, batchId: string, key: string, password: string, comment?: string) {
      const { record, exceptions } = await this.review(batchId);
      if (record.batch.state !== "review") throw conflict("not-in-review", `The batch is ${record.batch.state}; exceptions are reviewed while it is in review.`);
      const e = exceptions.find((x) => x.key === key);
      if (!e) throw notFound("That review exception");
      if (!e.reviewable) throw conflict("not-reviewable-yet", e.kind === "deviation" ? "Close the deviation first; then review it here." : "This cannot be signed off here: run the kinetics check on the current traces first.");
      if (e.reviewed) throw conflict("already-reviewed", `Already reviewed by ${e.reviewed.signerName}.`);
      await confirmSigner(deps.check, person, password);
      return deps.db.transaction(async (tx) => {
        const sig = await recordSignature(tx, person, { meaning: "reviewed", entityType: EXCEPTION_ENTITY, entityId: exceptionEntityId(batchId, key), content: exceptionSignedContent(batchId, e), comment });
        await announce(tx, { kind: "batch", id: batchId });
        return sig;
      });
    },
  };
}

export type BatchReviewer = ReturnType<typeof createBatchReviewer>;
export const releasedRecordOf = (db: DbOrTx, batchId: string) => db.select().from(batchRecordDocuments).where(eq(batchRecordDocuments.batchId, batchId));
