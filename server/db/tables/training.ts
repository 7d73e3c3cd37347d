import { sql } from "drizzle-orm";
import { check, date, index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { people } from "./foundation.js";
import { masterRecordVersions } from "./masterData.js";

/**
 * Who is trained on which master-record version, and until when (valid_until inclusive, in UTC).
 * Never deleted; the only change a trigger lets through is a single withdrawal (see the migration).
 */
export const trainingRecords = pgTable(
  "training_records",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    personId: uuid("person_id").notNull().references(() => people.id),
    masterRecordVersionId: uuid("master_record_version_id").notNull().references(() => masterRecordVersions.id),
    trainedOn: date("trained_on", { mode: "string" }).notNull(),
    validUntil: date("valid_until", { mode: "string" }).notNull(),
    note: text("note"),
    recordedBy: uuid("recorded_by").notNull().references(() => people.id),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    withdrawnBy: uuid("withdrawn_by").references(() => people.id),
    withdrawReason: text("withdraw_reason"),
  },
  (t) => [
    index("training_records_person_version_idx").on(t.personId, t.masterRecordVersionId),
    check("training_records_dates_in_order", sql`${t.validUntil} >= ${t.trainedOn}`),
    // A withdrawal is whole: when, by whom and why, or none of them.
    check("training_records_withdrawal_whole", sql`(${t.withdrawnAt} is null) = (${t.withdrawnBy} is null) and (${t.withdrawnAt} is null) = (${t.withdrawReason} is null)`),
  ],
);
