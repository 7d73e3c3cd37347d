import type { BatchState } from "../../../../shared/machines/batchMoves";
import type { Phase } from "../../../../shared/schemas/masterRecords";
import type { Role } from "../../../../shared/schemas/roles";
import type { BatchStepView, BatchView } from "./types";

/** The batch state in which each phase's steps are performed (the server's rule). */
export const PHASE_STATE: Record<Phase, BatchState> = { charge: "charging", run: "running", sample: "sampling", release: "review" };
const OPEN_ORDER: BatchState[] = ["planned", "charging", "running", "sampling", "review"];
const PERFORMERS: Record<Phase, Role[]> = { charge: ["operator", "supervisor"], run: ["operator", "supervisor"], sample: ["operator", "supervisor"], release: ["quality"] };

export interface StepAbilities {
  perform: boolean;
  correct: boolean;
  verify: boolean;
  /** The viewer entered the current version, so someone else must verify it. */
  ownEntry: boolean;
  /** Who performs the step, in words, for those who may not. */
  performedBy: string;
  /**
   * Why the viewer's perform, correct and verify controls are disabled: the sentence about their
   * training, when their role and the batch state would allow one of them; null otherwise.
   */
  trainingBlock: string | null;
}

/** What the viewer may do with a step now, by the same rules the server applies. */
export function stepAbilities(view: BatchView, step: BatchStepView): StepAbilities {
  const { roles, personId } = view.facts;
  const state = view.batch.state;
  const performer = PERFORMERS[step.phase].some((r) => roles.includes(r));
  const current = step.entries.at(-1);
  const open = OPEN_ORDER.includes(state);
  const reached = open && OPEN_ORDER.indexOf(state) >= OPEN_ORDER.indexOf(PHASE_STATE[step.phase]);
  const ownEntry = Boolean(current && current.enteredBy?.id === personId);
  const perform = performer && !current && state === PHASE_STATE[step.phase];
  const correct = performer && Boolean(current) && reached;
  const verify = step.critical && step.status === "awaiting-verification" && roles.includes("supervisor") && !ownEntry && open;
  const untrained = !view.training.current && (perform || correct || verify);
  return {
    perform,
    correct,
    verify,
    ownEntry,
    performedBy: PERFORMERS[step.phase].join(" or "),
    trainingBlock: untrained ? (view.training.message ?? "Your training on this master record version is not current.") : null,
  };
}
