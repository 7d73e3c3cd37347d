import { randomUUID } from "node:crypto";
import type { Db } from "../server/db/client.js";
import { people } from "../server/db/schema.js";
import { hashPassword } from "../server/commands/passwords.js";
import type { Role } from "../shared/schemas/roles.js";

export const TEST_PASSWORD = "correct horse battery";
// Cheap hashes keep the suite quick; the scheme and code path are the production ones.
const cheap = { logN: 10, r: 8, p: 1 };

export interface BuiltPerson {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  password: string;
}

/** Inserts a person with their own unique email; override anything. */
export async function buildPerson(db: Db, overrides: Partial<typeof people.$inferInsert> & { roles?: Role[]; password?: string } = {}): Promise<BuiltPerson> {
  const { password = TEST_PASSWORD, ...rest } = overrides;
  const tag = randomUUID().slice(0, 8);
  const [row] = await db
    .insert(people)
    .values({ email: `person-${tag}@test.example`, name: `Test Person ${tag}`, roles: ["operator"], passwordHash: await hashPassword(password, cheap), ...rest })
    .returning();
  return { id: row.id, email: row.email, name: row.name, roles: row.roles as Role[], password };
}
