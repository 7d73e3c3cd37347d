import { and, asc, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { batchAttachments, batchSamples, batchTraces, batches, campaigns, deviations, files, masterRecordVersions, rateModelVersions, signatures, stepEntries, vessels } from "../db/schema.js";
import { notFound } from "../http/errors.js";
import { contentHash } from "./signatureRecorder.js";
import { PHASES, type MasterRecordContent, type Phase, type StepDefinition } from "../../shared/schemas/masterRecords.js";
import type { RateModelContent } from "../../shared/schemas/rateModels.js";
import type { SignatureMeaning, SignatureView } from "../../shared/schemas/common.js";

type Entry = typeof stepEntries.$inferSelect;

export const STEP_ENTITY = "batch-step";
export const stepEntityId = (batchId: string, stepKey: string) => `${batchId}/${stepKey}`;

/** Exactly what a step signature signs: the step's current entry. */
export const stepSignedContent = (batchId: string, e: Entry) => ({ batchId, stepKey: e.stepKey, version: e.version, values: e.values, comments: e.comments });

export interface StepState {
  phase: Phase;
  step: StepDefinition;
  entries: Entry[];
  current: Entry | null;
  signatures: SignatureView[];
  status: "not-started" | "awaiting-verification" | "complete";
  performedBy: string | null;
  verifiedBy: string | null;
}

/** Everything recorded for one batch, read in one place for the batch page, the guards and the record. */
export async function loadBatchRecord(db: DbOrTx, batchId: string, opts: { forUpdate?: boolean } = {}) {
  const q = db.select().from(batches).where(eq(batches.id, batchId));
  const [batch] = opts.forUpdate ? await q.for("update") : await q;
  if (!batch) throw notFound("That batch");
  // One query at a time: inside a transaction they share one connection.
  const [vessel] = await db.select().from(vessels).where(eq(vessels.id, batch.vesselId));
  const [campaign] = await db.select().from(campaigns).where(eq(campaigns.id, batch.campaignId));
  const [record] = await db.select().from(masterRecordVersions).where(eq(masterRecordVersions.id, batch.masterRecordVersionId));
  const [model] = await db.select().from(rateModelVersions).where(eq(rateModelVersions.id, batch.rateModelVersionId));
  const entries = await db.select().from(stepEntries).where(eq(stepEntries.batchId, batchId)).orderBy(asc(stepEntries.stepKey), asc(stepEntries.version));
  const stepIds = PHASES.flatMap((p) => (record.content as MasterRecordContent).phases[p].map((s) => stepEntityId(batchId, s.key)));
  const stepSigs = stepIds.length ? await db.select().from(signatures).where(and(eq(signatures.entityType, STEP_ENTITY), inArray(signatures.entityId, stepIds))).orderBy(asc(signatures.signedAt)) : [];
  const devs = await db.select().from(deviations).where(eq(deviations.batchId, batchId)).orderBy(asc(deviations.raisedAt));
  const attachments = await db.select({ a: batchAttachments, f: files }).from(batchAttachments).innerJoin(files, eq(files.id, batchAttachments.fileId)).where(eq(batchAttachments.batchId, batchId)).orderBy(asc(batchAttachments.addedAt));
  const traces = await db.select({ id: batchTraces.id, fileId: batchTraces.fileId, sha256: batchTraces.sha256, points: batchTraces.points, addedBy: batchTraces.addedBy, addedAt: batchTraces.addedAt }).from(batchTraces).where(eq(batchTraces.batchId, batchId)).orderBy(asc(batchTraces.addedAt));
  const samples = await db.select().from(batchSamples).where(eq(batchSamples.batchId, batchId)).orderBy(asc(batchSamples.sampledAt));
  const content = record.content as MasterRecordContent;
  const steps: StepState[] = [];
  for (const phase of PHASES) {
    for (const step of content.phases[phase]) {
      const mine = entries.filter((e) => e.stepKey === step.key);
      const current = mine.at(-1) ?? null;
      const currentHash = current ? contentHash(stepSignedContent(batchId, current)) : null;
      const sigs: SignatureView[] = stepSigs
        .filter((s) => s.entityId === stepEntityId(batchId, step.key))
        .map((s) => ({ id: s.id, signerId: s.signerId, signerName: s.signerName, meaning: s.meaning as SignatureMeaning, comment: s.comment, signedAt: s.signedAt.toISOString(), contentHash: s.contentHash, matchesContent: s.contentHash === currentHash }));
      const performed = current ? sigs.find((s) => s.meaning === "performed" && s.matchesContent && s.signerId === current.enteredBy) : undefined;
      const verified = current ? sigs.find((s) => s.meaning === "verified" && s.matchesContent && s.signerId !== current.enteredBy) : undefined;
      const status = !performed ? "not-started" : step.critical && !verified ? "awaiting-verification" : "complete";
      steps.push({ phase, step, entries: mine, current, signatures: sigs, status, performedBy: performed?.signerId ?? null, verifiedBy: verified?.signerId ?? null });
    }
  }
  return { batch, vessel, campaign, masterRecord: { ...record, content }, model: { ...model, content: model.content as RateModelContent }, steps, deviations: devs, attachments, traces, samples };
}

export type BatchRecord = Awaited<ReturnType<typeof loadBatchRecord>>;
