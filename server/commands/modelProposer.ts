import { inArray } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { batches, rateModelVersions } from "../db/schema.js";
import { fittedK } from "./campaignTrends.js";
import type { VersionedDocuments } from "./versionedDocuments.js";
import { HttpError, notFound } from "../http/errors.js";
import { fitArrhenius } from "../../shared/kinetics/arrhenius.js";
import { KineticsInputError } from "../../shared/kinetics/kineticsInputError.js";
import type { RateModelContent } from "../../shared/schemas/rateModels.js";
import type { SignedInPerson } from "../policies/access.js";
import { eq } from "drizzle-orm";

/**
 * Proposes a new rate-model version from released batches: k fitted at each batch's recorded
 * temperature, then kRef and Ea by Arrhenius. With `save`, it becomes a draft that records
 * which batches it came from; quality approves it through the usual flow.
 */
export async function proposeModelUpdate(db: Db, docs: VersionedDocuments<RateModelContent>, person: SignedInPerson, versionId: string, batchIds: string[], save: boolean) {
  const [base] = await db.select().from(rateModelVersions).where(eq(rateModelVersions.id, versionId));
  if (!base) throw notFound("That rate-model version");
  const rows = await db.select().from(batches).where(inArray(batches.id, batchIds));
  for (const id of batchIds) {
    const b = rows.find((r) => r.id === id);
    if (!b) throw new HttpError(422, "unknown-batch", `batchIds: no batch has the id ${id}.`, "batchIds");
    if (b.state !== "released") throw new HttpError(422, "batch-not-released", `batchIds: batch ${b.code} is ${b.state}; only released batches feed a model update.`, "batchIds");
  }
  const content = base.content as RateModelContent;
  const points = [];
  for (const id of batchIds) {
    const { record, T, fit } = await fittedK(db, id);
    const [family] = await db.select({ modelId: rateModelVersions.modelId }).from(rateModelVersions).where(eq(rateModelVersions.id, record.model.id));
    if (family.modelId !== base.modelId) throw new HttpError(422, "other-model", `batchIds: batch ${record.batch.code} ran on a different rate model.`, "batchIds");
    points.push({ batchId: id, code: record.batch.code, T, k: fit.k, kStdError: fit.kStdError, kCI95: fit.kCI95, points: fit.points });
  }
  const distinctT = new Set(points.map((p) => p.T.toFixed(2))).size;
  let arrhenius;
  try {
    arrhenius = fitArrhenius(points.map((p) => ({ T: p.T, k: p.k, kStdError: p.kStdError })), content.TRefK, true);
  } catch (err) {
    if (err instanceof KineticsInputError) throw new HttpError(422, "cannot-fit", `batchIds: ${err.message}`, "batchIds");
    throw err;
  }
  const warnings = [...arrhenius.warnings];
  if (distinctT < 3) warnings.push("Fewer than three distinct temperatures: Ea is poorly determined.");
  const proposed: RateModelContent = {
    ...content,
    kRef: arrhenius.kRef,
    EaJPerMol: arrhenius.Ea,
    notes: `Fitted from released batches ${points.map((p) => p.code).join(", ")}: kRef ${arrhenius.kRef.toPrecision(4)} (95 % ${arrhenius.kRefCI95.map((v) => v.toPrecision(4)).join(" to ")}), Ea ${(arrhenius.Ea / 1000).toPrecision(4)} kJ/mol (95 % ${arrhenius.EaCI95.map((v) => (v / 1000).toPrecision(4)).join(" to ")}).`,
  };
  const draft = save ? await docs.createDraft(person, base.modelId, proposed, { basedOnBatchIds: batchIds }) : null;
  return { points, arrhenius: { ...arrhenius, warnings }, proposed, draft };
}
