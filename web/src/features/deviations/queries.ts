import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { DeviationListRow, DeviationStatusFilter } from "./types";

/** Query keys for deviations. */
export const deviationKeys = {
  all: ["deviations"] as const,
  list: (status: DeviationStatusFilter) => [...deviationKeys.all, "list", status] as const,
};

/** GET /api/deviations?status=: deviations across batches, newest first. */
export function deviationListQueryOptions(status: DeviationStatusFilter) {
  return queryOptions({
    queryKey: deviationKeys.list(status),
    queryFn: ({ signal }) => apiGet<{ deviations: DeviationListRow[] }>(`/api/deviations?status=${encodeURIComponent(status)}`, signal),
    select: (body) => body.deviations,
  });
}
