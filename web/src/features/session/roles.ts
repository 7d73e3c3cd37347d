import type { Role } from "../../api/types";

/** How each role is named on screen. */
export const ROLE_LABELS: Record<Role, string> = {
  operator: "Operator",
  supervisor: "Supervisor",
  quality: "Quality",
  engineer: "Engineer",
  admin: "Administrator",
};

/** The home screen of each role. */
export const ROLE_HOMES: Record<Role, string> = {
  operator: "/operator",
  supervisor: "/supervisor",
  quality: "/quality",
  engineer: "/engineer",
  admin: "/admin",
};

/** The path a person lands on after sign-in: the home of their first role. */
export function homePathFor(roles: readonly Role[]): string {
  const first = roles[0];
  return first ? ROLE_HOMES[first] : "/";
}

/** Roles joined for display, e.g. "Operator, Supervisor". */
export function describeRoles(roles: readonly Role[]): string {
  return roles.length ? roles.map((role) => ROLE_LABELS[role]).join(", ") : "No roles";
}
