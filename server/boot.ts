import { pino, type Logger } from "pino";
import type { Server } from "node:http";
import type { Env } from "./config.js";
import { createDatabase, runMigrations } from "./db/client.js";
import { seedDemo } from "./db/seed.js";
import { seedDemoMasterData } from "./db/seedMasterData.js";
import { createCredentialChecker } from "./commands/credentialChecker.js";
import { createNotifier } from "./commands/notifier.js";
import { seedDemoBatches } from "./db/seedDemoBatches.js";
import { createStorageService } from "./services/storage.js";
import { createMailService } from "./services/mail.js";
import { createApp } from "./app.js";
import { sweepOrphanObjects } from "./services/orphanSweep.js";

export interface Endpoints {
  databaseUrl: string;
  s3Endpoint: string;
  smtpUrl: string;
  mailDir?: string;
  sessionSecret: string;
  webDist?: string;
}

export interface RunningServer {
  url: string;
  server: Server;
  log: Logger;
  close(): Promise<void>;
}

/** Connects to the services, migrates, seeds (when asked), and serves the app. */
export async function bootServer(env: Env, endpoints: Endpoints, log: Logger = pino({ level: env.LOG_LEVEL })): Promise<RunningServer> {
  const database = createDatabase(endpoints.databaseUrl, (err) => log.warn({ err: err.message }, "database connection lost; the pool reconnects on the next request"), 20);
  await runMigrations(database.db);
  const mail = createMailService({ db: database.db, smtpUrl: endpoints.smtpUrl, from: env.MAIL_FROM, pollMs: env.MAIL_POLL_MS, log });
  const storage = createStorageService({ endpoint: endpoints.s3Endpoint, bucket: env.S3_BUCKET, region: env.S3_REGION, accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY });
  await storage.ensureBucket();
  const url = env.APP_URL ?? `http://${env.HOST}:${env.PORT}`;
  if (env.SEED_DEMO) {
    const { created } = await seedDemo(database.db);
    const check = createCredentialChecker({ db: database.db, mail, lockoutThreshold: env.LOCKOUT_THRESHOLD, appUrl: url });
    await seedDemoMasterData(database.db, check);
    await seedDemoBatches(database.db, { storage, check, notify: createNotifier(mail, url), uploadMaxBytes: env.UPLOAD_MAX_BYTES });
    if (created) log.info({ created }, "demo data seeded");
  }
  const built = createApp({
    settings: {
      appUrl: url,
      sessionSecret: endpoints.sessionSecret,
      sessionIdleMinutes: env.SESSION_IDLE_MINUTES,
      lockoutThreshold: env.LOCKOUT_THRESHOLD,
      passwordMaxAgeDays: env.PASSWORD_MAX_AGE_DAYS,
      passwordHistory: env.PASSWORD_HISTORY,
      uploadMaxBytes: env.UPLOAD_MAX_BYTES,
      secureCookie: url.startsWith("https://"),
      signInPerMinute: 20,
      signaturesPerMinute: 60,
      mailDir: endpoints.mailDir,
      webDist: endpoints.webDist,
    },
    pool: database.pool,
    db: database.db,
    storage,
    mail,
    log,
  });
  mail.start();
  // Hourly, objects without a row and over an hour old are removed (see orphanSweep.ts).
  const sweep = setInterval(() => {
    sweepOrphanObjects(database.db, storage, 3_600_000).then(
      (removed) => removed.length && log.info({ removed: removed.length }, "removed file-store objects that had no record"),
      (err) => log.warn({ err: (err as Error).message }, "orphan sweep did not finish; it runs again in an hour"),
    );
  }, 3_600_000);
  sweep.unref();
  const server = await new Promise<Server>((ok, fail) => {
    const s = built.app.listen(env.PORT, env.HOST, () => ok(s));
    s.once("error", fail);
  });
  return {
    url,
    server,
    log,
    close: async () => {
      await new Promise<void>((ok) => server.close(() => ok()));
      server.closeAllConnections?.();
      clearInterval(sweep);
      await mail.stop();
      await built.close();
      storage.close();
      await database.close();
    },
  };
}
