import { computeEpsilonA } from "../../shared/kinetics/epsilonA.js";
import { KineticsInputError } from "../../shared/kinetics/kineticsInputError.js";
import type { RateModelContent } from "../../shared/schemas/rateModels.js";
import { rateModels, rateModelVersions } from "../db/schema.js";
import { HttpError } from "../http/errors.js";
import type { VersionedKind } from "./versionedDocuments.js";

/** εA, δ and yA0 from the draft's reaction and feed, or 422 naming the field. */
export function deriveEpsilon(content: RateModelContent) {
  try {
    return computeEpsilonA(content.reaction, content.keySpecies, content.feed);
  } catch (err) {
    if (err instanceof KineticsInputError) throw new HttpError(422, "invalid-reaction", err.message, `content.${err.field}`);
    throw err;
  }
}

export const rateModelKind: VersionedKind<RateModelContent> = {
  entityType: "rate-model-version",
  what: "rate model",
  families: rateModels,
  versions: rateModelVersions,
  familyColumn: "modelId",
  derive: (content) => ({ ...deriveEpsilon(content) }),
};
