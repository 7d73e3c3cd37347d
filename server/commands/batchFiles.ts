import { eq } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { batchAttachments, batchSamples, batchTraces, batches, files } from "../db/schema.js";
import type { StorageService } from "../services/storage.js";
import { loadBatchRecord, type BatchRecord } from "./batchRecord.js";
import { recordAudit, SYSTEM_ACTOR } from "./audit.js";
import { raiseDeviation } from "./deviationRecorder.js";
import type { Notifier } from "./notifier.js";
import { combinedTrace } from "./batchTrace.js";
import { runKineticsCheck } from "./kineticsGate.js";
import { announce } from "../services/live.js";
import { writeSample } from "./sampleWriter.js";
import { conflict, HttpError } from "../http/errors.js";
import { createTraceCsvParser, type ParsedTrace } from "../../shared/kinetics/traceCsvParser.js";
import { checkVerdict } from "../../shared/kinetics/checkTrace.js";
import { checkConditionsFor, checkModelFor } from "../../shared/execution/modelAtBatch.js";
import { toSI, fromSI } from "../../shared/units/index.js";
import type { SignedInPerson } from "../policies/access.js";
import type { DbOrTx, Tx } from "../db/client.js";

const ACTIVE = ["charging", "running", "sampling", "review"];
const fmtBar = (pa: number) => `${fromSI(pa, "bar(a)").toFixed(3)} bar(a)`;

async function fileOf(tx: DbOrTx, fileId: string) {
  const [file] = await tx.select().from(files).where(eq(files.id, fileId));
  if (!file) throw new HttpError(422, "unknown-file", "fileId: no uploaded file has this id. Upload it first (POST /api/files).", "fileId");
  return file;
}

async function readText(storage: StorageService, key: string, onChunk: (s: string) => void) {
  const decoder = new TextDecoder("utf-8");
  for await (const chunk of await storage.get(key)) onChunk(decoder.decode(chunk as Uint8Array, { stream: true }));
  onChunk(decoder.decode());
}

/** Safety checks on new readings: above the relief set pressure, or outside the rated volume, raises a deviation at once. */
async function flagReadings(tx: Tx, notify: Notifier, record: BatchRecord, trace: ParsedTrace) {
  const { vessel, batch } = record;
  let maxP = -Infinity;
  let minV = Infinity;
  let maxV = -Infinity;
  for (let i = 0; i < trace.t.length; i++) {
    if (trace.P && trace.P[i] > maxP) maxP = trace.P[i];
    minV = Math.min(minV, trace.V[i]);
    maxV = Math.max(maxV, trace.V[i]);
  }
  const raised: string[] = [];
  if (trace.P && maxP > vessel.reliefSetPa) {
    await raiseDeviation(tx, notify, SYSTEM_ACTOR, batch.id, { title: "Pressure above the relief set pressure", description: `The logger recorded ${fmtBar(maxP)}, above ${vessel.tag}'s relief set pressure of ${fmtBar(vessel.reliefSetPa)} (MAWP ${fmtBar(vessel.mawpPa)}). Check the relief device and the vessel before going on.`, severity: "critical", source: "relief-pressure" });
    raised.push("relief-pressure");
  }
  if (maxV > vessel.maxVolumeL || minV < vessel.minVolumeL) {
    await raiseDeviation(tx, notify, SYSTEM_ACTOR, batch.id, { title: "Volume outside the vessel's rated range", description: `The logger recorded volumes from ${minV.toPrecision(4)} L to ${maxV.toPrecision(4)} L; ${vessel.tag} is rated for ${vessel.minVolumeL} L to ${vessel.maxVolumeL} L.`, severity: "critical", source: "rated-volume" });
    raised.push("rated-volume");
  }
  return raised;
}

