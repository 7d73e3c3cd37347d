import { QueryClient } from "@tanstack/react-query";
import { ApiError } from "./client";

function shouldRetry(failureCount: number, error: unknown): boolean {
  // A refusal (4xx) will not change by asking again; network and server faults may.
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/** The app's single query cache. */
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: { staleTime: 30_000, retry: shouldRetry },
    mutations: { retry: false },
  },
});
