import type { BatchRecord } from "./batchRecord.js";
import type { BatchFacts } from "../../shared/machines/batchMoves.js";
import type { SignedInPerson } from "../policies/access.js";
import { PHASES, type Phase } from "../../shared/schemas/masterRecords.js";

/** The facts the lifecycle guards read, for this person, from the batch as recorded. */
export function factsFor(record: BatchRecord, person: SignedInPerson, kinetics: BatchFacts["kinetics"] = { verdict: "not-run", coveredByClosedDeviation: false }, unreviewedExceptions = 0): BatchFacts {
  const incompleteSteps = Object.fromEntries(PHASES.map((p) => [p, [] as string[]])) as Record<Phase, string[]>;
  const executedBy = new Set<string>();
  for (const s of record.steps) {
    if (s.status !== "complete") incompleteSteps[s.phase].push(s.step.title);
    if (s.phase === "release") continue; // release steps are quality's own review, not execution
    for (const sig of s.signatures) if (sig.meaning === "performed" || sig.meaning === "verified") executedBy.add(sig.signerId);
  }
  return {
    personId: person.id,
    roles: person.roles,
    vesselInService: record.vessel.status === "in-service",
    incompleteSteps,
    openDeviations: record.deviations.filter((d) => d.status !== "closed").length,
    executedBy: [...executedBy],
    kinetics,
    unreviewedExceptions,
  };
}
