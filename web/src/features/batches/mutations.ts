import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost } from "../../api/client";
import type { BatchEventInput } from "../../../../shared/schemas/batches";
import { auditKeys } from "../audit/queries";
import { deviationKeys } from "../deviations/queries";
import { queueKeys } from "../queues/queries";

import { batchKeys } from "./queries";
import type { BatchView, TraceAdded } from "./types";

const batchPath = (id: string) => `/api/batches/${encodeURIComponent(id)}`;
const stepPath = (id: string, stepKey: string) => `${batchPath(id)}/steps/${encodeURIComponent(stepKey)}`;

/** A change to one batch: on success the page, its trace, the lists, queues and audit refetch. */
function useBatchChange<TInput, TResult>(batchId: string, send: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async (result) => {
      // Answers that carry the whole page go straight into the cache; the rest refetch.
      const page = result && typeof result === "object" && "batch" in result && "steps" in result;
      if (page) queryClient.setQueryData(batchKeys.detail(batchId), result as unknown as BatchView);
      await Promise.all([
        page ? undefined : queryClient.invalidateQueries({ queryKey: batchKeys.detail(batchId) }),
        queryClient.invalidateQueries({ queryKey: batchKeys.trace(batchId) }),
        queryClient.invalidateQueries({ queryKey: batchKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: queueKeys.all }),
        queryClient.invalidateQueries({ queryKey: deviationKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

/** POST /api/batches/:id/events: one lifecycle move at the revision shown (refusals kept in the error). */
export function useBatchMoveMutation(batchId: string) {
  return useBatchChange(batchId, (input: BatchEventInput) => apiPost<BatchView>(`${batchPath(batchId)}/events`, input));
}

export interface StepEntryBody {
  values: Record<string, unknown>;
  comments: Record<string, string>;
  password: string;
}

/** POST …/steps/:stepKey/entries: performs a step, signed "performed". */
export function usePerformStepMutation(batchId: string) {
  return useBatchChange(batchId, ({ stepKey, ...body }: StepEntryBody & { stepKey: string }) => apiPost<BatchView>(`${stepPath(batchId, stepKey)}/entries`, body));
}

/** POST …/steps/:stepKey/corrections: a new version of the entry with a reason, signed again. */
export function useCorrectStepMutation(batchId: string) {
  return useBatchChange(batchId, ({ stepKey, ...body }: StepEntryBody & { stepKey: string; reason: string }) => apiPost<BatchView>(`${stepPath(batchId, stepKey)}/corrections`, body));
}

/** POST …/steps/:stepKey/verify: the second person's "verified" signature (supervisor). */
export function useVerifyStepMutation(batchId: string) {
  return useBatchChange(batchId, ({ stepKey, ...body }: { stepKey: string; password: string; comment?: string }) => apiPost<BatchView>(`${stepPath(batchId, stepKey)}/verify`, body));
}

/** POST /api/batches/:id/deviations: raises a deviation on the batch. */
export function useRaiseDeviationMutation(batchId: string) {
  return useBatchChange(batchId, (body: { title: string; description: string; severity: "minor" | "major" | "critical"; stepKey?: string }) =>
    apiPost<{ deviation: { id: string; status: string; revision: number } }>(`${batchPath(batchId)}/deviations`, body),
  );
}

/** POST /api/batches/:id/attachments: attaches an uploaded file, optionally to a step. */
export function useAttachFileMutation(batchId: string) {
  return useBatchChange(batchId, (body: { fileId: string; stepKey?: string; note?: string }) =>
    apiPost<{ attachment: { id: string; fileId: string; sha256: string } }>(`${batchPath(batchId)}/attachments`, body),
  );
}

/** POST /api/batches/:id/traces: adds an uploaded logger CSV (a 422 keeps error.problems). */
export function useAddTraceMutation(batchId: string) {
  return useBatchChange(batchId, (body: { fileId: string }) => apiPost<{ trace: TraceAdded }>(`${batchPath(batchId)}/traces`, body));
}

/** POST /api/batches/:id/samples: records a sample taken during the run or sampling. */
export function useRecordSampleMutation(batchId: string) {
  return useBatchChange(batchId, (body: { sampledAt: string; volume: { value: number; unit: "mL" | "L" | "m³" }; labResult?: string; fileId?: string }) =>
    apiPost<{ sample: { id: string; volumeL: number; sampledAt: string } }>(`${batchPath(batchId)}/samples`, body),
  );
}
