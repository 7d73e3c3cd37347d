import type { BatchState } from "../../../../shared/machines/batchMoves";
import type { Phase } from "../../../../shared/schemas/masterRecords";

/** How each batch state reads on screen. */
export const STATE_WORDS: Record<BatchState, string> = {
  planned: "Planned",
  charging: "Charging",
  running: "Running",
  sampling: "Sampling",
  review: "In review",
  released: "Released",
  rejected: "Rejected",
  held: "On hold",
};

/** A shape beside the words, so the state never rests on colour: the circle fills as the batch goes on. */
export const STATE_MARKERS: Record<BatchState, string> = {
  planned: "○",
  charging: "◔",
  running: "◑",
  sampling: "◕",
  review: "●",
  released: "✓",
  rejected: "✕",
  held: "‖",
};

export type StateTone = "plain" | "active" | "waiting" | "done" | "stopped";

/** The tint of each state's badge (the words and shape carry the meaning). */
export const STATE_TONES: Record<BatchState, StateTone> = {
  planned: "plain",
  charging: "active",
  running: "active",
  sampling: "active",
  review: "waiting",
  released: "done",
  rejected: "stopped",
  held: "stopped",
};

/** The phase whose steps are executed in each state. */
export const PHASE_OF_STATE: Partial<Record<BatchState, Phase>> = {
  charging: "charge",
  running: "run",
  sampling: "sample",
  review: "release",
};

/** How each phase is headed on the batch page. */
export const PHASE_WORDS: Record<Phase, string> = {
  charge: "Charge",
  run: "Run",
  sample: "Sample",
  release: "Release review",
};

/** The phase to show first: the one being executed (for a held batch, the one it was held in). */
export function currentPhase(state: BatchState, heldFrom: BatchState | null): Phase {
  if (state === "held" && heldFrom) return PHASE_OF_STATE[heldFrom] ?? "charge";
  if (state === "planned") return "charge";
  if (state === "released" || state === "rejected") return "release";
  return PHASE_OF_STATE[state] ?? "charge";
}
