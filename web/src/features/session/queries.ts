import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { SessionState } from "../../api/types";

/** Query keys for the signed-in session. */
export const sessionKeys = {
  all: ["session"] as const,
  current: () => [...sessionKeys.all, "current"] as const,
  /** Mutation key of sign-out, so screens can tell a deliberate sign-out from an expiry. */
  signOut: () => [...sessionKeys.all, "sign-out"] as const,
};

/** GET /api/session: who is signed in, and the CSRF token for changes. */
export function sessionQueryOptions() {
  return queryOptions({
    queryKey: sessionKeys.current(),
    queryFn: ({ signal }) => apiGet<SessionState>("/api/session", signal),
    staleTime: 60_000,
  });
}
