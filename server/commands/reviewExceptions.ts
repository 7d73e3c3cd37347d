import { and, eq, inArray } from "drizzle-orm";
import { createHash } from "node:crypto";
import type { DbOrTx } from "../db/client.js";
import { signatures } from "../db/schema.js";
import { contentHash } from "./signatureRecorder.js";
import { stepSignedContent, type BatchRecord } from "./batchRecord.js";
import type { KineticsCheckRow } from "./kineticsGate.js";
import type { StorageService } from "../services/storage.js";
import type { SignatureMeaning, SignatureView } from "../../shared/schemas/common.js";

/** An entry made this long after the time it reports is flagged as late (contemporaneous records). */
export const LATE_ENTRY_MINUTES = 60;

export const EXCEPTION_ENTITY = "review-exception";

export interface ReviewException {
  key: string;
  kind: "out-of-limit" | "correction" | "late-entry" | "signature-mismatch" | "deviation" | "kinetics-outside" | "kinetics-not-run" | "attachment-hash";
  title: string;
  detail: Record<string, unknown>;
  stepKey: string | null;
  /** Blocks release until resolved elsewhere (an open deviation, a missing check), not just reviewed. */
  reviewable: boolean;
  reviewed: SignatureView | null;
}

const exceptionEntityId = (batchId: string, key: string) => `${batchId}/${key}`;
/** Exactly what marking an exception reviewed signs. */
export const exceptionSignedContent = (batchId: string, e: Pick<ReviewException, "key" | "kind" | "detail">) => ({ batchId, key: e.key, kind: e.kind, detail: e.detail });

async function sha256Of(storage: StorageService, key: string) {
  const hash = createHash("sha256");
  for await (const chunk of await storage.get(key)) hash.update(chunk as Buffer);
  return hash.digest("hex");
}

/**
 * What in an executed record needs a human before release, in the order quality reads it:
 * out-of-limit values, corrections, late entries, signatures that match nothing recorded,
 * deviations, the kinetics verdict, and (when `storage` is given) attachments whose bytes no
 * longer match their hash.
 */
export async function reviewExceptions(db: DbOrTx, record: BatchRecord, check: KineticsCheckRow | null, storage?: StorageService): Promise<ReviewException[]> {
  const out: Omit<ReviewException, "reviewed">[] = [];
  const batchId = record.batch.id;
  for (const s of record.steps) {
    for (const e of s.entries) {
      for (const field of (e.outOfLimit as string[]) ?? []) {
        const def = s.step.fields.find((f) => f.key === field);
        out.push({ key: `out-of-limit:${e.id}:${field}`, kind: "out-of-limit", title: `${s.step.title}: ${def?.label ?? field} outside its limits`, detail: { entryId: e.id, version: e.version, field, value: (e.values as Record<string, unknown>)[field], comment: (e.comments as Record<string, string>)[field] ?? null }, stepKey: s.step.key, reviewable: true });
      }
      if (e.version > 1) {
        const before = s.entries.find((x) => x.version === e.version - 1);
        out.push({ key: `correction:${e.id}`, kind: "correction", title: `${s.step.title}: corrected (version ${e.version})`, detail: { entryId: e.id, version: e.version, reason: e.reason, oldValues: before?.values ?? null, newValues: e.values }, stepKey: s.step.key, reviewable: true });
      }
      for (const f of s.step.fields) {
        const v = (e.values as Record<string, unknown>)[f.key];
        if (f.kind !== "datetime" || typeof v !== "string") continue;
        const lagMin = (e.enteredAt.getTime() - new Date(v).getTime()) / 60_000;
        if (lagMin > LATE_ENTRY_MINUTES) out.push({ key: `late-entry:${e.id}:${f.key}`, kind: "late-entry", title: `${s.step.title}: ${f.label} entered ${Math.round(lagMin)} min after the time it records`, detail: { entryId: e.id, field: f.key, recordedTime: v, enteredAt: e.enteredAt.toISOString() }, stepKey: s.step.key, reviewable: true });
      }
    }
    const known = new Set(s.entries.map((e) => contentHash(stepSignedContent(batchId, e))));
    for (const sig of s.signatures) {
      if (!known.has(sig.contentHash)) out.push({ key: `signature-mismatch:${sig.id}`, kind: "signature-mismatch", title: `${s.step.title}: a "${sig.meaning}" signature by ${sig.signerName} matches no recorded version of the entry`, detail: { signatureId: sig.id, signer: sig.signerName, meaning: sig.meaning, signedAt: sig.signedAt }, stepKey: s.step.key, reviewable: true });
    }
  }
  for (const d of record.deviations) {
    out.push({ key: `deviation:${d.id}`, kind: "deviation", title: `Deviation (${d.severity}, ${d.status}): ${d.title}`, detail: { deviationId: d.id, status: d.status, rootCause: d.rootCause, action: d.action }, stepKey: d.stepKey, reviewable: d.status === "closed" });
  }
  if (!check) out.push({ key: "kinetics:not-run", kind: "kinetics-not-run", title: "The kinetics check has not run on the current traces", detail: { traces: record.traces.length }, stepKey: null, reviewable: false });
  else if (check.verdict === "outside") out.push({ key: `kinetics:${check.id}`, kind: "kinetics-outside", title: "Kinetics check: outside the model", detail: { checkId: check.id, reasons: check.reasons, kObserved: check.kObserved, kModel: check.kModel }, stepKey: null, reviewable: true });
  if (storage) {
    for (const { a, f } of record.attachments) {
      let actual: string;
      try {
        actual = await sha256Of(storage, f.storageKey);
      } catch {
        actual = "unreadable";
      }
      if (actual !== f.sha256) out.push({ key: `attachment-hash:${a.id}`, kind: "attachment-hash", title: `Attachment ${f.originalName} no longer matches its recorded hash`, detail: { fileId: f.id, expected: f.sha256, actual }, stepKey: a.stepKey, reviewable: true });
    }
  }
  const ids = out.map((e) => exceptionEntityId(batchId, e.key));
  const sigs = ids.length ? await db.select().from(signatures).where(and(eq(signatures.entityType, EXCEPTION_ENTITY), inArray(signatures.entityId, ids))) : [];
  return out.map((e) => {
    const expected = contentHash(exceptionSignedContent(batchId, e));
    const sig = sigs.find((s) => s.entityId === exceptionEntityId(batchId, e.key) && s.contentHash === expected);
    return { ...e, reviewed: sig ? { id: sig.id, signerId: sig.signerId, signerName: sig.signerName, meaning: sig.meaning as SignatureMeaning, comment: sig.comment, signedAt: sig.signedAt.toISOString(), contentHash: sig.contentHash, matchesContent: true } : null };
  });
}

/** How many exceptions still wait for quality's "reviewed" signature. */
export const unreviewedCount = (list: ReviewException[]) => list.filter((e) => e.reviewable && !e.reviewed).length;

export { exceptionEntityId };
