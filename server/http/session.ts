import session from "express-session";
import { createSessionStore } from "./sessionStore.js";
import type { SessionCache } from "./sessionCache.js";
import passport from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import type { CheckCredentials } from "../commands/credentialChecker.js";
import type pg from "pg";
import { randomBytes, timingSafeEqual } from "node:crypto";
import type { RequestHandler } from "express";
import { eq } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { people } from "../db/schema.js";
import { HttpError } from "./errors.js";
import type { SignedInPerson } from "../policies/access.js";
import type { Role } from "../../shared/schemas/roles.js";

export interface SessionOptions {
  pool: pg.Pool;
  db: Db;
  secret: string;
  idleMinutes: number;
  secureCookie: boolean;
  checkCredentials: CheckCredentials;
  sessionCache: SessionCache;
  log: { warn: (o: object, m: string) => void };
}

/** Sessions in PostgreSQL, passport on top, idle timeout and CSRF check: in that order. */
export function sessionMiddleware(opts: SessionOptions) {
  const { store, personReadWith, close } = createSessionStore(opts.pool, opts.sessionCache, opts.log);
  const instance: passport.Authenticator = new passport.Passport();
  instance.use(
    new LocalStrategy({ usernameField: "email", passwordField: "password" }, (email, password, done) => {
      opts.checkCredentials(email, password, "sign-in").then(
        (result) => (result.ok ? done(null, toSignedInPerson(result.person)) : done(null, false, { message: result.reason })),
        (err) => done(err),
      );
    }),
  );
  instance.serializeUser<string>((user, done) => done(null, (user as SignedInPerson).id));
  instance.deserializeUser<string>(async (req: Express.Request, id: string, done: (err: unknown, user?: SignedInPerson | false) => void) => {
    try {
      // Normally read with the session itself (one query); looked up alone when it was not.
      const read = personReadWith(req);
      const row = read !== undefined ? (read?.id === id ? read : null) : await opts.db.query.people.findFirst({ where: eq(people.id, id) });
      // A deactivated or locked person is signed out on their next request.
      if (!row || !row.active || row.lockedAt) return done(null, false);
      done(null, toSignedInPerson(row));
    } catch (err) {
      done(err);
    }
  });
  const idleMs = opts.idleMinutes * 60_000;
  const handlers: RequestHandler[] = [
    session({
      store,
      secret: opts.secret,
      name: "isobatch.sid",
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: "lax", secure: opts.secureCookie, maxAge: 12 * 60 * 60_000 },
    }),
    idleTimeout(idleMs),
    // No passport.initialize(): since passport 0.6 the session middleware sets req.logIn and the
    // rest itself, and initialize() only adds req._passport for strategies older than that.
    instance.session(),
    csrfCheck,
  ];
  return { handlers, passport: instance, store, close };
}

export function toSignedInPerson(row: Pick<typeof people.$inferSelect, "id" | "email" | "name" | "roles" | "mustChangePassword">): SignedInPerson {
  return { id: row.id, email: row.email, name: row.name, roles: row.roles as Role[], mustChangePassword: row.mustChangePassword };
}

// Idle time is judged on the server, so an expired session can be told apart from none.
function idleTimeout(idleMs: number): RequestHandler {
  return (req, _res, next) => {
    const s = req.session;
    const now = Date.now();
    const signedIn = Boolean((s as { passport?: { user?: string } }).passport?.user);
    if (signedIn && s.lastSeenAt && now - s.lastSeenAt > idleMs) {
      delete (s as { passport?: unknown }).passport;
      s.expiredAt = now;
    }
    // Recorded to the minute's tenth at most, so a busy client does not rewrite its session on every request.
    if (signedIn && (!s.lastSeenAt || now - s.lastSeenAt > Math.min(6000, idleMs / 10))) s.lastSeenAt = now;
    next();
  };
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** The session's CSRF token, made on first use. */
export function csrfTokenFor(req: Parameters<RequestHandler>[0]): string {
  req.session.csrfToken ??= randomBytes(24).toString("base64url");
  return req.session.csrfToken;
}

const csrfCheck: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const sent = req.get("x-csrf-token") ?? "";
  const expected = req.session.csrfToken ?? "";
  const ok = expected.length > 0 && sent.length === expected.length && timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
  if (!ok) return next(new HttpError(403, "csrf-token-missing", "The X-CSRF-Token header is missing or stale: read a fresh token from GET /api/session and send it again."));
  next();
};
