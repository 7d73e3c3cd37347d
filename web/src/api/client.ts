import type { ApiErrorBody } from "./types";

/** An API failure with the HTTP status and the contract's error code, message and field. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly field: string | undefined;
  /** Everything else the server said (refusals, problems, the current state …). */
  readonly details: Record<string, unknown>;

  constructor(status: number, code: string, message: string, field?: string, details: Record<string, unknown> = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.field = field;
    this.details = details;
  }
}

/** The hooks the client needs from the rest of the app (session cache and navigation). */
export interface SessionBridge {
  /** The CSRF token from the current session query. */
  getCsrfToken: () => Promise<string>;
  /** Drop the cached token so the next call fetches GET /api/session again. */
  refreshCsrfToken: () => Promise<void>;
  /** Called when the server says the session ended through inactivity. */
  onSessionExpired: () => void;
  /** Called when the server refuses everything until the password is changed. */
  onPasswordChangeRequired: () => void;
}

export const SESSION_EXPIRED_MESSAGE =
  "Your session ended after a period of inactivity. Sign in again.";

let bridge: SessionBridge | null = null;

/** Connects the client to the session query and the router; called once at start-up. */
export function connectSessionBridge(next: SessionBridge): void {
  bridge = next;
}

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

interface RequestOptions {
  body?: unknown;
  signal?: AbortSignal;
}

function isErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== "object" || value === null || !("error" in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === "object" && error !== null && "code" in error;
}

async function toApiError(response: Response): Promise<ApiError> {
  let parsed: unknown = null;
  try {
    parsed = await response.json();
  } catch {
    // Not JSON (a proxy error page, for instance): fall through to the generic error.
  }
  if (isErrorBody(parsed)) {
    const { code, message, field, ...details } = parsed.error as typeof parsed.error & Record<string, unknown>;
    return new ApiError(response.status, code, message || "The request was refused.", field, details);
  }
  return new ApiError(
    response.status,
    `http-${response.status}`,
    response.status >= 500
      ? "The Isobatch server had a problem with this request. Try again in a moment."
      : "The request was refused.",
  );
}

/** A fresh key for one mutating request; a retry of the same request sends the same key. */
export const newIdempotencyKey = () => crypto.randomUUID();

async function send(method: Method, path: string, options: RequestOptions): Promise<Response> {
  const headers: Record<string, string> = { Accept: "application/json" };
  if (options.body !== undefined) headers["Content-Type"] = "application/json";
  if (method !== "GET") {
    if (!bridge) throw new Error("The API client was used before the session bridge was connected.");
    headers["X-CSRF-Token"] = await bridge.getCsrfToken();
    headers["Idempotency-Key"] = newIdempotencyKey();
  }
  const attempt = () =>
    fetch(path, {
      method,
      headers,
      credentials: "same-origin",
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  try {
    return await attempt();
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === "AbortError") throw cause;
    // A dropped connection (a tablet changing access point): send the same request once more.
    // The server applies it at most once, whether or not the first attempt arrived.
    if (method !== "GET") {
      await new Promise((r) => setTimeout(r, 1000));
      try {
        return await attempt();
      } catch {
        /* fall through to the error below */
      }
    }
    throw new ApiError(
      0,
      "network-unreachable",
      "Isobatch could not reach the server. Check the network connection and try again.",
    );
  }
}

/** Sends one JSON request to the API and returns the parsed body (undefined for 204). */
export async function apiRequest<T>(
  method: Method,
  path: string,
  options: RequestOptions = {},
): Promise<T> {
  let response = await send(method, path, options);
  let error = response.ok ? null : await toApiError(response);

  // A token that went stale (for example after the server restarted) gets one fresh try.
  if (error && method !== "GET" && error.status === 403 && error.code.includes("csrf") && bridge) {
    await bridge.refreshCsrfToken();
    response = await send(method, path, options);
    error = response.ok ? null : await toApiError(response);
  }

  if (error) {
    if (error.status === 401 && error.code === "session-expired") bridge?.onSessionExpired();
    if (error.status === 403 && error.code === "password-change-required") {
      bridge?.onPasswordChangeRequired();
    }
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

/** GET a JSON resource. */
export function apiGet<T>(path: string, signal?: AbortSignal): Promise<T> {
  return apiRequest<T>("GET", path, { signal });
}

/** POST a JSON body. */
export function apiPost<T>(path: string, body?: unknown): Promise<T> {
  return apiRequest<T>("POST", path, { body });
}

/** PUT a JSON body. */
export function apiPut<T>(path: string, body: unknown): Promise<T> {
  return apiRequest<T>("PUT", path, { body });
}

/** DELETE a resource. */
export function apiDelete<T = void>(path: string): Promise<T> {
  return apiRequest<T>("DELETE", path);
}
