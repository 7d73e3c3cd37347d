import { assign, setup, transition, type SnapshotFrom } from "xstate";
import { refusalsFor, type BatchFacts, type BatchMove, type BatchState, type HoldableState } from "./batchMoves.js";

export interface BatchContext {
  heldFrom: HoldableState | null;
}

export type BatchEvent = { type: BatchMove; facts: BatchFacts };

const allowed = (move: BatchMove) => ({ type: "allowed" as const, params: { move } });

/**
 * The batch lifecycle (ISA-88 style): planned → charging → running → sampling → review →
 * released | rejected, with held reachable from charging, running and sampling and back to
 * where it came from. The server decides with it; the client shows what may come next.
 */
export const batchLifecycle = setup({
  types: { context: {} as BatchContext, events: {} as BatchEvent, input: {} as Partial<BatchContext> },
  guards: {
    allowed: ({ event }, params: { move: BatchMove }) => refusalsFor(params.move, event.facts).length === 0,
    resumesTo: ({ context, event }, params: { to: HoldableState }) => context.heldFrom === params.to && refusalsFor("RESUME", event.facts).length === 0,
  },
  actions: {
    rememberHeldFrom: assign((_, params: { from: HoldableState }) => ({ heldFrom: params.from })),
    forgetHeldFrom: assign({ heldFrom: null }),
  },
}).createMachine({
  id: "batch",
  initial: "planned",
  context: ({ input }) => ({ heldFrom: input?.heldFrom ?? null }),
  states: {
    planned: { on: { START_CHARGING: { target: "charging", guard: allowed("START_CHARGING") } } },
    charging: {
      on: {
        START_RUN: { target: "running", guard: allowed("START_RUN") },
        HOLD: { target: "held", guard: allowed("HOLD"), actions: { type: "rememberHeldFrom", params: { from: "charging" } } },
      },
    },
    running: {
      on: {
        START_SAMPLING: { target: "sampling", guard: allowed("START_SAMPLING") },
        HOLD: { target: "held", guard: allowed("HOLD"), actions: { type: "rememberHeldFrom", params: { from: "running" } } },
      },
    },
    sampling: {
      on: {
        SUBMIT_FOR_REVIEW: { target: "review", guard: allowed("SUBMIT_FOR_REVIEW") },
        HOLD: { target: "held", guard: allowed("HOLD"), actions: { type: "rememberHeldFrom", params: { from: "sampling" } } },
      },
    },
    held: {
      on: {
        RESUME: [
          { target: "charging", guard: { type: "resumesTo", params: { to: "charging" } }, actions: "forgetHeldFrom" },
          { target: "running", guard: { type: "resumesTo", params: { to: "running" } }, actions: "forgetHeldFrom" },
          { target: "sampling", guard: { type: "resumesTo", params: { to: "sampling" } }, actions: "forgetHeldFrom" },
        ],
      },
    },
    review: {
      on: {
        RELEASE: { target: "released", guard: allowed("RELEASE") },
        REJECT: { target: "rejected", guard: allowed("REJECT") },
      },
    },
    released: { type: "final" },
    rejected: { type: "final" },
  },
});

export type BatchSnapshot = SnapshotFrom<typeof batchLifecycle>;

/** The snapshot of a batch as persisted: its state and where it was held from. */
export function batchSnapshot(state: BatchState, heldFrom: HoldableState | null): BatchSnapshot {
  return batchLifecycle.resolveState({ value: state, context: { heldFrom } });
}

/** The moves the machine knows from `state` at all (whether or not allowed now). */
export function movesFrom(state: BatchState): BatchMove[] {
  const node = batchLifecycle.states[state];
  return Object.keys(node?.on ?? {}) as BatchMove[];
}

export type MoveDecision =
  | { allowed: true; next: { state: BatchState; heldFrom: HoldableState | null } }
  | { allowed: false; refusals: { code: string; message: string }[] };

/** Asks the machine whether `move` may happen now and what comes next. Pure: nothing persisted. */
export function decideMove(state: BatchState, heldFrom: HoldableState | null, move: BatchMove, facts: BatchFacts): MoveDecision {
  if (!movesFrom(state).includes(move)) return { allowed: false, refusals: [{ code: "not-from-this-state", message: `A batch that is ${state} cannot take the move "${move}".` }] };
  const snapshot = batchSnapshot(state, heldFrom);
  const event: BatchEvent = { type: move, facts };
  if (!snapshot.can(event)) {
    const refusals = refusalsFor(move, facts);
    return { allowed: false, refusals: refusals.length ? refusals : [{ code: "not-from-this-state", message: `A batch that is ${state} cannot take the move "${move}".` }] };
  }
  const [next] = transition(batchLifecycle, snapshot, event);
  return { allowed: true, next: { state: next.value as BatchState, heldFrom: next.context.heldFrom } };
}
