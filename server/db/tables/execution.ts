import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { files, people } from "./foundation.js";
import { batches } from "./campaigns.js";

/**
 * What a person entered for a step. Append-only: a correction is a new version with a
 * reason, and every earlier version stays.
 */
export const stepEntries = pgTable(
  "step_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    batchId: uuid("batch_id").notNull().references(() => batches.id),
    phase: text("phase").notNull(),
    stepKey: text("step_key").notNull(),
    version: integer("version").notNull(),
    values: jsonb("values").notNull(),
    comments: jsonb("comments").notNull().default({}),
    outOfLimit: jsonb("out_of_limit").notNull().default([]),
    reason: text("reason"),
    enteredBy: uuid("entered_by").notNull().references(() => people.id),
    enteredAt: timestamp("entered_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("step_entries_batch_step_version").on(t.batchId, t.stepKey, t.version), index("step_entries_batch_idx").on(t.batchId)],
);

export const deviations = pgTable(
  "deviations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    batchId: uuid("batch_id").notNull().references(() => batches.id),
    stepKey: text("step_key"),
    /** What raised it: a person, or a check (relief pressure, rated volume, kinetics, yield …). */
    source: text("source").notNull().default("person"),
    title: text("title").notNull(),
    description: text("description").notNull(),
    severity: text("severity", { enum: ["minor", "major", "critical"] }).notNull(),
    status: text("status", { enum: ["open", "investigated", "closed"] }).notNull().default("open"),
    rootCause: text("root_cause"),
    action: text("action"),
    /** Set when the investigation accepts a kinetics check outside the model. */
    coversKinetics: boolean("covers_kinetics").notNull().default(false),
    raisedBy: uuid("raised_by").references(() => people.id),
    raisedAt: timestamp("raised_at", { withTimezone: true }).notNull().defaultNow(),
    investigatedBy: uuid("investigated_by").references(() => people.id),
    investigatedAt: timestamp("investigated_at", { withTimezone: true }),
    closedBy: uuid("closed_by").references(() => people.id),
    closedAt: timestamp("closed_at", { withTimezone: true }),
    revision: integer("revision").notNull().default(1),
  },
  (t) => [index("deviations_batch_idx").on(t.batchId), index("deviations_status_idx").on(t.status)],
);

/** Files attached to a batch or one of its steps (photos, printouts, logger files). */
export const batchAttachments = pgTable(
  "batch_attachments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    batchId: uuid("batch_id").notNull().references(() => batches.id),
    stepKey: text("step_key"),
    fileId: uuid("file_id").notNull().references(() => files.id),
    note: text("note"),
    addedBy: uuid("added_by").notNull().references(() => people.id),
    addedAt: timestamp("added_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("batch_attachments_batch_idx").on(t.batchId)],
);

/** A logger trace, parsed from its file into SI arrays (s, L, K, Pa). Each file adds one; none replaces another. */
export const batchTraces = pgTable(
  "batch_traces",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    batchId: uuid("batch_id").notNull().references(() => batches.id),
    fileId: uuid("file_id").notNull().references(() => files.id),
    sha256: text("sha256").notNull(),
    points: integer("points").notNull(),
    t: doublePrecision("t").array().notNull(),
    V: doublePrecision("v").array().notNull(),
    T: doublePrecision("temperature").array(),
    P: doublePrecision("pressure").array(),
    addedBy: uuid("added_by").notNull().references(() => people.id),
    addedAt: timestamp("added_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("batch_traces_batch_idx").on(t.batchId)],
);

export const batchSamples = pgTable(
  "batch_samples",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    batchId: uuid("batch_id").notNull().references(() => batches.id),
    sampledAt: timestamp("sampled_at", { withTimezone: true }).notNull(),
    volumeL: doublePrecision("volume_l").notNull(),
    labResult: text("lab_result"),
    fileId: uuid("file_id").references(() => files.id),
    takenBy: uuid("taken_by").notNull().references(() => people.id),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("batch_samples_batch_idx").on(t.batchId)],
);
