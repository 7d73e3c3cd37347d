import type { ReactNode } from "react";
import { ApiError } from "../api/client";
import { Button } from "./Button";
import { Notice } from "./Notice";

export interface QueryStateProps {
  isPending: boolean;
  error: unknown;
  onRetry: () => void;
  /** What is being loaded, e.g. "the accounts". */
  what: string;
  children: ReactNode;
}

/** Shows loading text or a retryable error for a query, and the content once it has data. */
export function QueryState({ isPending, error, onRetry, what, children }: QueryStateProps) {
  if (error) {
    const message = error instanceof ApiError ? error.message : "An unexpected error occurred.";
    return (
      <div className="flex flex-col items-start gap-3">
        <Notice tone="error" title={`Could not load ${what}`}>
          {message}
        </Notice>
        <Button variant="secondary" onClick={onRetry}>
          Try again
        </Button>
      </div>
    );
  }
  if (isPending) {
    return (
      <p role="status" className="text-ink-600">
        Loading {what}…
      </p>
    );
  }
  return <>{children}</>;
}
