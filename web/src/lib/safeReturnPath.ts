import type { Role } from "../api/types";
import { ROLE_HOMES } from "../features/session/roles";

/** True when `path` is a screen the given roles may open, so sign-in can return there. */
export function isReturnPathAllowed(path: unknown, roles: readonly Role[]): path is string {
  if (typeof path !== "string" || !path.startsWith("/") || path.startsWith("//")) return false;
  if (path === "/change-password") return true;
  return roles.some((role) => {
    const home = ROLE_HOMES[role];
    return path === home || path.startsWith(`${home}/`);
  });
}
