import { z } from "zod";

const flag = z
  .enum(["true", "false", "1", "0", "yes", "no"])
  .transform((v) => v === "true" || v === "1" || v === "yes");

const port = z.coerce.number().int().min(1).max(65535);

/** Environment variables Isobatch reads, with their defaults. */
export const EnvSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  HOST: z.string().min(1).default("127.0.0.1"),
  PORT: port.default(3000),
  STORAGE_DIR: z.string().min(1).default("storage"),
  // When DATABASE_URL is unset, Isobatch runs its own PostgreSQL cluster under STORAGE_DIR.
  DATABASE_URL: z.string().url().optional(),
  DB_PORT: port.default(54329),
  // When S3_ENDPOINT is unset, Isobatch runs s3rver on loopback with its data under STORAGE_DIR.
  S3_ENDPOINT: z.string().url().optional(),
  S3_PORT: port.default(54330),
  S3_BUCKET: z.string().min(3).max(63).regex(/^[a-z0-9][a-z0-9.-]+[a-z0-9]$/, "lower-case letters, digits, dots and hyphens").default("isobatch-files"),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_ACCESS_KEY_ID: z.string().min(1).default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default("S3RVER"),
  // When SMTP_URL is unset, Isobatch runs a mail catcher on loopback saving each message under STORAGE_DIR.
  SMTP_URL: z.string().url().optional(),
  SMTP_PORT: port.default(54325),
  MAIL_FROM: z.string().min(3).default("Isobatch <isobatch@harrowfen.example>"),
  MAIL_POLL_MS: z.coerce.number().int().min(50).max(600_000).default(2000),
  APP_URL: z.string().url().optional(),
  SESSION_SECRET: z.string().min(32).optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().positive().max(24 * 60).default(15),
  LOCKOUT_THRESHOLD: z.coerce.number().int().min(1).max(100).default(5),
  PASSWORD_MAX_AGE_DAYS: z.coerce.number().int().min(1).max(3650).default(90),
  PASSWORD_HISTORY: z.coerce.number().int().min(0).max(24).default(5),
  UPLOAD_MAX_BYTES: z.coerce.number().int().min(1).default(25 * 1024 * 1024),
  SEED_DEMO: flag.default(true),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
});

export type Env = z.infer<typeof EnvSchema>;

export class ConfigError extends Error {}

/** Reads and validates the environment; a bad value throws naming the variable. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const present = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ""));
  const parsed = EnvSchema.safeParse(present);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new ConfigError(`Isobatch cannot start: these environment variables are not valid:\n${lines.join("\n")}`);
  }
  return parsed.data;
}
