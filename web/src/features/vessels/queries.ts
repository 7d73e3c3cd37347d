import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { VesselView } from "../../../../shared/schemas/vessels";

/** Query keys for vessels. */
export const vesselKeys = {
  all: ["vessels"] as const,
  list: () => [...vesselKeys.all, "list"] as const,
};

/** GET /api/vessels: every registered vessel, in SI with the units it was entered in. */
export function vesselListQueryOptions() {
  return queryOptions({
    queryKey: vesselKeys.list(),
    queryFn: ({ signal }) => apiGet<{ vessels: VesselView[] }>("/api/vessels", signal),
    select: (body) => body.vessels,
  });
}
