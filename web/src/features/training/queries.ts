import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { TrainingListView } from "../../../../shared/schemas/training";

export interface TrainingFilter {
  personId?: string;
}

/** Query keys for training records. */
export const trainingKeys = {
  all: ["training"] as const,
  list: (filter: TrainingFilter) => [...trainingKeys.all, "list", filter] as const,
};

/** GET /api/training (optionally ?personId=): the records the viewer may see, newest first. */
export function trainingListQueryOptions(filter: TrainingFilter = {}) {
  const query = filter.personId ? `?personId=${encodeURIComponent(filter.personId)}` : "";
  return queryOptions({
    queryKey: trainingKeys.list(filter),
    queryFn: ({ signal }) => apiGet<TrainingListView>(`/api/training${query}`, signal),
  });
}
