import { inArray } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.js";
import { people } from "../../db/schema.js";
import type { BatchRecord } from "../../commands/batchRecord.js";
import { factsFor } from "../../commands/batchFacts.js";
import { limitsAtScale } from "../../../shared/execution/entrySchema.js";
import { modelKAt } from "../../../shared/execution/modelAtBatch.js";
import { decideMove, movesFrom } from "../../../shared/machines/batchLifecycle.js";
import { MOVE_LABELS, type BatchFacts, type BatchState, type HoldableState } from "../../../shared/machines/batchMoves.js";
import type { SignedInPerson } from "../../policies/access.js";
import { trainingProblem } from "../../commands/trainingRecorder.js";
import type { BatchTrainingView } from "../../../shared/schemas/training.js";

/** Whether the viewer's training lets them perform or verify this batch's steps, and if not, why. */
async function viewerTraining(db: DbOrTx, viewer: SignedInPerson, masterRecordVersionId: string): Promise<BatchTrainingView> {
  const problem = await trainingProblem(db, viewer.id, masterRecordVersionId);
  return problem ? { current: false, code: problem.code, message: problem.message } : { current: true };
}

/** The batch page's data: the pinned definitions, everything recorded, and what this person may do next. */
export async function presentBatch(db: DbOrTx, record: BatchRecord, viewer: SignedInPerson, gate?: Pick<BatchFacts, "kinetics" | "unreviewedExceptions">) {
  const ids = new Set<string>();
  for (const s of record.steps) for (const id of [...s.entries.map((e) => e.enteredBy), s.performedBy, s.verifiedBy]) if (id) ids.add(id);
  for (const d of record.deviations) [d.raisedBy, d.investigatedBy, d.closedBy].forEach((id) => id && ids.add(id));
  for (const a of record.attachments) ids.add(a.a.addedBy);
  for (const t of record.traces) ids.add(t.addedBy);
  for (const s of record.samples) ids.add(s.takenBy);
  const names = new Map((ids.size ? await db.select({ id: people.id, name: people.name }).from(people).where(inArray(people.id, [...ids])) : []).map((p) => [p.id, p.name]));
  const who = (id: string | null) => (id ? { id, name: names.get(id) ?? "unknown" } : null);
  const { batch, vessel, campaign, masterRecord, model } = record;
  const facts = factsFor(record, viewer, gate?.kinetics, gate?.unreviewedExceptions);
  const training = await viewerTraining(db, viewer, batch.masterRecordVersionId);
  const moves = movesFrom(batch.state as BatchState).map((move) => {
    const d = decideMove(batch.state as BatchState, (batch.heldFrom as HoldableState | null) ?? null, move, facts);
    return { move, label: MOVE_LABELS[move], allowed: d.allowed, refusals: d.allowed ? [] : d.refusals };
  });
  return {
    batch: { id: batch.id, code: batch.code, state: batch.state, heldFrom: batch.heldFrom, holdReason: batch.holdReason, revision: batch.revision, v0L: batch.v0L, temperatureK: batch.temperatureK, pressurePa: batch.pressurePa, entered: batch.entered, plan: batch.plan, createdAt: batch.createdAt.toISOString() },
    campaign: { id: campaign.id, code: campaign.code, process: campaign.process },
    vessel: { id: vessel.id, tag: vessel.tag, description: vessel.description, status: vessel.status, mawpPa: vessel.mawpPa, reliefSetPa: vessel.reliefSetPa, minVolumeL: vessel.minVolumeL, maxVolumeL: vessel.maxVolumeL, boreAreaM2: vessel.boreAreaM2, entered: { pressureUnit: vessel.pressureUnit, volumeUnit: vessel.volumeUnit } },
    masterRecord: { id: masterRecord.id, version: masterRecord.version, targetConversion: masterRecord.content.targetConversion, maxConversion: masterRecord.content.maxConversion },
    rateModel: { id: model.id, version: model.version, epsilonA: model.epsilonA, yA0: model.yA0, content: model.content, kAtBatchTemperature: modelKAt(model.content, batch.temperatureK) },
    steps: record.steps.map((s) => ({
      phase: s.phase,
      key: s.step.key,
      title: s.step.title,
      instructions: s.step.instructions,
      critical: s.step.critical,
      fields: s.step.fields.map((f) => ({ ...f, limitsAtScale: limitsAtScale(f, batch.v0L) })),
      status: s.status,
      performedBy: who(s.performedBy),
      verifiedBy: who(s.verifiedBy),
      entries: s.entries.map((e) => ({ id: e.id, version: e.version, values: e.values, comments: e.comments, outOfLimit: e.outOfLimit, reason: e.reason, enteredBy: who(e.enteredBy), enteredAt: e.enteredAt.toISOString() })),
      signatures: s.signatures,
    })),
    deviations: record.deviations.map((d) => ({ id: d.id, stepKey: d.stepKey, source: d.source, title: d.title, description: d.description, severity: d.severity, status: d.status, rootCause: d.rootCause, action: d.action, coversKinetics: d.coversKinetics, raisedBy: who(d.raisedBy), raisedAt: d.raisedAt.toISOString(), investigatedBy: who(d.investigatedBy), closedBy: who(d.closedBy), closedAt: d.closedAt?.toISOString() ?? null, revision: d.revision })),
    attachments: record.attachments.map(({ a, f }) => ({ id: a.id, stepKey: a.stepKey, note: a.note, file: { id: f.id, name: f.originalName, contentType: f.contentType, sizeBytes: f.sizeBytes, sha256: f.sha256 }, addedBy: who(a.addedBy), addedAt: a.addedAt.toISOString() })),
    traces: record.traces.map((t) => ({ id: t.id, fileId: t.fileId, sha256: t.sha256, points: t.points, addedBy: who(t.addedBy), addedAt: t.addedAt.toISOString() })),
    samples: record.samples.map((s) => ({ id: s.id, sampledAt: s.sampledAt.toISOString(), volumeL: s.volumeL, labResult: s.labResult, fileId: s.fileId, takenBy: who(s.takenBy) })),
    facts,
    moves,
    training,
  };
}
