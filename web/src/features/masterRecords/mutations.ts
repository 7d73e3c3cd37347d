import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost, apiPut } from "../../api/client";
import type { SignatureInput } from "../../../../shared/schemas/common";
import type { MasterRecordContent, MasterRecordVersionView } from "../../../../shared/schemas/masterRecords";
import { auditKeys } from "../audit/queries";
import { masterRecordKeys } from "./queries";

type VersionResponse = { version: MasterRecordVersionView };

function useMasterRecordChange<TInput>(send: (input: TInput) => Promise<VersionResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: masterRecordKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

const versionPath = (id: string) => `/api/master-records/versions/${encodeURIComponent(id)}`;

/** POST /api/master-records: a new master record with version 1 as a draft (engineer). */
export function useCreateMasterRecordMutation() {
  return useMasterRecordChange((input: { code: string; title: string; content: MasterRecordContent }) =>
    apiPost<VersionResponse>("/api/master-records", input),
  );
}

/** POST /api/master-records/:id/versions: the next version as a draft (engineer). */
export function useStartMasterRecordDraftMutation() {
  return useMasterRecordChange(({ recordId, content }: { recordId: string; content: MasterRecordContent }) =>
    apiPost<VersionResponse>(`/api/master-records/${encodeURIComponent(recordId)}/versions`, { content }),
  );
}

/** PUT /api/master-records/versions/:id: changes a draft with a reason (engineer). */
export function useUpdateMasterRecordDraftMutation() {
  return useMasterRecordChange(
    ({ id, ...body }: { id: string; content: MasterRecordContent; reason: string; revision: number }) =>
      apiPut<VersionResponse>(versionPath(id), body),
  );
}

/** POST /api/master-records/versions/:id/approve: approves a draft with a password signature (quality). */
export function useApproveMasterRecordMutation() {
  return useMasterRecordChange(({ id, ...signature }: SignatureInput & { id: string }) =>
    apiPost<VersionResponse>(`${versionPath(id)}/approve`, signature),
  );
}
