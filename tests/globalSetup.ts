import { mkdtempSync, rmSync, chmodSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { TestProject } from "vitest/node";
import { startLocalServices } from "../server/services/localServices.js";
import { createDatabase, runMigrations } from "../server/db/client.js";
import { freePort } from "./support/freePort.js";

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
    s3Endpoint: string;
    smtpUrl: string;
    mailDir: string;
    /** A second database for tests that need tables nobody else writes to (an empty outbox). */
    isolatedDatabaseUrl: string;
    /** An empty database (no migrations) for the restore test. */
    emptyDatabaseUrl: string;
  }
}

// One set of throw-away services for the whole run: a PostgreSQL cluster in a temporary
// folder on a free port, s3rver and the mail catcher, through the same module `npm start` uses.
export default async function setup(project: TestProject) {
  const dir = mkdtempSync(join(tmpdir(), "isobatch-test-"));
  chmodSync(dir, 0o755); // PostgreSQL runs as its own user and must reach its folder
  const services = await startLocalServices({ storageDir: dir, dbPort: await freePort(), s3Port: 0, smtpPort: 0, log: () => undefined });
  const database = createDatabase(services.databaseUrl);
  await runMigrations(database.db);
  await database.close();
  const isolatedUrl = await services.postgres!.createDatabase("isobatch_isolated");
  const isolated = createDatabase(isolatedUrl);
  await runMigrations(isolated.db);
  await isolated.close();
  project.provide("isolatedDatabaseUrl", isolatedUrl);
  project.provide("emptyDatabaseUrl", await services.postgres!.createDatabase("isobatch_restore"));
  project.provide("databaseUrl", services.databaseUrl);
  project.provide("s3Endpoint", services.s3Endpoint);
  project.provide("smtpUrl", services.smtpUrl);
  project.provide("mailDir", services.mailDir);
  return async () => {
    await services.stop();
    rmSync(dir, { recursive: true, force: true });
  };
}
