import type { Role } from "../schemas/roles.js";
import type { Phase } from "../schemas/masterRecords.js";

export const BATCH_STATES = ["planned", "charging", "running", "sampling", "review", "released", "rejected", "held"] as const;
export type BatchState = (typeof BATCH_STATES)[number];
export const HOLDABLE_STATES = ["charging", "running", "sampling"] as const;
export type HoldableState = (typeof HOLDABLE_STATES)[number];

export const BATCH_MOVES = ["START_CHARGING", "START_RUN", "START_SAMPLING", "SUBMIT_FOR_REVIEW", "HOLD", "RESUME", "RELEASE", "REJECT"] as const;
export type BatchMove = (typeof BATCH_MOVES)[number];

/** What the guards look at; the server reads these from the database, the client from the batch view. */
export interface BatchFacts {
  personId: string;
  roles: Role[];
  vesselInService: boolean;
  /** Per phase: the steps not yet complete (performed, and verified where critical). */
  incompleteSteps: Record<Phase, string[]>;
  openDeviations: number;
  /** People who performed or verified any step of this batch. */
  executedBy: string[];
  /** The kinetics check on the batch's trace; "covered" when a closed deviation covers an outside verdict. */
  kinetics: { verdict: "within" | "outside" | "not-run"; coveredByClosedDeviation: boolean };
  /** Review exceptions still waiting for quality's "reviewed" signature. */
  unreviewedExceptions: number;
}

export interface Refusal {
  code: string;
  message: string;
}

/** Labels a person reads for each move. */
export const MOVE_LABELS: Record<BatchMove, string> = {
  START_CHARGING: "Start charging",
  START_RUN: "Start the run",
  START_SAMPLING: "Start sampling",
  SUBMIT_FOR_REVIEW: "Send for review",
  HOLD: "Put on hold",
  RESUME: "Resume",
  RELEASE: "Release",
  REJECT: "Reject",
};

const hasAny = (facts: BatchFacts, roles: Role[]) => roles.some((r) => facts.roles.includes(r));

function role(facts: BatchFacts, roles: Role[], what: string): Refusal[] {
  return hasAny(facts, roles) ? [] : [{ code: "role-missing", message: `${what} needs the role ${roles.join(" or ")}.` }];
}

function phaseDone(facts: BatchFacts, phase: Phase): Refusal[] {
  const missing = facts.incompleteSteps[phase];
  if (missing.length === 0) return [];
  return [{ code: "phase-incomplete", message: `The ${phase} phase is not complete: ${missing.join(", ")} still ${missing.length === 1 ? "needs" : "need"} to be performed${phase === "release" ? "" : " and, where critical, verified"}.` }];
}

function vessel(facts: BatchFacts): Refusal[] {
  return facts.vesselInService ? [] : [{ code: "vessel-out-of-service", message: "The vessel is out of service." }];
}

/**
 * Every reason a move is refused for these facts (empty: allowed). The one place the guards'
 * rules live; the machine's guards call it and screens show its messages.
 */
export function refusalsFor(move: BatchMove, facts: BatchFacts): Refusal[] {
  const floor: Role[] = ["operator", "supervisor"];
  switch (move) {
    case "START_CHARGING":
      return [...role(facts, floor, "Starting to charge"), ...vessel(facts)];
    case "START_RUN":
      return [...role(facts, floor, "Starting the run"), ...vessel(facts), ...phaseDone(facts, "charge")];
    case "START_SAMPLING":
      return [...role(facts, floor, "Starting sampling"), ...phaseDone(facts, "run")];
    case "SUBMIT_FOR_REVIEW":
      return [...role(facts, floor, "Sending for review"), ...phaseDone(facts, "sample")];
    case "HOLD":
      return role(facts, ["operator", "supervisor", "quality", "engineer"], "Putting a batch on hold");
    case "RESUME":
      return role(facts, ["supervisor"], "Resuming a held batch");
    case "RELEASE": {
      const out = role(facts, ["quality"], "Releasing");
      if (facts.executedBy.includes(facts.personId)) out.push({ code: "own-execution", message: "You performed or verified steps of this batch, so someone else in quality must release it." });
      if (facts.openDeviations > 0) out.push({ code: "open-deviation", message: `${facts.openDeviations} deviation${facts.openDeviations === 1 ? " is" : "s are"} still open.` });
      if (facts.kinetics.verdict === "not-run") out.push({ code: "kinetics-not-run", message: "The kinetics check has not run on a trace of this batch." });
      if (facts.kinetics.verdict === "outside" && !facts.kinetics.coveredByClosedDeviation)
        out.push({ code: "kinetics-outside", message: "The kinetics check found the batch outside the model, and no closed deviation covers it." });
      if (facts.unreviewedExceptions > 0) out.push({ code: "exceptions-unreviewed", message: `${facts.unreviewedExceptions} review exception${facts.unreviewedExceptions === 1 ? " waits" : "s wait"} for your review.` });
      out.push(...phaseDone(facts, "release"));
      return out;
    }
    case "REJECT":
      return role(facts, ["quality"], "Rejecting");
  }
}
