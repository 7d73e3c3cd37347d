import { eq, sql } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { people } from "../db/schema.js";
import { decoyHash, verifyPassword } from "./passwords.js";
import { recordAudit, SYSTEM_ACTOR } from "./audit.js";
import type { MailService } from "../services/mail.js";

export type CredentialPurpose = "sign-in" | "signature";

export type CredentialResult =
  | { ok: true; person: typeof people.$inferSelect }
  | { ok: false; reason: "bad-credentials" | "account-locked" | "account-inactive" };

export interface CredentialCheckerOptions {
  db: Db;
  mail: MailService;
  lockoutThreshold: number;
  appUrl: string;
  /** Passwords older than this must be changed at sign-in. */
  passwordMaxAgeDays?: number;
  /** Told once a change to a person is committed (this server's copies of their sessions go). */
  afterPersonChange?: (personId: string) => void;
}

/**
 * Checks an email and password, for a sign-in or for an electronic signature. Failures of
 * both count towards the lockout; each failure, and the lock, is audited and committed even
 * though the caller's action is refused.
 */
export function createCredentialChecker(opts: CredentialCheckerOptions) {
  return async function checkCredentials(email: string, password: string, purpose: CredentialPurpose): Promise<CredentialResult> {
    const normalised = email.trim().toLowerCase();
    const person = await opts.db.query.people.findFirst({ where: eq(people.email, normalised) });
    if (!person) {
      await verifyPassword(password, await decoyHash());
      await opts.db.transaction((tx) =>
        recordAudit(tx, SYSTEM_ACTOR, { action: `${purpose}-failed`, entityType: "person", entityId: normalised, after: { reason: "unknown email" } }),
      );
      return { ok: false, reason: "bad-credentials" };
    }
    if (!person.active) return { ok: false, reason: "account-inactive" };
    if (person.lockedAt) return { ok: false, reason: "account-locked" };
    const actor = { id: person.id, name: person.name };
    if (await verifyPassword(password, person.passwordHash)) {
      const ageDays = (Date.now() - person.passwordChangedAt.getTime()) / 86_400_000;
      const expired = purpose === "sign-in" && opts.passwordMaxAgeDays !== undefined && ageDays > opts.passwordMaxAgeDays && !person.mustChangePassword;
      await opts.db.transaction(async (tx) => {
        await tx.update(people).set({ failedSignIns: 0, ...(purpose === "sign-in" ? { lastSignInAt: sql`now()` } : {}), ...(expired ? { mustChangePassword: true } : {}) }).where(eq(people.id, person.id));
        if (expired) await recordAudit(tx, SYSTEM_ACTOR, { action: "password-expired", entityType: "person", entityId: person.id, before: { mustChangePassword: false }, after: { mustChangePassword: true }, reason: `password older than ${opts.passwordMaxAgeDays} days` });
        if (purpose === "sign-in") await recordAudit(tx, actor, { action: "signed-in", entityType: "person", entityId: person.id });
      });
      opts.afterPersonChange?.(person.id);
      return { ok: true, person: expired ? { ...person, mustChangePassword: true } : person };
    }
    const locked = await opts.db.transaction(async (tx) => {
      // Counted in the database so two failures at once both count.
      const [row] = await tx
        .update(people)
        .set({ failedSignIns: sql`${people.failedSignIns} + 1` })
        .where(eq(people.id, person.id))
        .returning({ failed: people.failedSignIns });
      await recordAudit(tx, actor, { action: `${purpose}-failed`, entityType: "person", entityId: person.id, after: { failedAttempts: row.failed } });
      if (row.failed < opts.lockoutThreshold) return false;
      await tx.update(people).set({ lockedAt: sql`now()` }).where(eq(people.id, person.id));
      await recordAudit(tx, SYSTEM_ACTOR, {
        action: "account-locked",
        entityType: "person",
        entityId: person.id,
        before: { locked: false },
        after: { locked: true, failedAttempts: row.failed },
        reason: `${row.failed} failed password attempts in a row`,
      });
      const admins = await tx.select({ email: people.email }).from(people).where(sql`'admin' = any(${people.roles}) and ${people.active}`);
      for (const admin of admins) {
        await opts.mail.enqueue(tx, {
          to: admin.email,
          subject: `Isobatch: account locked — ${person.name}`,
          text: `The account of ${person.name} (${person.email}) was locked after ${row.failed} failed password attempts in a row.\n\nIf this was not the person themselves, treat it as a security event. Unlock the account from People once you have spoken to them:\n${opts.appUrl}/admin/people\n`,
        });
      }
      return true;
    });
    opts.afterPersonChange?.(person.id);
    return { ok: false, reason: locked ? "account-locked" : "bad-credentials" };
  };
}

export type CheckCredentials = ReturnType<typeof createCredentialChecker>;
