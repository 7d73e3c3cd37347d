import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost } from "../../api/client";
import type { SignatureInput } from "../../../../shared/schemas/common";
import { auditKeys } from "../audit/queries";
import { batchKeys } from "../batches/queries";
import { deviationKeys } from "../deviations/queries";
import type { BatchView } from "../batches/types";
import { queueKeys } from "../queues/queries";
import { reviewKey } from "./queries";
import type { ReviewCheckView, ReviewView } from "./types";

const batchPath = (id: string) => `/api/batches/${encodeURIComponent(id)}`;

/** POST …/review/exceptions/:key: quality's "reviewed" signature on one exception. */
export function useMarkReviewedMutation(batchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ key, ...signature }: SignatureInput & { key: string }) => apiPost<ReviewView>(`${batchPath(batchId)}/review/exceptions/${encodeURIComponent(key)}`, signature),
    onSuccess: async (review) => {
      queryClient.setQueryData(reviewKey(batchId), review);
      // The batch's moves change with the count of exceptions left.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: batchKeys.detail(batchId), exact: true }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

/** POST /api/batches/:id/kinetics-check: runs the check again on the current traces. */
export function useRerunCheckMutation(batchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiPost<{ check: ReviewCheckView; batch: BatchView }>(`${batchPath(batchId)}/kinetics-check`),
    onSuccess: async ({ batch }) => {
      queryClient.setQueryData(batchKeys.detail(batchId), batch);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKey(batchId) }),
        queryClient.invalidateQueries({ queryKey: queueKeys.all }),
        queryClient.invalidateQueries({ queryKey: deviationKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}
