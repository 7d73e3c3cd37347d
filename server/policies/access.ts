import type { RequestHandler } from "express";
import type { Role } from "../../shared/schemas/roles.js";
import { HttpError } from "../http/errors.js";

/** Who may call a route: anyone, any signed-in person, or holders of one of the roles. */
export type Access =
  | { kind: "public" }
  | { kind: "signed-in"; duringPasswordChange?: boolean }
  | { kind: "roles"; roles: Role[] };

export const anyone: Access = { kind: "public" };
export const signedIn: Access = { kind: "signed-in" };
/** Signed-in, and still reachable while the person must first change their password. */
export const signedInEvenBeforePasswordChange: Access = { kind: "signed-in", duringPasswordChange: true };
export const allow = (...roles: Role[]): Access => ({ kind: "roles", roles });

/** Marks the guard so a test can prove every route has one. */
export const ACCESS = Symbol("isobatch.access");

export interface SignedInPerson {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  mustChangePassword: boolean;
}

/** True when `person` may call a route declared with `access`. */
export function permits(access: Access, person: SignedInPerson | undefined): boolean {
  if (access.kind === "public") return true;
  if (!person) return false;
  if (access.kind === "signed-in") return true;
  return access.roles.some((r) => person.roles.includes(r));
}

/** The middleware that enforces `access`: 401 signed out, 403 without the role. */
export function accessGuard(access: Access): RequestHandler {
  const guard: RequestHandler = (req, _res, next) => {
    if (access.kind === "public") return next();
    const person = req.user as SignedInPerson | undefined;
    if (!person) {
      const expired = req.session?.expiredAt !== undefined;
      return next(
        expired
          ? new HttpError(401, "session-expired", "Your session ended after a period of inactivity. Sign in again.")
          : new HttpError(401, "not-signed-in", "Sign in first."),
      );
    }
    if (person.mustChangePassword && !(access.kind === "signed-in" && access.duringPasswordChange)) {
      return next(new HttpError(403, "password-change-required", "Choose a new password before you go on."));
    }
    if (!permits(access, person)) {
      const needed = access.kind === "roles" ? access.roles.join(" or ") : "";
      return next(new HttpError(403, "forbidden", `This needs the role ${needed}; you hold ${person.roles.join(", ") || "no role"}.`));
    }
    next();
  };
  Object.assign(guard, { [ACCESS]: access });
  return guard;
}
