import type { QueryClient } from "@tanstack/react-query";
import { batchKeys } from "../batches/queries";
import { deviationKeys } from "../deviations/queries";
import { queueKeys } from "../queues/queries";
import { trainingKeys } from "../training/queries";

/** What GET /api/live names in each `change` event. */
export interface LiveChange {
  kind: "batch" | "deviation" | "queue" | "training";
  id: string;
}

/** Reads an event's data; null for anything that is not a change this app knows. */
export function parseLiveChange(data: unknown): LiveChange | null {
  if (typeof data !== "string") return null;
  try {
    const value = JSON.parse(data) as Partial<LiveChange>;
    if ((value.kind === "batch" || value.kind === "deviation" || value.kind === "queue" || value.kind === "training") && typeof value.id === "string") return { kind: value.kind, id: value.id };
  } catch {
    // Not JSON: ignore it.
  }
  return null;
}

/** Marks stale every query a change can affect: the changed batch, the lists and the queues. */
export function invalidateForChange(queryClient: QueryClient, change: LiveChange): void {
  if (change.kind === "training") {
    // Someone's training changed: open batch pages say again who may perform or verify.
    void queryClient.invalidateQueries({ queryKey: trainingKeys.all });
    void queryClient.invalidateQueries({ queryKey: batchKeys.all });
    return;
  }
  if (change.kind === "batch") {
    void queryClient.invalidateQueries({ queryKey: batchKeys.detail(change.id) });
    void queryClient.invalidateQueries({ queryKey: batchKeys.trace(change.id) });
  }
  void queryClient.invalidateQueries({ queryKey: batchKeys.lists() });
  void queryClient.invalidateQueries({ queryKey: queueKeys.all });
  void queryClient.invalidateQueries({ queryKey: deviationKeys.all });
}

/** After a gap in the stream any change may have been missed: refetch everything batch-related. */
export function invalidateAfterGap(queryClient: QueryClient): void {
  for (const key of [batchKeys.all, queueKeys.all, deviationKeys.all]) void queryClient.invalidateQueries({ queryKey: key });
}
