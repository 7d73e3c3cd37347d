// Helpers for the requests the shared API client cannot make: uploads through XMLHttpRequest,
// which report their progress.
import { ApiError, apiGet } from "../../api/client";
import { queryClient } from "../../api/queryClient";
import { sessionQueryOptions } from "../session/queries";

/** The CSRF token of the current session (fresh from the server when `fresh`). */
export async function csrfToken(fresh = false): Promise<string> {
  const options = sessionQueryOptions();
  const session = fresh ? await queryClient.fetchQuery({ ...options, staleTime: 0 }) : await queryClient.ensureQueryData(options);
  return session.csrfToken;
}

/** Builds the error for a refused response body (any shape) and status. */
export function errorFromBody(status: number, body: unknown): ApiError {
  const error = typeof body === "object" && body !== null && "error" in body ? (body as { error: Record<string, unknown> }).error : null;
  if (error && typeof error.code === "string") {
    const { code, message, field, ...details } = error;
    return new ApiError(status, code, typeof message === "string" && message ? message : "The request was refused.", typeof field === "string" ? field : undefined, details);
  }
  const message = status >= 500 ? "The Isobatch server had a problem with this request. Try again in a moment." : status === 0 ? "Isobatch could not reach the server. Check the network connection and try again." : "The request was refused.";
  return new ApiError(status, status === 0 ? "network-unreachable" : `http-${status}`, message, undefined, {});
}

/** True for a stale CSRF token, which earns one retry with a fresh token. */
export const isCsrfRefusal = (e: ApiError) => e.status === 403 && e.code.includes("csrf");

/**
 * Lets the shared API client see an ended session or a required password change, so the app
 * reacts the same way everywhere (sign-in with a return path, or the password screen): a
 * harmless signed-in GET meets the same refusal, and the client's session bridge acts on it.
 */
export function reportAuthRefusal(e: ApiError): void {
  if (e.status === 401 || (e.status === 403 && e.code === "password-change-required")) void apiGet("/api/queues").catch(() => undefined);
}
