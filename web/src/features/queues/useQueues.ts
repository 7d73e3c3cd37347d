import { useQuery } from "@tanstack/react-query";
import { queuesQueryOptions } from "./queries";

/** The viewer's work queues (GET /api/queues), kept fresh by the live feed. */
export function useQueues() {
  return useQuery(queuesQueryOptions());
}
