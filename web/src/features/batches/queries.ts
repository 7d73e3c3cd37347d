import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { BatchState } from "../../../../shared/machines/batchMoves";
import type { BatchListRow, BatchTraceView, BatchView } from "./types";

/** Query keys for batches; the live feed invalidates `detail(id)` and `trace(id)` on a change. */
export const batchKeys = {
  all: ["batches"] as const,
  lists: () => [...batchKeys.all, "list"] as const,
  list: (state: BatchState | "all") => [...batchKeys.lists(), state] as const,
  detail: (id: string) => [...batchKeys.all, "detail", id] as const,
  trace: (id: string) => [...batchKeys.all, "trace", id] as const,
};

/** GET /api/batches (optionally ?state=): every batch, newest first. */
export function batchListQueryOptions(state: BatchState | "all") {
  const query = state === "all" ? "" : `?state=${encodeURIComponent(state)}`;
  return queryOptions({
    queryKey: batchKeys.list(state),
    queryFn: ({ signal }) => apiGet<{ batches: BatchListRow[] }>(`/api/batches${query}`, signal),
    select: (body) => body.batches,
  });
}

/** GET /api/batches/:id: the batch page — definitions, entries, signatures and the viewer's moves. */
export function batchQueryOptions(id: string) {
  return queryOptions({
    queryKey: batchKeys.detail(id),
    queryFn: ({ signal }) => apiGet<BatchView>(`/api/batches/${encodeURIComponent(id)}`, signal),
    // Live events keep it fresh; a refetch on focus covers a missed event on a sleeping tablet.
    staleTime: 5_000,
  });
}

/** GET /api/batches/:id/trace: the logged trace, the model's prediction and the forecast. */
export function batchTraceQueryOptions(id: string) {
  return queryOptions({
    queryKey: batchKeys.trace(id),
    queryFn: ({ signal }) => apiGet<BatchTraceView>(`/api/batches/${encodeURIComponent(id)}/trace`, signal),
    staleTime: 5_000,
  });
}
