import { and, asc, eq, inArray, like, or } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { auditEvents, signatures } from "../db/schema.js";
import type { BatchRecord } from "./batchRecord.js";
import type { KineticsCheckRow } from "./kineticsGate.js";
import { KINETICS_LIBRARY_VERSION } from "../../shared/kinetics/version.js";

/**
 * The complete batch record as JSON, for inspection copies: every entry version, every
 * signature on the batch and its parts, the audit rows, the checks, and each file's hash.
 */
export async function batchRecordJson(db: DbOrTx, record: BatchRecord, checks: KineticsCheckRow[]) {
  const { batch } = record;
  const devIds = record.deviations.map((d) => d.id);
  const sigs = await db
    .select()
    .from(signatures)
    .where(or(and(eq(signatures.entityType, "batch"), eq(signatures.entityId, batch.id)), like(signatures.entityId, `${batch.id}/%`), devIds.length ? inArray(signatures.entityId, devIds) : undefined))
    .orderBy(asc(signatures.signedAt));
  const audit = await db.select().from(auditEvents).where(or(eq(auditEvents.entityId, batch.id), like(auditEvents.entityId, `${batch.id}/%`), devIds.length ? inArray(auditEvents.entityId, devIds) : undefined)).orderBy(asc(auditEvents.seq));
  return {
    format: "isobatch-batch-record",
    formatVersion: 1,
    exportedAt: new Date().toISOString(),
    kineticsLibraryVersion: KINETICS_LIBRARY_VERSION,
    batch,
    campaign: record.campaign,
    vessel: record.vessel,
    masterRecordVersion: record.masterRecord,
    rateModelVersion: record.model,
    entries: record.steps.flatMap((s) => s.entries),
    signatures: sigs,
    deviations: record.deviations,
    samples: record.samples,
    attachments: record.attachments.map(({ a, f }) => ({ ...a, file: { id: f.id, originalName: f.originalName, contentType: f.contentType, sizeBytes: f.sizeBytes, sha256: f.sha256 } })),
    traces: record.traces,
    kineticsChecks: checks,
    audit,
  };
}
