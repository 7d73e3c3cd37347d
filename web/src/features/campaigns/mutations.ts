import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost } from "../../api/client";
import type { BatchPlanInput, BatchPlanResult, CampaignCreateInput } from "../../../../shared/schemas/campaigns";
import { auditKeys } from "../audit/queries";
import { campaignKeys } from "./queries";
import type { CampaignView } from "./types";

function useCampaignChange<TInput, TResult>(send: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: campaignKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

/** POST /api/campaigns: a campaign on approved master-record and rate-model versions (engineer). */
export function useCreateCampaignMutation() {
  return useCampaignChange((input: CampaignCreateInput) => apiPost<{ campaign: CampaignView }>("/api/campaigns", input));
}

/** POST /api/campaigns/:id/batches: plans a batch; the server refuses a plan with problems (422 plan-refused). */
export function usePlanBatchMutation() {
  return useCampaignChange(({ campaignId, ...input }: BatchPlanInput & { campaignId: string }) =>
    apiPost<{ batch: { id: string; code: string; state: string; plan: BatchPlanResult } }>(`/api/campaigns/${encodeURIComponent(campaignId)}/batches`, input),
  );
}
