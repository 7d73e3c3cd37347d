import type { Role } from "../api/types";

/**
 * True when `path` is a screen of this app that sign-in may return to (a mail's link to a batch,
 * the screen open when the session ended). Each screen still checks the person's roles itself.
 */
export function isReturnPathAllowed(path: unknown, _roles: readonly Role[]): path is string {
  if (typeof path !== "string" || !path.startsWith("/") || path.startsWith("//") || path.includes("\\")) return false;
  return !path.startsWith("/sign-in");
}
