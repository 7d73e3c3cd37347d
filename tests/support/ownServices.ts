import { chmodSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { startLocalServices, type LocalServices } from "../../server/services/localServices.js";
import { startLocalPostgres, type LocalPostgres } from "../../server/services/postgres.js";
import { startLocalS3, type LocalS3 } from "../../server/services/s3Server.js";
import { createDatabase, runMigrations } from "../../server/db/client.js";
import { freePort } from "./freePort.js";

/**
 * A private set of throw-away services (PostgreSQL, s3rver, mail catcher) in a temporary
 * folder on free ports, for a test or script that stops and restarts them. The run's shared
 * services are never touched.
 */
export interface OwnServices {
  dir: string;
  databaseUrl: string;
  s3Endpoint: string;
  smtpUrl: string;
  mailDir: string;
  dbPort: number;
  s3Port: number;
  /** Stops PostgreSQL (fast shutdown) and waits for it to exit. */
  stopPostgres(): Promise<void>;
  /** Starts PostgreSQL again on the same data folder and port. */
  startPostgres(): Promise<void>;
  /** Stops s3rver; connections still open finish first. */
  stopS3(): Promise<void>;
  /** Starts s3rver again on the same folder and port. */
  startS3(): Promise<void>;
  /** Stops everything and removes the folder. */
  stop(): Promise<void>;
}

/** Starts a private set of services and migrates its database. */
export async function startOwnServices(prefix = "isobatch-own-"): Promise<OwnServices> {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  chmodSync(dir, 0o755); // PostgreSQL runs as its own user and must reach its folder
  let local: LocalServices;
  try {
    local = await startLocalServices({ storageDir: dir, dbPort: await freePort(), s3Port: 0, smtpPort: 0, log: () => undefined });
  } catch (err) {
    rmSync(dir, { recursive: true, force: true });
    throw err;
  }
  const database = createDatabase(local.databaseUrl);
  await runMigrations(database.db);
  await database.close();

  let postgres: LocalPostgres | undefined = local.postgres!;
  let s3: LocalS3 | undefined = local.s3!;
  const dbPort = postgres.port;
  const s3Port = s3.port;
  const password = readFileSync(join(dir, "postgres-password"), "utf8").trim();
  const self: OwnServices = {
    dir,
    databaseUrl: local.databaseUrl,
    s3Endpoint: local.s3Endpoint,
    smtpUrl: local.smtpUrl,
    mailDir: local.mailDir,
    dbPort,
    s3Port,
    stopPostgres: async () => {
      await postgres?.stop();
      postgres = undefined;
    },
    startPostgres: async () => {
      postgres = await startLocalPostgres({ dataDir: join(dir, "postgres"), port: dbPort, database: "isobatch", user: "isobatch", password, log: () => undefined });
    },
    stopS3: async () => {
      await s3?.stop();
      s3 = undefined;
    },
    startS3: async () => {
      s3 = await startLocalS3(join(dir, "files"), s3Port);
    },
    stop: async () => {
      await s3?.stop().catch(() => undefined);
      await local.mail?.stop().catch(() => undefined);
      await postgres?.stop().catch(() => undefined);
      rmSync(dir, { recursive: true, force: true });
    },
  };
  return self;
}
