import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import { batchKeys } from "../batches/queries";
import type { ReviewView } from "./types";

/** The review's key sits under the batch's own key, so every change to the batch refetches it too. */
export const reviewKey = (batchId: string) => [...batchKeys.detail(batchId), "review"] as const;

/** GET /api/batches/:id/review: the kinetics check and the review exceptions. */
export function reviewQueryOptions(batchId: string) {
  return queryOptions({
    queryKey: reviewKey(batchId),
    queryFn: ({ signal }) => apiGet<ReviewView>(`/api/batches/${encodeURIComponent(batchId)}/review`, signal),
    staleTime: 5_000,
  });
}
