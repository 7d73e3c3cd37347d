import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost, apiPut } from "../../api/client";
import type { VesselInput, VesselStatus, VesselView } from "../../../../shared/schemas/vessels";
import { auditKeys } from "../audit/queries";
import { vesselKeys } from "./queries";

type VesselResponse = { vessel: VesselView };

function useVesselChange<TInput>(send: (input: TInput) => Promise<VesselResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: vesselKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

const vesselPath = (id: string) => `/api/vessels/${encodeURIComponent(id)}`;

/** POST /api/vessels: registers a vessel (engineer). */
export function useCreateVesselMutation() {
  return useVesselChange((input: VesselInput) => apiPost<VesselResponse>("/api/vessels", input));
}

/** PUT /api/vessels/:id: changes a vessel's data with a reason (engineer). */
export function useUpdateVesselMutation() {
  return useVesselChange(({ id, ...body }: VesselInput & { id: string; reason: string; revision: number }) =>
    apiPut<VesselResponse>(vesselPath(id), body),
  );
}

/** POST /api/vessels/:id/status: takes a vessel out of service or returns it (quality). */
export function useChangeVesselStatusMutation() {
  return useVesselChange(({ id, status, reason }: { id: string; status: VesselStatus; reason: string }) =>
    apiPost<VesselResponse>(`${vesselPath(id)}/status`, { status, reason }),
  );
}
