import { describe, expect, it } from "vitest";
import { KineticsInputError, computeEpsilonA, type Reaction } from "../../../shared/kinetics/index";

const aToTwoR: Reaction = {
  reactants: [{ species: "A", coefficient: 1, phase: "gas" }],
  products: [{ species: "R", coefficient: 2, phase: "gas" }],
};

function fieldOf(run: () => unknown): string | undefined {
  try {
    run();
  } catch (error) {
    if (error instanceof KineticsInputError) return error.field;
    throw error;
  }
  return undefined;
}

describe("computeEpsilonA", () => {
  it("A → 2R from pure A gives εA = 1 (common practice)", () => {
    expect(computeEpsilonA(aToTwoR, "A", { A: 1 })).toEqual({ epsilonA: 1, delta: 1, yA0: 1 });
  });

  it("A → 2R with 50 % inerts gives εA = 0.5 (common practice)", () => {
    expect(computeEpsilonA(aToTwoR, "A", { A: 0.5, N2: 0.5 }).epsilonA).toBeCloseTo(0.5, 15);
  });

  it("divides by the key species' coefficient and counts only gas-phase species (common practice)", () => {
    // 2A(g) + B(l) → C(g) + D(s): gas moles change by 1 − 2 = −1 per 2 mol of A.
    const reaction: Reaction = {
      reactants: [
        { species: "A", coefficient: 2, phase: "gas" },
        { species: "B", coefficient: 1, phase: "liquid" },
      ],
      products: [
        { species: "C", coefficient: 1, phase: "gas" },
        { species: "D", coefficient: 1, phase: "solid" },
      ],
    };
    const result = computeEpsilonA(reaction, "A", { A: 0.8, Ar: 0.2 });
    expect(result.delta).toBeCloseTo(-0.5, 15);
    expect(result.epsilonA).toBeCloseTo(-0.4, 15);
  });

  it("names the field for each kind of bad input", () => {
    expect(fieldOf(() => computeEpsilonA(aToTwoR, "R", { R: 1 }))).toBe("keySpecies");
    const liquidA: Reaction = { ...aToTwoR, reactants: [{ species: "A", coefficient: 1, phase: "liquid" }] };
    expect(fieldOf(() => computeEpsilonA(liquidA, "A", { A: 1 }))).toBe("keySpecies");
    expect(fieldOf(() => computeEpsilonA(aToTwoR, "A", { A: 0.6, N2: 0.3 }))).toBe("feed");
    const zero: Reaction = { ...aToTwoR, products: [{ species: "R", coefficient: 0, phase: "gas" }] };
    expect(fieldOf(() => computeEpsilonA(zero, "A", { A: 1 }))).toBe("reaction.products[0].coefficient");
    const negative: Reaction = { ...aToTwoR, reactants: [{ species: "A", coefficient: -1, phase: "gas" }] };
    expect(fieldOf(() => computeEpsilonA(negative, "A", { A: 1 }))).toBe("reaction.reactants[0].coefficient");
    expect(fieldOf(() => computeEpsilonA(aToTwoR, "A", { A: 1.2, N2: -0.2 }))).toBe("feed.N2");
    expect(fieldOf(() => computeEpsilonA(aToTwoR, "A", { N2: 1 }))).toBe("feed.A");
  });

  it("refuses a species listed twice on one side instead of reading only its first entry", () => {
    // A + A → B is 2A → B (εA = −0.5 from pure A); counting one A gave −1, which no fit accepts.
    const twice: Reaction = { reactants: [{ species: "A", coefficient: 1, phase: "gas" }, { species: "A", coefficient: 1, phase: "gas" }], products: [{ species: "B", coefficient: 1, phase: "gas" }] };
    expect(fieldOf(() => computeEpsilonA(twice, "A", { A: 1 }))).toBe("reaction.reactants[1].species");
  });

  it("treats a key species named like an object's built-in member as missing from the feed", () => {
    const reaction: Reaction = { reactants: [{ species: "constructor", coefficient: 1, phase: "gas" }], products: [{ species: "R", coefficient: 2, phase: "gas" }] };
    expect(fieldOf(() => computeEpsilonA(reaction, "constructor", { I: 1 }))).toBe("feed.constructor");
    expect(computeEpsilonA(reaction, "constructor", { constructor: 0.5, I: 0.5 }).epsilonA).toBe(0.5);
  });

  it("accepts fractions summing to 1 within 1e−6", () => {
    expect(computeEpsilonA(aToTwoR, "A", { A: 0.7, N2: 0.3000005 }).yA0).toBe(0.7);
  });
});
