import { fileURLToPath } from "node:url";
import { pino } from "pino";
import { ConfigError, loadEnv } from "./config.js";
import { startLocalServices, localSessionSecret } from "./services/localServices.js";
import { bootServer } from "./boot.js";

// Boots Isobatch: starts whatever local service the environment does not point elsewhere
// (PostgreSQL, s3rver, the mail catcher), then the app. Ctrl-C stops everything it started.
async function main() {
  const env = loadEnv();
  const log = pino({ level: env.LOG_LEVEL });
  const local = await startLocalServices({
    storageDir: env.STORAGE_DIR,
    dbPort: env.DB_PORT,
    s3Port: env.S3_PORT,
    smtpPort: env.SMTP_PORT,
    databaseUrl: env.DATABASE_URL,
    s3Endpoint: env.S3_ENDPOINT,
    smtpUrl: env.SMTP_URL,
    log: (line) => log.info(line),
  });
  let running: Awaited<ReturnType<typeof bootServer>> | undefined;
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log.info({ signal }, "stopping Isobatch and the services it started");
    await running?.close().catch(() => undefined);
    await local.stop();
    process.exit(0);
  };
  for (const s of ["SIGINT", "SIGTERM"] as const) process.on(s, () => void stop(s));
  try {
    running = await bootServer(
      env,
      {
        databaseUrl: local.databaseUrl,
        s3Endpoint: local.s3Endpoint,
        smtpUrl: local.smtpUrl,
        mailDir: env.SMTP_URL ? undefined : local.mailDir,
        sessionSecret: env.SESSION_SECRET ?? localSessionSecret(env.STORAGE_DIR),
        webDist: process.env.ISOBATCH_SERVE_WEB === "false" ? undefined : fileURLToPath(new URL("../dist/web", import.meta.url)),
      },
      log,
    );
  } catch (err) {
    await local.stop();
    throw err;
  }
  const lines = [`Isobatch is running: ${running.url}`, ...local.started.map((s) => `  ${s}`), "Press Ctrl-C to stop."];
  console.log(lines.join("\n"));
}

main().catch((err) => {
  console.error(err instanceof ConfigError ? err.message : err);
  process.exit(1);
});
