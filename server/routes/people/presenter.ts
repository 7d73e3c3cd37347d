import type { people } from "../../db/schema.js";
import type { PersonView } from "../../../shared/schemas/people.js";
import type { Role } from "../../../shared/schemas/roles.js";

/** A person as the API shows them: never the password hash. */
export function presentPerson(row: typeof people.$inferSelect): PersonView {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    roles: row.roles as Role[],
    active: row.active,
    locked: row.lockedAt !== null,
    failedSignIns: row.failedSignIns,
    mustChangePassword: row.mustChangePassword,
    createdAt: row.createdAt.toISOString(),
    lastSignInAt: row.lastSignInAt?.toISOString() ?? null,
  };
}
