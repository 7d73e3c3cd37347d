import { index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { people } from "./foundation.js";

/**
 * Electronic signatures. Append-only (a trigger refuses UPDATE and DELETE). Each is bound to
 * what it signed by the SHA-256 of that content's canonical JSON (RFC 8785).
 */
export const signatures = pgTable(
  "signatures",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    signerId: uuid("signer_id").notNull().references(() => people.id),
    signerName: text("signer_name").notNull(),
    meaning: text("meaning").notNull(),
    comment: text("comment"),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    contentHash: text("content_hash").notNull(),
    signedAt: timestamp("signed_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("signatures_entity_idx").on(t.entityType, t.entityId)],
);
