import type pg from "pg";
import type { Logger } from "pino";
import type { Db } from "../db/client.js";
import type { StorageService } from "./storage.js";
import type { MailService } from "./mail.js";
import type { CheckCredentials } from "../commands/credentialChecker.js";
import type { Notifier } from "../commands/notifier.js";
import type { ChangeFeed } from "./live.js";
import type { SessionCache } from "../http/sessionCache.js";

/** Settings the app reads at run time (already validated). */
export interface AppSettings {
  appUrl: string;
  sessionSecret: string;
  sessionIdleMinutes: number;
  lockoutThreshold: number;
  passwordMaxAgeDays: number;
  passwordHistory: number;
  uploadMaxBytes: number;
  secureCookie: boolean;
  signInPerMinute: number;
  signaturesPerMinute: number;
  mailDir?: string;
  webDist?: string;
}

/** What the Express app is built from; index.ts and the tests each assemble one. */
export interface AppServices {
  settings: AppSettings;
  pool: pg.Pool;
  db: Db;
  storage: StorageService;
  mail: MailService;
  log: Logger;
}

/** What each route module receives. */
export interface RouteContext extends AppServices {
  checkCredentials: CheckCredentials;
  notify: Notifier;
  changes: ChangeFeed;
  /** Sessions read recently; routes that change a person forget that person's copies. */
  sessionCache: SessionCache;
}
