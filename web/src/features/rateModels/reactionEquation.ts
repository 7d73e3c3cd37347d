interface Participant {
  species: string;
  coefficient: number;
  phase: string;
}

const PHASE_MARK: Record<string, string> = { gas: "g", liquid: "l", solid: "s" };

function side(list: Participant[]): string {
  return list
    .filter((p) => p.species.trim())
    .map((p) => `${Number.isFinite(p.coefficient) && p.coefficient !== 1 ? `${p.coefficient} ` : ""}${p.species.trim()}(${PHASE_MARK[p.phase] ?? "?"})`)
    .join(" + ");
}

/** The reaction as one line, e.g. "DMX(g) → 2 MON(g)"; empty while no species is named. */
export function reactionEquation(reaction: { reactants: Participant[]; products: Participant[] }): string {
  const left = side(reaction.reactants);
  const right = side(reaction.products);
  return left || right ? `${left || "…"} → ${right || "…"}` : "";
}
