import { existsSync, readFileSync, writeFileSync, mkdirSync } from "node:fs";
import { join, resolve } from "node:path";
import { randomBytes } from "node:crypto";
import { startLocalPostgres, type LocalPostgres } from "./postgres.js";
import { startLocalS3, type LocalS3 } from "./s3Server.js";
import { startMailCatcher, type MailCatcher } from "./mailCatcher.js";

/** Where each local service listens, as the app's configuration needs it. */
export interface LocalServices {
  databaseUrl: string;
  s3Endpoint: string;
  smtpUrl: string;
  mailDir: string;
  postgres?: LocalPostgres;
  s3?: LocalS3;
  mail?: MailCatcher;
  started: string[];
  stop(): Promise<void>;
}

export interface LocalServicesOptions {
  storageDir: string;
  dbPort: number;
  s3Port: number;
  smtpPort: number;
  /** Reuse these instead of starting our own. */
  databaseUrl?: string;
  s3Endpoint?: string;
  smtpUrl?: string;
  log?: (line: string) => void;
}

/**
 * Ensures and starts what Isobatch needs on loopback: PostgreSQL under storage/postgres,
 * s3rver under storage/files, the mail catcher under storage/mail. `npm start` and the test
 * setup both come through here.
 */
export async function startLocalServices(opts: LocalServicesOptions): Promise<LocalServices> {
  const storage = resolve(opts.storageDir);
  mkdirSync(storage, { recursive: true });
  const log = opts.log ?? console.log;
  const started: string[] = [];
  const stops: (() => Promise<void>)[] = [];
  const stopAll = async () => {
    for (const stop of stops.reverse()) await stop().catch(() => undefined);
  };
  try {
    let postgres: LocalPostgres | undefined;
    let databaseUrl = opts.databaseUrl;
    if (!databaseUrl) {
      postgres = await startLocalPostgres({ dataDir: join(storage, "postgres"), port: opts.dbPort, database: "isobatch", user: "isobatch", password: localDbPassword(storage), log });
      stops.push(() => postgres!.stop());
      databaseUrl = postgres.url;
      started.push(`PostgreSQL  postgres://isobatch@127.0.0.1:${postgres.port}/isobatch  (data: ${join(storage, "postgres")})`);
    }
    let s3: LocalS3 | undefined;
    let s3Endpoint = opts.s3Endpoint;
    if (!s3Endpoint) {
      s3 = await startLocalS3(join(storage, "files"), opts.s3Port);
      stops.push(() => s3!.stop());
      s3Endpoint = s3.endpoint;
      started.push(`S3 (s3rver) ${s3.endpoint}  (objects: ${join(storage, "files")})`);
    }
    let mail: MailCatcher | undefined;
    let smtpUrl = opts.smtpUrl;
    const mailDir = join(storage, "mail");
    if (!smtpUrl) {
      mail = await startMailCatcher(mailDir, opts.smtpPort);
      stops.push(() => mail!.stop());
      smtpUrl = `smtp://${mail.host}:${mail.port}`;
      started.push(`SMTP catcher smtp://${mail.host}:${mail.port}  (messages: ${mailDir})`);
    }
    return { databaseUrl, s3Endpoint, smtpUrl, mailDir, postgres, s3, mail, started, stop: stopAll };
  } catch (err) {
    await stopAll();
    throw err;
  }
}

// The local cluster listens on loopback only; its role still gets a password of its own,
// made once and kept beside the data.
function localDbPassword(storage: string): string {
  const file = join(storage, "postgres-password");
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  const password = randomBytes(18).toString("base64url");
  writeFileSync(file, password + "\n", { mode: 0o600 });
  return password;
}

/** The session secret for a local install: made once, kept under storage/. */
export function localSessionSecret(storageDir: string): string {
  const file = join(resolve(storageDir), "session-secret");
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  mkdirSync(resolve(storageDir), { recursive: true });
  const secret = randomBytes(32).toString("base64url");
  writeFileSync(file, secret + "\n", { mode: 0o600 });
  return secret;
}
