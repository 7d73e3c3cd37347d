import { sql } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { people } from "../db/schema.js";
import type { MailService } from "../services/mail.js";
import type { Role } from "../../shared/schemas/roles.js";

/** Mail queued in the caller's transaction to everyone active holding a role, or to one person. */
export function createNotifier(mail: MailService, appUrl: string) {
  const page = (path: string) => `${appUrl}${path}`;
  const link = (batchId: string) => page(`/batches/${batchId}`);
  async function toRole(tx: DbOrTx, role: Role, subject: string, text: string) {
    const rows = await tx.select({ email: people.email }).from(people).where(sql`${role} = any(${people.roles}) and ${people.active}`);
    for (const r of rows) await mail.enqueue(tx, { to: r.email, subject, text });
  }
  return {
    link,
    page,
    toRole,
    async toPerson(tx: DbOrTx, personId: string, subject: string, text: string) {
      const rows = await tx.select({ email: people.email }).from(people).where(sql`${people.id} = ${personId} and ${people.active}`);
      for (const r of rows) await mail.enqueue(tx, { to: r.email, subject, text });
    },
  };
}

export type Notifier = ReturnType<typeof createNotifier>;
