import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost } from "../../api/client";
import { auditKeys } from "../audit/queries";
import { rateModelKeys } from "../rateModels/queries";
import type { ProposalView } from "./types";

/** POST …/versions/:id/proposal (engineer): fits kRef and Ea from released batches; `save` keeps it as a draft version. */
export function useProposalMutation(versionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { batchIds: string[]; save: boolean }) => apiPost<ProposalView>(`/api/rate-models/versions/${encodeURIComponent(versionId)}/proposal`, body),
    onSuccess: async (result) => {
      if (!result.draft) return;
      await Promise.all([queryClient.invalidateQueries({ queryKey: rateModelKeys.all }), queryClient.invalidateQueries({ queryKey: auditKeys.all })]);
    },
  });
}
