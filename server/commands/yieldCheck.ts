import type { DbOrTx } from "../db/client.js";
import type { BatchRecord } from "./batchRecord.js";
import { combinedTrace } from "./batchTrace.js";
import { raiseDeviation } from "./deviationRecorder.js";
import { SYSTEM_ACTOR } from "./audit.js";
import type { Notifier } from "./notifier.js";

export interface BatchYield {
  finalConversion: number | null;
  limits: { low: number; high: number } | null;
  within: boolean | null;
}

/** The yield: the final conversion read from the last volume against the theoretical (complete) conversion. */
export async function batchYield(db: DbOrTx, record: BatchRecord): Promise<BatchYield> {
  const trace = await combinedTrace(db, record.batch.id);
  const limits = record.masterRecord.content.yieldLimits ?? null;
  const n = trace.V.length;
  const finalConversion = n && record.model.epsilonA !== 0 ? (trace.V[n - 1] - record.batch.v0L) / (record.model.epsilonA * record.batch.v0L) : null;
  const within = finalConversion === null || !limits ? null : finalConversion >= limits.low && finalConversion <= limits.high;
  return { finalConversion, limits, within };
}

/** Opens a deviation when the yield falls outside the master record's limits (run at review). */
export async function flagYield(tx: DbOrTx, notify: Notifier, record: BatchRecord): Promise<BatchYield> {
  const y = await batchYield(tx, record);
  if (y.within === false && y.limits && y.finalConversion !== null) {
    await raiseDeviation(tx, notify, SYSTEM_ACTOR, record.batch.id, {
      title: "Yield outside the master record's limits",
      description: `The final conversion read from the trace is ${y.finalConversion.toFixed(3)} of the theoretical; the master record accepts ${y.limits.low} to ${y.limits.high}.`,
      severity: "major",
      source: "yield",
    });
  }
  return y;
}
