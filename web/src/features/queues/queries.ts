import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { BatchState } from "../../../../shared/machines/batchMoves";

/** A batch as a queue lists it. */
export interface QueuedBatch {
  id: string;
  code: string;
  state: BatchState;
  revision: number;
}

/** A critical step waiting for a second person's signature. */
export interface QueuedVerification {
  batchId: string;
  batchCode: string;
  stepKey: string;
  title: string;
  performedBy: string | null;
}

/** A deviation as a queue lists it. */
export interface QueuedDeviation {
  id: string;
  batchId: string;
  batchCode: string;
  title: string;
  severity: "minor" | "major" | "critical";
  status: "open" | "investigated" | "closed";
}

/** GET /api/queues: the viewer's own work lists. */
export interface Queues {
  inProgress: QueuedBatch[];
  held: QueuedBatch[];
  awaitingVerification: QueuedVerification[];
  inReview: QueuedBatch[];
  deviationsToInvestigate: QueuedDeviation[];
  deviationsToClose: QueuedDeviation[];
}

/** Query keys for the work queues; the live feed invalidates them on every change. */
export const queueKeys = {
  all: ["queues"] as const,
};

/** GET /api/queues. */
export function queuesQueryOptions() {
  return queryOptions({
    queryKey: queueKeys.all,
    queryFn: ({ signal }) => apiGet<Queues>("/api/queues", signal),
    staleTime: 10_000,
  });
}