/** Attachments, logger traces and samples of a batch; each added, never replacing another. */
export function createBatchFiles(deps: { db: Db; storage: StorageService; notify: Notifier }) {
  return {
    async attach(person: SignedInPerson, batchId: string, input: { fileId: string; stepKey?: string; note?: string }) {
      return deps.db.transaction(async (tx) => {
        const record = await loadBatchRecord(tx, batchId, { forUpdate: true });
        if (!ACTIVE.includes(record.batch.state) && record.batch.state !== "planned" && record.batch.state !== "held") throw conflict("batch-closed", `The batch is ${record.batch.state}; nothing more can be attached.`);
        if (input.stepKey && !record.steps.some((s) => s.step.key === input.stepKey)) throw new HttpError(422, "unknown-step", `stepKey: this batch's master record has no step "${input.stepKey}".`, "stepKey");
        const file = await fileOf(tx, input.fileId);
        const [row] = await tx.insert(batchAttachments).values({ batchId, stepKey: input.stepKey ?? null, fileId: file.id, note: input.note ?? null, addedBy: person.id }).returning();
        await recordAudit(tx, person, { action: "attachment-added", entityType: "batch", entityId: batchId, after: { attachmentId: row.id, fileId: file.id, name: file.originalName, sha256: file.sha256, stepKey: row.stepKey, note: row.note } });
        await announce(tx, { kind: "batch", id: batchId });
        return { ...row, file };
      });
    },

    async addTrace(person: SignedInPerson, batchId: string, input: { fileId: string; boreAreaM2?: number }) {
      const [file] = await deps.db.select().from(files).where(eq(files.id, input.fileId));
      if (!file) throw new HttpError(422, "unknown-file", "fileId: no uploaded file has this id. Upload it first (POST /api/files).", "fileId");
      if (file.contentType !== "text/csv" && file.contentType !== "text/plain") throw new HttpError(415, "trace-not-csv", "fileId: a logger trace must be a CSV file.", "fileId");
      const parser = createTraceCsvParser({ boreArea: input.boreAreaM2 });
      try {
        await readText(deps.storage, file.storageKey, (s) => s && parser.push(s));
      } catch {
        throw new HttpError(503, "storage-unavailable", "The file store is not answering; try again in a moment.");
      }
      const parsed = parser.finish();
      if (!parsed.ok) throw new HttpError(422, "trace-invalid", `The trace file has ${parsed.totalErrors} problem${parsed.totalErrors === 1 ? "" : "s"}: ${parsed.errors[0]?.message}`, "fileId", { problems: parsed.errors, totalProblems: parsed.totalErrors });
      return deps.db.transaction(async (tx) => {
        const record = await loadBatchRecord(tx, batchId, { forUpdate: true });
        if (!["running", "sampling", "review"].includes(record.batch.state)) throw conflict("wrong-phase", `Traces are added while the batch is running, sampling or in review; it is ${record.batch.state}.`);
        const trace = parsed.trace;
        const [row] = await tx
          .insert(batchTraces)
          .values({ batchId, fileId: file.id, sha256: file.sha256, points: trace.t.length, t: Array.from(trace.t), V: Array.from(trace.V), T: trace.T ? Array.from(trace.T) : null, P: trace.P ? Array.from(trace.P) : null, addedBy: person.id })
          .returning({ id: batchTraces.id, points: batchTraces.points });
        await recordAudit(tx, person, { action: "trace-added", entityType: "batch", entityId: batchId, after: { traceId: row.id, fileId: file.id, name: file.originalName, sha256: file.sha256, points: row.points } });
        const raised = await flagReadings(tx, deps.notify, record, trace);
        const band = await bandCheck(tx, record);
        // In review the check has run on the earlier traces: a new trace makes it stale, so it runs again.
        if (record.batch.state === "review") await runKineticsCheck(tx, deps.notify, await loadBatchRecord(tx, batchId), person);
        if (band.outside) {
          await deps.notify.toPerson(tx, record.campaign.createdBy, `Isobatch: ${record.batch.code} trace leaves the model`, `The trace of batch ${record.batch.code} is outside the approved rate model so far:\n${band.reasons.join("\n")}\n\n${deps.notify.link(batchId)}\n`);
        }
        await announce(tx, { kind: "batch", id: batchId });
        return { id: row.id, points: row.points, deviationsRaised: raised, outsideModel: band.outside, reasons: band.reasons };
      });
    },

    async recordSample(person: SignedInPerson, batchId: string, input: { sampledAt: string; volume: { value: number; unit: "mL" | "L" | "m³" }; labResult?: string; fileId?: string }) {
      // Files are never deleted, so one found now is there when the sample is written.
      if (input.fileId) await fileOf(deps.db, input.fileId);
      return writeSample(deps.db.$client, person, batchId, { sampledAt: new Date(input.sampledAt), volumeL: toSI(input.volume.value, input.volume.unit), labResult: input.labResult ?? null, fileId: input.fileId ?? null });
    },
  };
}

// Judging "leaves the model" on a partial trace: only reasons about k, residuals and the bands count;
// "too few points" or "conversion too low" just mean it is early.
const EARLY = new Set(["too-few-points", "conversion-too-low", "fit-failed"]);
async function bandCheck(tx: Tx, record: BatchRecord) {
  const trace = await combinedTrace(tx, record.batch.id);
  const result = checkVerdict({ model: checkModelFor(record.model.content, record.model.epsilonA, record.batch.v0L), conditions: checkConditionsFor(record.batch, record.model.yA0), trace });
  const reasons = result.reasons.filter((r) => !EARLY.has(r.code)).map((r) => r.message);
  return { outside: reasons.length > 0, reasons };
}
