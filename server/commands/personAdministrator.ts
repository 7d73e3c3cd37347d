import { eq, sql } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { people, sessions } from "../db/schema.js";
import { recordAudit, type Actor } from "./audit.js";
import { hashPassword } from "./passwords.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import { presentPerson } from "../routes/people/presenter.js";
import type { PersonCreateInput } from "../../shared/schemas/people.js";
import type { Role } from "../../shared/schemas/roles.js";

type PersonRow = typeof people.$inferSelect;
type Change = Partial<typeof people.$inferInsert>;

/** Account administration: each change audited with its reason in the same transaction. */
export function createPersonAdministrator(db: Db, afterPersonChange: (personId: string) => void = () => undefined) {
  async function change(actor: Actor, id: string, action: string, reason: string, patch: (row: PersonRow) => Change | Promise<Change>, opts: { endSessions?: boolean } = {}) {
    const person = await db.transaction(async (tx) => {
      const [row] = await tx.select().from(people).where(eq(people.id, id)).for("update");
      if (!row) throw notFound("That person");
      const values = await patch(row);
      const [updated] = await tx.update(people).set(values).where(eq(people.id, id)).returning();
      await recordAudit(tx, actor, { action, entityType: "person", entityId: id, before: presentPerson(row), after: presentPerson(updated), reason });
      // Signing a person out everywhere: their sessions go with the change.
      if (opts.endSessions) await tx.delete(sessions).where(sql`${sessions.sess}::jsonb -> 'passport' ->> 'user' = ${id}`);
      return presentPerson(updated);
    });
    afterPersonChange(id);
    return person;
  }

  return {
    async create(actor: Actor, input: PersonCreateInput) {
      const passwordHash = await hashPassword(input.temporaryPassword);
      return db.transaction(async (tx) => {
        const [row] = await tx
          .insert(people)
          .values({ email: input.email, name: input.name, roles: input.roles, passwordHash, mustChangePassword: true })
          .onConflictDoNothing({ target: people.email })
          .returning();
        if (!row) throw conflict("email-taken", `An account for ${input.email} exists already. Accounts are never deleted; reactivate it instead.`);
        await recordAudit(tx, actor, { action: "person-created", entityType: "person", entityId: row.id, after: presentPerson(row), reason: input.reason });
        return presentPerson(row);
      });
    },
    setRoles: (actor: Actor, id: string, roles: Role[], reason: string) =>
      change(actor, id, "roles-changed", reason, (row) => {
        if (row.id === actor.id && row.roles.includes("admin") && !roles.includes("admin")) {
          throw new HttpError(422, "cannot-drop-own-admin", "You cannot take the admin role from yourself; ask another administrator.", "roles");
        }
        return { roles };
      }),
    deactivate: (actor: Actor, id: string, reason: string) =>
      change(
        actor,
        id,
        "person-deactivated",
        reason,
        (row) => {
          if (row.id === actor.id) throw new HttpError(422, "cannot-deactivate-self", "You cannot deactivate your own account.", "id");
          if (!row.active) throw conflict("already-inactive", "This account is already inactive.");
          return { active: false };
        },
        { endSessions: true },
      ),
    reactivate: (actor: Actor, id: string, reason: string) =>
      change(actor, id, "person-reactivated", reason, (row) => {
        if (row.active) throw conflict("already-active", "This account is already active.");
        return { active: true };
      }),
    unlock: (actor: Actor, id: string, reason: string) =>
      change(actor, id, "account-unlocked", reason, (row) => {
        if (!row.lockedAt) throw conflict("not-locked", "This account is not locked.");
        return { lockedAt: null, failedSignIns: 0 };
      }),
    resetPassword: (actor: Actor, id: string, temporaryPassword: string, reason: string) =>
      change(actor, id, "password-reset", reason, async () => ({ passwordHash: await hashPassword(temporaryPassword), mustChangePassword: true, passwordChangedAt: sql`now()` as unknown as Date }), { endSessions: true }),
  };
}
