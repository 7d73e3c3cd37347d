import { inject } from "vitest";
import { pino, type Logger } from "pino";
import request from "supertest";
import type { Express } from "express";
import { createApp } from "../../server/app.js";
import { createDatabase, type Database } from "../../server/db/client.js";
import { createStorageService, type StorageService } from "../../server/services/storage.js";
import { createMailService, type MailService } from "../../server/services/mail.js";
import type { AppSettings } from "../../server/services/types.js";
import type { RouteDeclaration } from "../../server/http/policyRouter.js";
import type { SessionCache } from "../../server/http/sessionCache.js";

export interface TestApp {
  app: Express;
  routes: RouteDeclaration[];
  sessionCache: SessionCache;
  database: Database;
  storage: StorageService;
  mail: MailService;
  settings: AppSettings;
  close(): Promise<void>;
}

export interface TestAppOptions {
  settings?: Partial<AppSettings>;
  s3Endpoint?: string;
  smtpUrl?: string;
  bucket?: string;
  databaseUrl?: string;
  /** The app's logger; silent unless given. */
  log?: Logger;
}

/** Builds the real app over the run's throw-away services; each test file makes its own. */
export async function startTestApp(opts: TestAppOptions = {}): Promise<TestApp> {
  const log = opts.log ?? pino({ level: "silent" });
  const database = createDatabase(opts.databaseUrl ?? inject("databaseUrl"));
  const storage = createStorageService({ endpoint: opts.s3Endpoint ?? inject("s3Endpoint"), bucket: opts.bucket ?? "isobatch-test", region: "us-east-1", accessKeyId: "S3RVER", secretAccessKey: "S3RVER" });
  if (!opts.s3Endpoint) await storage.ensureBucket();
  const mail = createMailService({ db: database.db, smtpUrl: opts.smtpUrl ?? inject("smtpUrl"), from: "Isobatch <isobatch@harrowfen.example>", pollMs: 100_000, log });
  const settings: AppSettings = {
    appUrl: "http://127.0.0.1:3000",
    sessionSecret: "test-secret-that-is-long-enough-for-hmac",
    sessionIdleMinutes: 15,
    lockoutThreshold: 5,
    passwordMaxAgeDays: 90,
    passwordHistory: 5,
    uploadMaxBytes: 1024 * 1024,
    secureCookie: false,
    signInPerMinute: 1000,
    signaturesPerMinute: 1000,
    mailDir: inject("mailDir"),
    ...opts.settings,
  };
  const built = createApp({ settings, pool: database.pool, db: database.db, storage, mail, log });
  return {
    app: built.app,
    routes: built.routes,
    sessionCache: built.sessionCache,
    database,
    storage,
    mail,
    settings,
    close: async () => {
      await mail.stop();
      await built.close();
      storage.close();
      await database.close();
    },
  };
}

/** A signed-in (or not) client that keeps its cookie and sends the CSRF token. */
export class Client {
  agent: ReturnType<typeof request.agent>;
  csrf = "";
  constructor(app: Express) {
    this.agent = request.agent(app);
  }
  async refreshCsrf() {
    const res = await this.agent.get("/api/session");
    this.csrf = res.body.csrfToken;
    return res;
  }
  async signIn(email: string, password: string) {
    if (!this.csrf) await this.refreshCsrf();
    const res = await this.agent.post("/api/session").set("X-CSRF-Token", this.csrf).send({ email, password });
    if (res.body.csrfToken) this.csrf = res.body.csrfToken;
    return res;
  }
  get(path: string) {
    return this.agent.get(path);
  }
  send(method: "post" | "put" | "patch" | "delete", path: string, body?: object) {
    const req = this.agent[method](path).set("X-CSRF-Token", this.csrf);
    return body === undefined ? req : req.send(body);
  }
  post(path: string, body?: object) {
    return this.send("post", path, body ?? {});
  }
}
