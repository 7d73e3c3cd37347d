import { inArray } from "drizzle-orm";
import type { Db } from "./client.js";
import { people } from "./schema.js";
import { hashPassword } from "../commands/passwords.js";
import { recordAudit, SYSTEM_ACTOR } from "../commands/audit.js";
import { presentPerson } from "../routes/people/presenter.js";
import type { Role } from "../../shared/schemas/roles.js";

/** Demo-only password of every seeded account (invented scenario: Harrow Fen pilot plant). */
export const DEMO_PASSWORD = "harrow-fen-demo";

export const DEMO_PEOPLE: { email: string; name: string; roles: Role[] }[] = [
  { email: "operator@harrowfen.example", name: "Owen Marsh", roles: ["operator"] },
  { email: "supervisor@harrowfen.example", name: "Priya Natarajan", roles: ["supervisor"] },
  { email: "quality@harrowfen.example", name: "Helen Ashby", roles: ["quality"] },
  { email: "engineer@harrowfen.example", name: "Tomás Reyes", roles: ["engineer"] },
  { email: "admin@harrowfen.example", name: "Sam Whitlock", roles: ["admin"] },
  // Trained on HF-DMX once, but the training has lapsed: the batch page shows why steps are blocked.
  { email: "operator2@harrowfen.example", name: "Ines Cartwright", roles: ["operator"] },
];

/** Seeds the demo; running it again adds only what is missing and changes nothing that exists. */
export async function seedDemo(db: Db): Promise<{ created: number }> {
  const existing = await db.select({ email: people.email }).from(people).where(inArray(people.email, DEMO_PEOPLE.map((p) => p.email)));
  const missing = DEMO_PEOPLE.filter((p) => !existing.some((e) => e.email === p.email));
  if (missing.length === 0) return { created: 0 };
  const hashes = await Promise.all(missing.map(() => hashPassword(DEMO_PASSWORD)));
  return db.transaction(async (tx) => {
    let created = 0;
    for (const [i, person] of missing.entries()) {
      const [row] = await tx.insert(people).values({ ...person, passwordHash: hashes[i] }).onConflictDoNothing({ target: people.email }).returning();
      if (!row) continue;
      created++;
      await recordAudit(tx, SYSTEM_ACTOR, { action: "person-created", entityType: "person", entityId: row.id, after: presentPerson(row), reason: "demo seed (SEED_DEMO=true)" });
    }
    return { created };
  });
}
