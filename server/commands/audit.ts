import { auditEvents } from "../db/schema.js";
import type { DbOrTx } from "../db/client.js";

/** Who did something: a person, or Isobatch itself (seed, mail worker). */
export interface Actor {
  id: string | null;
  name: string;
}

export const SYSTEM_ACTOR: Actor = { id: null, name: "Isobatch (system)" };

export interface AuditEntry {
  action: string;
  entityType: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
}

/**
 * Writes one audit row in the caller's transaction. Every mutation goes through here; the
 * database assigns the time, the sequence number and the chained hash.
 */
export async function recordAudit(tx: DbOrTx, actor: Actor, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    actorId: actor.id,
    actorName: actor.name,
    action: entry.action,
    entityType: entry.entityType,
    entityId: entry.entityId,
    before: entry.before ?? null,
    after: entry.after ?? null,
    reason: entry.reason ?? null,
  });
}
