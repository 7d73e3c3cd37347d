import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost } from "../../api/client";
import type { TrainingRecordInput, TrainingRecordView, TrainingWithdrawInput } from "../../../../shared/schemas/training";
import { auditKeys } from "../audit/queries";
import { batchKeys } from "../batches/queries";
import { trainingKeys } from "./queries";

type RecordAnswer = { record: TrainingRecordView };

/** Every training change refreshes the lists, the batch pages (who may act) and the audit trail. */
function useTrainingChange<TInput>(send: (input: TInput) => Promise<RecordAnswer>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: trainingKeys.all }),
        queryClient.invalidateQueries({ queryKey: batchKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

/** POST /api/training: records a person's training, signed with the recorder's password. */
export function useRecordTrainingMutation() {
  return useTrainingChange((input: TrainingRecordInput) => apiPost<RecordAnswer>("/api/training", input));
}

/** POST /api/training/:id/withdraw: withdraws a record with a reason, signed. */
export function useWithdrawTrainingMutation() {
  return useTrainingChange(({ id, ...body }: TrainingWithdrawInput & { id: string }) =>
    apiPost<RecordAnswer>(`/api/training/${encodeURIComponent(id)}/withdraw`, body),
  );
}
