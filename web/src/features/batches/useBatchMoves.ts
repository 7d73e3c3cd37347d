import { useActorRef, useSelector } from "@xstate/react";
import { useMemo } from "react";
import { batchLifecycle, batchSnapshot, movesFrom } from "../../../../shared/machines/batchLifecycle";
import { refusalsFor, type BatchMove, type Refusal } from "../../../../shared/machines/batchMoves";
import type { BatchView } from "./types";

/** A move as the page offers it: the client machine's judgement reconciled with the server's. */
export interface OfferedMove {
  move: BatchMove;
  label: string;
  allowed: boolean;
  refusals: Refusal[];
  /** False when the client's machine and the server judged the move differently; the server wins. */
  agreed: boolean;
}

/**
 * Runs the shared lifecycle machine from the batch's persisted state and asks it, with the
 * view's facts, which moves may happen next. Mount the caller with a key of state and heldFrom:
 * the actor is created once from the snapshot it starts with.
 */
export function useBatchMoves(view: BatchView): OfferedMove[] {
  const { state, heldFrom } = view.batch;
  // The snapshot carries heldFrom; input is only read when a machine starts fresh.
  const actor = useActorRef(batchLifecycle, { snapshot: batchSnapshot(state, heldFrom), input: { heldFrom } });
  const snapshot = useSelector(actor, (s) => s);
  return useMemo(
    () =>
      movesFrom(state).map((move) => {
        const server = view.moves.find((m) => m.move === move);
        const clientAllowed = snapshot.can({ type: move, facts: view.facts });
        const clientRefusals = refusalsFor(move, view.facts);
        const serverAllowed = server?.allowed ?? false;
        // The server decides; its refusals are the ones to read when it says no.
        const allowed = serverAllowed && clientAllowed;
        const refusals = !serverAllowed ? (server?.refusals.length ? server.refusals : clientRefusals) : clientAllowed ? [] : clientRefusals;
        return { move, label: server?.label ?? move, allowed, refusals, agreed: serverAllowed === clientAllowed };
      }),
    [snapshot, state, view.facts, view.moves],
  );
}
