import { doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { files, people } from "./foundation.js";
import { batches } from "./campaigns.js";

/**
 * Each run of the kinetics check, with exactly what it ran on (trace file hashes, model version,
 * library version) so it can be reproduced; a check whose trace hashes no longer match the
 * batch's traces is stale and runs again.
 */
export const kineticsChecks = pgTable(
  "kinetics_checks",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    batchId: uuid("batch_id").notNull().references(() => batches.id),
    rateModelVersionId: uuid("rate_model_version_id").notNull(),
    libraryVersion: text("library_version").notNull(),
    traceHashes: jsonb("trace_hashes").notNull(),
    inputs: jsonb("inputs").notNull(),
    verdict: text("verdict", { enum: ["within", "outside"] }).notNull(),
    reasons: jsonb("reasons").notNull(),
    kObserved: doublePrecision("k_observed"),
    kObservedLow: doublePrecision("k_observed_low"),
    kObservedHigh: doublePrecision("k_observed_high"),
    kModel: doublePrecision("k_model").notNull(),
    deviationPct: doublePrecision("deviation_pct"),
    residualRms: doublePrecision("residual_rms"),
    points: integer("points").notNull(),
    maxConversion: doublePrecision("max_conversion"),
    result: jsonb("result").notNull(),
    ranBy: uuid("ran_by").references(() => people.id),
    ranAt: timestamp("ran_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("kinetics_checks_batch_idx").on(t.batchId)],
);

/** The executed batch record as released: the PDF's file and hash. */
export const batchRecordDocuments = pgTable("batch_record_documents", {
  id: uuid("id").primaryKey().defaultRandom(),
  batchId: uuid("batch_id").notNull().references(() => batches.id),
  fileId: uuid("file_id").notNull().references(() => files.id),
  sha256: text("sha256").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});
