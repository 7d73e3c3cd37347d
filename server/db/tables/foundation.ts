import { sql } from "drizzle-orm";
import { bigint, boolean, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uuid, varchar, json } from "drizzle-orm/pg-core";

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

/** People who sign in. Never deleted: a person who signed anything must stay identifiable. */
export const people = pgTable("people", {
  id: uuid("id").primaryKey().defaultRandom(),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  roles: text("roles").array().notNull().default(sql`'{}'::text[]`),
  passwordHash: text("password_hash").notNull(),
  passwordChangedAt: timestamp("password_changed_at", { withTimezone: true }).notNull().defaultNow(),
  mustChangePassword: boolean("must_change_password").notNull().default(false),
  /** Hashes of the person's earlier passwords, newest first, so they are not chosen again. */
  passwordHistory: jsonb("password_history").$type<string[]>().notNull().default([]),
  active: boolean("active").notNull().default(true),
  failedSignIns: integer("failed_sign_ins").notNull().default(0),
  lockedAt: timestamp("locked_at", { withTimezone: true }),
  lastSignInAt: timestamp("last_sign_in_at", { withTimezone: true }),
  createdAt: createdAt(),
});

/** Sessions, in the table layout connect-pg-simple expects. */
export const sessions = pgTable(
  "session",
  {
    sid: varchar("sid").primaryKey(),
    sess: json("sess").notNull(),
    expire: timestamp("expire", { precision: 6 }).notNull(),
  },
  (t) => [index("session_expire_idx").on(t.expire)],
);

/**
 * The audit trail. Append-only and hash-chained: a trigger (see the migration) assigns `seq`,
 * `occurred_at`, `prev_hash` and `hash`, and refuses UPDATE, DELETE and TRUNCATE.
 */
export const auditEvents = pgTable(
  "audit_events",
  {
    seq: bigint("seq", { mode: "number" }).primaryKey().default(0),
    occurredAt: timestamp("occurred_at", { withTimezone: true }).notNull().defaultNow(),
    actorId: uuid("actor_id"),
    actorName: text("actor_name").notNull(),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    before: jsonb("before"),
    after: jsonb("after"),
    reason: text("reason"),
    prevHash: text("prev_hash").notNull().default(""),
    hash: text("hash").notNull().default(""),
  },
  (t) => [index("audit_events_entity_idx").on(t.entityType, t.entityId)],
);

/** Uploaded files; the bytes live in the S3 bucket under `storage_key`, never the file's own name. */
export const files = pgTable("files", {
  id: uuid("id").primaryKey().defaultRandom(),
  storageKey: text("storage_key").notNull().unique(),
  originalName: text("original_name").notNull(),
  contentType: text("content_type").notNull(),
  sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
  sha256: text("sha256").notNull(),
  uploadedBy: uuid("uploaded_by").notNull().references(() => people.id),
  uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Mail waiting to be sent (and what was sent): written in the caller's transaction. */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    status: text("status", { enum: ["queued", "sent"] }).notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    createdAt: createdAt(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [index("mail_outbox_due_idx").on(t.status, t.nextAttemptAt)],
);

/**
 * Answers already given to mutating requests that carried an Idempotency-Key, so a retried
 * request (a tablet that lost its connection) is applied once and answered as the first time.
 */
export const idempotencyKeys = pgTable(
  "idempotency_keys",
  {
    personId: uuid("person_id").notNull(),
    key: text("key").notNull(),
    method: text("method").notNull(),
    path: text("path").notNull(),
    status: integer("status"),
    body: jsonb("body"),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.personId, t.key] })],
);
