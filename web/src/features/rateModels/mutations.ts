import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost, apiPut } from "../../api/client";
import type { SignatureInput } from "../../../../shared/schemas/common";
import type { RateModelContent, RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { auditKeys } from "../audit/queries";
import { rateModelKeys } from "./queries";

type VersionResponse = { version: RateModelVersionView };

function useRateModelChange<TInput>(send: (input: TInput) => Promise<VersionResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: rateModelKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

const versionPath = (id: string) => `/api/rate-models/versions/${encodeURIComponent(id)}`;

/** POST /api/rate-models: a new model with its version 1 as a draft (engineer). */
export function useCreateRateModelMutation() {
  return useRateModelChange((input: { code: string; title: string; content: RateModelContent }) =>
    apiPost<VersionResponse>("/api/rate-models", input),
  );
}

/** POST /api/rate-models/:modelId/versions: the next version as a draft (engineer). */
export function useStartRateModelDraftMutation() {
  return useRateModelChange(({ modelId, content }: { modelId: string; content: RateModelContent }) =>
    apiPost<VersionResponse>(`/api/rate-models/${encodeURIComponent(modelId)}/versions`, { content }),
  );
}

/** PUT /api/rate-models/versions/:id: changes a draft with a reason (engineer). */
export function useUpdateRateModelDraftMutation() {
  return useRateModelChange(
    ({ id, ...body }: { id: string; content: RateModelContent; reason: string; revision: number }) =>
      apiPut<VersionResponse>(versionPath(id), body),
  );
}

/** POST /api/rate-models/versions/:id/approve: approves a draft with a password signature (quality). */
export function useApproveRateModelMutation() {
  return useRateModelChange(({ id, ...signature }: SignatureInput & { id: string }) =>
    apiPost<VersionResponse>(`${versionPath(id)}/approve`, signature),
  );
}
