import { doublePrecision, integer, jsonb, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { people } from "./foundation.js";

const stamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

/** Vessels, stored in SI (Pa absolute, L, m²) with the units the engineer entered. */
export const vessels = pgTable("vessels", {
  id: uuid("id").primaryKey().defaultRandom(),
  tag: text("tag").notNull().unique(),
  description: text("description").notNull(),
  mawpPa: doublePrecision("mawp_pa").notNull(),
  reliefSetPa: doublePrecision("relief_set_pa").notNull(),
  minVolumeL: doublePrecision("min_volume_l").notNull(),
  maxVolumeL: doublePrecision("max_volume_l").notNull(),
  boreAreaM2: doublePrecision("bore_area_m2"),
  pressureUnit: text("pressure_unit").notNull(),
  volumeUnit: text("volume_unit").notNull(),
  areaUnit: text("area_unit"),
  status: text("status", { enum: ["in-service", "out-of-service"] }).notNull().default("in-service"),
  revision: integer("revision").notNull().default(1),
  createdBy: uuid("created_by").notNull().references(() => people.id),
  ...stamps,
});

/** A rate model: a named family of versions. */
export const rateModels = pgTable("rate_models", {
  id: uuid("id").primaryKey().defaultRandom(),
  code: text("code").notNull().unique(),
  title: text("title").notNull(),
  createdBy: uuid("created_by").notNull().references(() => people.id),
  createdAt: stamps.createdAt,
});

/** One version of a rate model; only drafts change, approved versions are only succeeded. */
export const rateModelVersions = pgTable(
  "rate_model_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    modelId: uuid("model_id").notNull().references(() => rateModels.id),
    version: integer("version").notNull(),
    status: text("status", { enum: ["draft", "approved", "superseded"] }).notNull().default("draft"),
    content: jsonb("content").notNull(),
    epsilonA: doublePrecision("epsilon_a").notNull(),
    delta: doublePrecision("delta").notNull(),
    yA0: doublePrecision("y_a0").notNull(),
    basedOnBatchIds: jsonb("based_on_batch_ids").notNull().default([]),
    revision: integer("revision").notNull().default(1),
    createdBy: uuid("created_by").notNull().references(() => people.id),
    approvedAt: timestamp("approved_at", { withTimezone: true }),
    ...stamps,
  },
  (t) => [unique("rate_model_versions_model_version").on(t.modelId, t.version)],
);

/** A master record: a named family of versions. */
export const masterRecords = pgTable("master_records", {
  id: uuid("id").primaryKey().defaultRandom(),
  code: text("code").notNull().unique(),
  title: text("title").notNull(),
  createdBy: uuid("created_by").notNull().references(() => people.id),
  createdAt: stamps.createdAt,
});

export const masterRecordVersions = pgTable(
  "master_record_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    masterRecordId: uuid("master_record_id").notNull().references(() => masterRecords.id),
    version: integer("version").notNull(),
    status: text("status", { enum: ["draft", "approved", "superseded"] }).notNull().default("draft"),
    content: jsonb("content").notNull(),
    revision: integer("revision").notNull().default(1),
    createdBy: uuid("created_by").notNull().references(() => people.id),
    approvedAt: timestamp("approved_at", { withTimezone: true }),
    ...stamps,
  },
  (t) => [unique("master_record_versions_record_version").on(t.masterRecordId, t.version)],
);
