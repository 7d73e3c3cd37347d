import { doublePrecision, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { people } from "./foundation.js";
import { masterRecordVersions, rateModelVersions, vessels } from "./masterData.js";

/** A campaign: one process at growing scale, on one approved master record and rate model. */
export const campaigns = pgTable("campaigns", {
  id: uuid("id").primaryKey().defaultRandom(),
  code: text("code").notNull().unique(),
  process: text("process").notNull(),
  masterRecordVersionId: uuid("master_record_version_id").notNull().references(() => masterRecordVersions.id),
  rateModelVersionId: uuid("rate_model_version_id").notNull().references(() => rateModelVersions.id),
  createdBy: uuid("created_by").notNull().references(() => people.id),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

/** A batch, pinned to the master-record and model versions it was planned with. */
export const batches = pgTable("batches", {
  id: uuid("id").primaryKey().defaultRandom(),
  code: text("code").notNull().unique(),
  campaignId: uuid("campaign_id").notNull().references(() => campaigns.id),
  vesselId: uuid("vessel_id").notNull().references(() => vessels.id),
  masterRecordVersionId: uuid("master_record_version_id").notNull().references(() => masterRecordVersions.id),
  rateModelVersionId: uuid("rate_model_version_id").notNull().references(() => rateModelVersions.id),
  v0L: doublePrecision("v0_l").notNull(),
  temperatureK: doublePrecision("temperature_k").notNull(),
  pressurePa: doublePrecision("pressure_pa").notNull(),
  entered: jsonb("entered").notNull(),
  plan: jsonb("plan").notNull(),
  state: text("state").notNull().default("planned"),
  heldFrom: text("held_from"),
  holdReason: text("hold_reason"),
  revision: integer("revision").notNull().default(1),
  createdBy: uuid("created_by").notNull().references(() => people.id),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});
