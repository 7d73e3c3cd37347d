import { describe, expect, it } from "vitest";
import { decideMove, movesFrom } from "../../../shared/machines/batchLifecycle.js";
import { BATCH_MOVES, BATCH_STATES, type BatchFacts } from "../../../shared/machines/batchMoves.js";

const facts = (over: Partial<BatchFacts> = {}): BatchFacts => ({
  personId: "p1",
  roles: ["operator"],
  vesselInService: true,
  incompleteSteps: { charge: [], run: [], sample: [], release: [] },
  openDeviations: 0,
  executedBy: [],
  kinetics: { verdict: "within", coveredByClosedDeviation: false },
  unreviewedExceptions: 0,
  ...over,
});
const codes = (d: ReturnType<typeof decideMove>) => (d.allowed ? [] : d.refusals.map((r) => r.code));

describe("the batch lifecycle machine", () => {
  it("walks the ISA-88 path planned → charging → running → sampling → review → released", () => {
    let state: (typeof BATCH_STATES)[number] = "planned";
    for (const [move, roles, next] of [
      ["START_CHARGING", ["operator"], "charging"],
      ["START_RUN", ["operator"], "running"],
      ["START_SAMPLING", ["supervisor"], "sampling"],
      ["SUBMIT_FOR_REVIEW", ["operator"], "review"],
      ["RELEASE", ["quality"], "released"],
    ] as const) {
      const d = decideMove(state, null, move, facts({ roles: [...roles] }));
      expect(d).toEqual({ allowed: true, next: { state: next, heldFrom: null } });
      state = next;
    }
  });

  it("knows only the moves of each state, and none from released or rejected", () => {
    expect(movesFrom("planned")).toEqual(["START_CHARGING"]);
    expect(movesFrom("charging").sort()).toEqual(["HOLD", "START_RUN"]);
    expect(movesFrom("held")).toEqual(["RESUME"]);
    expect(movesFrom("review").sort()).toEqual(["REJECT", "RELEASE"]);
    expect(movesFrom("released")).toEqual([]);
    expect(movesFrom("rejected")).toEqual([]);
    for (const state of BATCH_STATES) for (const move of BATCH_MOVES.filter((m) => !movesFrom(state).includes(m))) expect(codes(decideMove(state, null, move, facts({ roles: ["operator", "supervisor", "quality"] })))).toEqual(["not-from-this-state"]);
  });

  it("holds from charging, running and sampling and resumes to where it was, only for a supervisor", () => {
    for (const from of ["charging", "running", "sampling"] as const) {
      const held = decideMove(from, null, "HOLD", facts({ roles: ["quality"] }));
      expect(held).toEqual({ allowed: true, next: { state: "held", heldFrom: from } });
      expect(codes(decideMove("held", from, "RESUME", facts({ roles: ["operator"] })))).toEqual(["role-missing"]);
      expect(decideMove("held", from, "RESUME", facts({ roles: ["supervisor"] }))).toEqual({ allowed: true, next: { state: from, heldFrom: null } });
    }
  });

  it("refuses leaving a phase with incomplete steps and names them", () => {
    const d = decideMove("charging", null, "START_RUN", facts({ incompleteSteps: { charge: ["Charge DMX"], run: [], sample: [], release: [] } }));
    expect(codes(d)).toEqual(["phase-incomplete"]);
    expect(d.allowed ? "" : d.refusals[0].message).toMatch(/Charge DMX/);
  });

  it("refuses charging or running in a vessel out of service", () => {
    expect(codes(decideMove("planned", null, "START_CHARGING", facts({ vesselInService: false })))).toEqual(["vessel-out-of-service"]);
    expect(codes(decideMove("charging", null, "START_RUN", facts({ vesselInService: false })))).toEqual(["vessel-out-of-service"]);
  });

  it("refuses floor moves to people without a floor role", () => {
    for (const [state, move] of [["planned", "START_CHARGING"], ["charging", "START_RUN"], ["running", "START_SAMPLING"], ["sampling", "SUBMIT_FOR_REVIEW"]] as const) {
      expect(codes(decideMove(state, null, move, facts({ roles: ["engineer"] })))).toEqual(["role-missing"]);
    }
  });

  it("refuses release for every missing condition at once, with each reason", () => {
    const d = decideMove("review", null, "RELEASE", facts({ roles: ["quality"], personId: "q", executedBy: ["q"], openDeviations: 2, kinetics: { verdict: "outside", coveredByClosedDeviation: false }, unreviewedExceptions: 1, incompleteSteps: { charge: [], run: [], sample: [], release: ["Release checklist"] } }));
    expect(codes(d).sort()).toEqual(["exceptions-unreviewed", "kinetics-outside", "open-deviation", "own-execution", "phase-incomplete"]);
    expect(codes(decideMove("review", null, "RELEASE", facts({ roles: ["quality"], kinetics: { verdict: "outside", coveredByClosedDeviation: true } })))).toEqual([]);
    expect(codes(decideMove("review", null, "RELEASE", facts({ roles: ["quality"], kinetics: { verdict: "not-run", coveredByClosedDeviation: false } })))).toEqual(["kinetics-not-run"]);
    expect(codes(decideMove("review", null, "RELEASE", facts({ roles: ["supervisor"] })))).toEqual(["role-missing"]);
  });

  it("lets quality reject from review", () => {
    expect(decideMove("review", null, "REJECT", facts({ roles: ["quality"] }))).toEqual({ allowed: true, next: { state: "rejected", heldFrom: null } });
    expect(codes(decideMove("review", null, "REJECT", facts({ roles: ["operator"] })))).toEqual(["role-missing"]);
  });
});
