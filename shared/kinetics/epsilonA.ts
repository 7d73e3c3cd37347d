import { KineticsInputError } from "./kineticsInputError.js";

export type Phase = "gas" | "liquid" | "solid";

export interface ReactionParticipant {
  species: string;
  coefficient: number;
  phase: Phase;
}

export interface Reaction {
  reactants: ReactionParticipant[];
  products: ReactionParticipant[];
}

export interface EpsilonAResult {
  epsilonA: number;
  delta: number;
  yA0: number;
}

const FRACTION_SUM_TOLERANCE = 1e-6;

/**
 * Fractional volume change at full conversion of the key species A: εA = yA0·δ, with δ the
 * change in gas moles per mole of A. Feed species absent from the reaction are inert.
 */
export function computeEpsilonA(
  reaction: Reaction,
  keySpecies: string,
  feedMoleFractions: Record<string, number>,
): EpsilonAResult {
  checkParticipants(reaction.reactants, "reaction.reactants");
  checkParticipants(reaction.products, "reaction.products");
  const key = reaction.reactants.find((r) => r.species === keySpecies);
  if (key === undefined) {
    throw new KineticsInputError("keySpecies", `Key species "${keySpecies}" is not a reactant.`);
  }
  if (key.phase !== "gas") {
    throw new KineticsInputError(
      "keySpecies",
      `Key species "${keySpecies}" is a ${key.phase}-phase reactant; it must be in the gas phase.`,
    );
  }
  const yA0 = checkFeed(feedMoleFractions, keySpecies);
  const gasMoles = (list: ReactionParticipant[]) =>
    list.filter((p) => p.phase === "gas").reduce((sum, p) => sum + p.coefficient, 0);
  const delta = (gasMoles(reaction.products) - gasMoles(reaction.reactants)) / key.coefficient;
  return { epsilonA: yA0 * delta, delta, yA0 };
}

function checkParticipants(list: ReactionParticipant[], field: string): void {
  const seen = new Set<string>();
  list.forEach((p, i) => {
    if (seen.has(p.species)) {
      throw new KineticsInputError(
        `${field}[${i}].species`,
        `"${p.species}" appears twice on the same side of the reaction; give it once with its total coefficient.`,
      );
    }
    seen.add(p.species);
    if (!Number.isFinite(p.coefficient) || p.coefficient <= 0) {
      throw new KineticsInputError(
        `${field}[${i}].coefficient`,
        `Stoichiometric coefficient of "${p.species}" must be a positive number (got ${p.coefficient}).`,
      );
    }
    if (p.phase !== "gas" && p.phase !== "liquid" && p.phase !== "solid") {
      throw new KineticsInputError(`${field}[${i}].phase`, `Phase of "${p.species}" must be gas, liquid or solid.`);
    }
  });
}

function checkFeed(feed: Record<string, number>, keySpecies: string): number {
  let sum = 0;
  for (const [species, y] of Object.entries(feed)) {
    if (!Number.isFinite(y) || y < 0) {
      throw new KineticsInputError(
        `feed.${species}`,
        `Mole fraction of "${species}" must be zero or positive (got ${y}).`,
      );
    }
    sum += y;
  }
  if (Math.abs(sum - 1) > FRACTION_SUM_TOLERANCE) {
    throw new KineticsInputError("feed", `Feed mole fractions must sum to 1 (they sum to ${sum}).`);
  }
  // Own properties only: a species named like an object's built-in member ("constructor") is just absent.
  const yA0 = Object.hasOwn(feed, keySpecies) ? feed[keySpecies] : undefined;
  if (yA0 === undefined || !(yA0 > 0)) {
    throw new KineticsInputError(`feed.${keySpecies}`, `Key species "${keySpecies}" is missing from the feed.`);
  }
  return yA0;
}
