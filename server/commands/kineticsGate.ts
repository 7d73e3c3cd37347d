import { desc, eq } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { kineticsChecks } from "../db/schema.js";
import type { BatchRecord } from "./batchRecord.js";
import { combinedTrace } from "./batchTrace.js";
import { raiseDeviation } from "./deviationRecorder.js";
import type { Notifier } from "./notifier.js";
import { recordAudit, SYSTEM_ACTOR, type Actor } from "./audit.js";
import { checkTrace } from "../../shared/kinetics/checkTrace.js";
import { KINETICS_LIBRARY_VERSION } from "../../shared/kinetics/version.js";
import { checkConditionsFor, checkModelFor } from "../../shared/execution/modelAtBatch.js";
import type { BatchFacts } from "../../shared/machines/batchMoves.js";

export type KineticsCheckRow = typeof kineticsChecks.$inferSelect;

/** What the release guards need from the kinetics check and the review. */
export interface KineticsGate {
  /** `verifyFiles` re-reads every attachment to check its hash (done at release). */
  factsFor(tx: DbOrTx, record: BatchRecord, opts?: { verifyFiles?: boolean }): Promise<{ kinetics: BatchFacts["kinetics"]; unreviewedExceptions: number }>;
}

const hashesOf = (record: BatchRecord) => record.traces.map((t) => t.sha256);
const sameHashes = (a: unknown, b: string[]) => Array.isArray(a) && a.length === b.length && a.every((h, i) => h === b[i]);

const arrays = (r: ReturnType<typeof checkTrace>) => ({
  ...r,
  predicted: Array.from(r.predicted),
  fit: r.fit ? { ...r.fit, residuals: Array.from(r.fit.residuals) } : null,
  linearised: r.linearised ? { ...r.linearised, x: Array.from(r.linearised.x), y: Array.from(r.linearised.y) } : null,
});

/** The latest check that ran on exactly the batch's current traces, or null (none yet, or stale). */
export async function currentCheck(db: DbOrTx, record: BatchRecord): Promise<KineticsCheckRow | null> {
  const [latest] = await db.select().from(kineticsChecks).where(eq(kineticsChecks.batchId, record.batch.id)).orderBy(desc(kineticsChecks.ranAt)).limit(1);
  return latest && sameHashes(latest.traceHashes, hashesOf(record)) && latest.rateModelVersionId === record.model.id ? latest : null;
}

/**
 * Runs the kinetics check on the batch's traces against its pinned model at its recorded
 * conditions, stores the result with its exact inputs, and raises a deviation when the batch
 * falls outside the model (unless one from the check is already there).
 */
export async function runKineticsCheck(tx: DbOrTx, notify: Notifier, record: BatchRecord, actor: Actor): Promise<KineticsCheckRow> {
  const ranBy = actor.id;
  const trace = await combinedTrace(tx, record.batch.id);
  const model = checkModelFor(record.model.content, record.model.epsilonA, record.batch.v0L);
  const conditions = checkConditionsFor(record.batch, record.model.yA0);
  const result = checkTrace({ model, conditions, trace });
  const [row] = await tx
    .insert(kineticsChecks)
    .values({
      batchId: record.batch.id,
      rateModelVersionId: record.model.id,
      libraryVersion: KINETICS_LIBRARY_VERSION,
      traceHashes: hashesOf(record),
      inputs: { model, conditions, tracePoints: trace.t.length, traceFiles: trace.files },
      verdict: result.verdict,
      reasons: result.reasons,
      kObserved: Number.isFinite(result.kObserved) ? result.kObserved : null,
      kObservedLow: Number.isFinite(result.kObservedCI95?.[0]) ? result.kObservedCI95[0] : null,
      kObservedHigh: Number.isFinite(result.kObservedCI95?.[1]) ? result.kObservedCI95[1] : null,
      kModel: result.kModel,
      deviationPct: Number.isFinite(result.deviationPct) ? result.deviationPct : null,
      residualRms: Number.isFinite(result.residualRms) ? result.residualRms : null,
      points: result.points,
      maxConversion: Number.isFinite(result.maxConversion) ? result.maxConversion : null,
      result: arrays(result),
      ranBy,
    })
    .returning();
  await recordAudit(tx, actor, { action: "kinetics-check-ran", entityType: "batch", entityId: record.batch.id, after: { checkId: row.id, verdict: row.verdict, reasons: result.reasons.map((r) => r.code), kObserved: row.kObserved, kModel: row.kModel, libraryVersion: row.libraryVersion, traceHashes: row.traceHashes } });
  const already = record.deviations.some((d) => d.source === "kinetics" && d.status !== "closed");
  if (row.verdict === "outside" && !already) {
    await raiseDeviation(tx, notify, SYSTEM_ACTOR, record.batch.id, {
      title: "Kinetics check: outside the approved model",
      description: `The kinetics check found batch ${record.batch.code} outside rate model version ${record.model.version}:\n${result.reasons.map((r) => `- ${r.message}`).join("\n")}\nRelease needs this investigated and closed (mark it as covering the kinetics result if accepted).`,
      severity: "major",
      source: "kinetics",
    });
  }
  return row;
}

/** Facts for the release guards: the check's verdict (or "not-run" when stale) and review exceptions left. */
export function createKineticsGate(countUnreviewed: (tx: DbOrTx, record: BatchRecord, check: KineticsCheckRow | null, verifyFiles: boolean) => Promise<number>): KineticsGate {
  return {
    async factsFor(tx, record, opts = {}) {
      const check = await currentCheck(tx, record);
      const covered = record.deviations.some((d) => d.status === "closed" && d.coversKinetics);
      return {
        kinetics: { verdict: check ? check.verdict : "not-run", coveredByClosedDeviation: covered },
        unreviewedExceptions: await countUnreviewed(tx, record, check, opts.verifyFiles ?? false),
      };
    },
  };
}
