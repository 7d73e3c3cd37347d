import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";

/** Query keys for rate models and their versions. */
export const rateModelKeys = {
  all: ["rate-models"] as const,
  list: () => [...rateModelKeys.all, "list"] as const,
  versionsOf: (modelId: string) => [...rateModelKeys.all, "model", modelId] as const,
  version: (id: string) => [...rateModelKeys.all, "version", id] as const,
};

type Versions = { versions: RateModelVersionView[] };

/** GET /api/rate-models: every version of every model, newest version first within a model. */
export function rateModelListQueryOptions() {
  return queryOptions({
    queryKey: rateModelKeys.list(),
    queryFn: ({ signal }) => apiGet<Versions>("/api/rate-models", signal),
    select: (body) => body.versions,
  });
}

/** GET /api/rate-models/:modelId/versions: the versions of one model, newest first. */
export function rateModelVersionsQueryOptions(modelId: string) {
  return queryOptions({
    queryKey: rateModelKeys.versionsOf(modelId),
    queryFn: ({ signal }) => apiGet<Versions>(`/api/rate-models/${encodeURIComponent(modelId)}/versions`, signal),
    select: (body) => body.versions,
  });
}

/** GET /api/rate-models/versions/:id: one version with its signatures and what the viewer may do. */
export function rateModelVersionQueryOptions(id: string) {
  return queryOptions({
    queryKey: rateModelKeys.version(id),
    queryFn: ({ signal }) => apiGet<{ version: RateModelVersionView }>(`/api/rate-models/versions/${encodeURIComponent(id)}`, signal),
    select: (body) => body.version,
  });
}
