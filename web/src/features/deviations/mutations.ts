import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost } from "../../api/client";
import { auditKeys } from "../audit/queries";
import { batchKeys } from "../batches/queries";
import { queueKeys } from "../queues/queries";
import { deviationKeys } from "./queries";

type DeviationAnswer = { deviation: { id: string; status: string; revision: number } };

function useDeviationChange<TInput extends { batchId: string }>(send: (input: TInput) => Promise<DeviationAnswer>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async (_answer, input) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: deviationKeys.all }),
        queryClient.invalidateQueries({ queryKey: batchKeys.detail(input.batchId) }),
        queryClient.invalidateQueries({ queryKey: queueKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

const path = (id: string, action: string) => `/api/deviations/${encodeURIComponent(id)}/${action}`;

/** POST /api/deviations/:id/investigate: root cause and action (supervisor). */
export function useInvestigateDeviationMutation() {
  return useDeviationChange(({ id, batchId: _batchId, ...body }: { id: string; batchId: string; rootCause: string; action: string; coversKinetics: boolean; revision: number }) =>
    apiPost<DeviationAnswer>(path(id, "investigate"), body),
  );
}

/** POST /api/deviations/:id/close: closes it with a "closed" signature (quality). */
export function useCloseDeviationMutation() {
  return useDeviationChange(({ id, batchId: _batchId, ...body }: { id: string; batchId: string; password: string; comment?: string; revision: number }) =>
    apiPost<DeviationAnswer>(path(id, "close"), body),
  );
}
