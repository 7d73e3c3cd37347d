import { asc, eq } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { batches, campaigns, rateModelVersions, vessels } from "../db/schema.js";
import { loadBatchRecord } from "./batchRecord.js";
import { currentCheck } from "./kineticsGate.js";
import { combinedTrace } from "./batchTrace.js";
import { notFound } from "../http/errors.js";
import { modelKAt } from "../../shared/execution/modelAtBatch.js";
import { fitVolumes } from "../../shared/kinetics/volumeFit.js";
import { initialConcentrationGas } from "../../shared/kinetics/conversion.js";
import type { RateModelContent } from "../../shared/schemas/rateModels.js";

const MAX_CHART_POINTS = 300;
const mean = (xs: ArrayLike<number>) => (xs.length ? Array.from(xs).reduce((a, b) => a + b, 0) / xs.length : NaN);

/** A batch's temperature as run: the trace's mean when the logger recorded it, else the plan. */
export const recordedTemperature = (trace: { T?: ArrayLike<number> }, plannedK: number) => (trace.T && trace.T.length ? mean(trace.T) : plannedK);

/** Per batch of a campaign, in order: observed k with its interval against the model's k at that batch's temperature, and the conversion trace. */
export async function campaignTrends(db: Db, campaignId: string) {
  const [campaign] = await db.select().from(campaigns).where(eq(campaigns.id, campaignId));
  if (!campaign) throw notFound("That campaign");
  const [model] = await db.select().from(rateModelVersions).where(eq(rateModelVersions.id, campaign.rateModelVersionId));
  const content = model.content as RateModelContent;
  const rows = await db.select({ b: batches, vesselTag: vessels.tag }).from(batches).innerJoin(vessels, eq(vessels.id, batches.vesselId)).where(eq(batches.campaignId, campaignId)).orderBy(asc(batches.createdAt));
  const out = [];
  for (const [index, { b, vesselTag }] of rows.entries()) {
    const record = await loadBatchRecord(db, b.id);
    const check = await currentCheck(db, record);
    const trace = await combinedTrace(db, b.id);
    const T = recordedTemperature(trace, b.temperatureK);
    const stride = Math.max(1, Math.ceil(trace.t.length / MAX_CHART_POINTS));
    const conversion = { t: [] as number[], X: [] as number[] };
    for (let i = 0; i < trace.t.length; i += stride) {
      conversion.t.push(trace.t[i]);
      conversion.X.push((trace.V[i] - b.v0L) / (record.model.epsilonA * b.v0L));
    }
    out.push({
      order: index + 1,
      id: b.id,
      code: b.code,
      state: b.state,
      vesselTag,
      v0L: b.v0L,
      temperatureK: T,
      kModelAtT: modelKAt(record.model.content, T),
      check: check ? { verdict: check.verdict, kObserved: check.kObserved, kObservedCI95: [check.kObservedLow, check.kObservedHigh], deviationPct: check.deviationPct } : null,
      conversion,
    });
  }
  return { campaign: { id: campaign.id, code: campaign.code }, model: { id: model.id, version: model.version, tolerancePct: content.tolerancePct, kRef: content.kRef, TRefK: content.TRefK, EaJPerMol: content.EaJPerMol }, batches: out };
}

/** k fitted to one batch's whole trace at the model's order, at the batch's recorded temperature. */
export async function fittedK(db: Db, batchId: string) {
  const record = await loadBatchRecord(db, batchId);
  const trace = await combinedTrace(db, batchId);
  const { batch, model } = record;
  const cA0 = initialConcentrationGas(model.yA0, batch.pressurePa, batch.temperatureK);
  const fit = fitVolumes(trace, { order: model.content.order, V0: batch.v0L, epsilonA: model.epsilonA, cA0 });
  return { record, T: recordedTemperature(trace, batch.temperatureK), fit };
}
