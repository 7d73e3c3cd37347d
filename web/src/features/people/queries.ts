import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { Person } from "../../api/types";

/** Query keys for people (accounts), admin only. */
export const peopleKeys = {
  all: ["people"] as const,
  list: () => [...peopleKeys.all, "list"] as const,
};

/** GET /api/people: every account with its roles and sign-in state. */
export function peopleListQueryOptions() {
  return queryOptions({
    queryKey: peopleKeys.list(),
    queryFn: ({ signal }) => apiGet<{ people: Person[] }>("/api/people", signal),
    select: (body) => body.people,
  });
}
