import type { Request } from "express";
import rateLimit, { ipKeyGenerator } from "express-rate-limit";
import { eq, sql } from "drizzle-orm";
import type passport from "passport";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { anyone, signedInEvenBeforePasswordChange, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { HttpError } from "../../http/errors.js";
import { csrfTokenFor, toSignedInPerson } from "../../http/session.js";
import { PasswordChangeSchema, SignInSchema, type PasswordChangeInput } from "../../../shared/schemas/people.js";
import { people } from "../../db/schema.js";
import { hashPassword, verifyPassword } from "../../commands/passwords.js";
import { recordAudit } from "../../commands/audit.js";
import { ownSession } from "../../http/recordEffects.js";

const refusals = {
  "bad-credentials": new HttpError(401, "bad-credentials", "The email or password is not right."),
  "account-locked": new HttpError(423, "account-locked", "This account is locked after too many failed attempts. Ask an administrator to unlock it."),
  "account-inactive": new HttpError(403, "account-inactive", "This account has been deactivated. Ask an administrator if you need access again."),
};

const logIn = (req: Request, person: SignedInPerson) => new Promise<void>((ok, fail) => req.logIn(person, (err) => (err ? fail(err) : ok())));
const logOut = (req: Request) => new Promise<void>((ok, fail) => req.logOut((err) => (err ? fail(err) : ok())));

/** /api/session: who is signed in, sign-in (passport-local), sign-out and password change. */
export function sessionRoutes(ctx: RouteContext, registry: RouteDeclaration[], passport: passport.Authenticator) {
  const r = policyRouter("/api/session", registry);
  const signInLimiter = rateLimit({
    windowMs: 60_000,
    limit: ctx.settings.signInPerMinute,
    standardHeaders: "draft-7",
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? "")}|${String(req.body?.email ?? "").toLowerCase()}`,
    handler: (_req, _res, next) => next(new HttpError(429, "too-many-attempts", "Too many sign-in attempts for this account from here. Wait a minute and try again.")),
  });

  r.get("/", anyone, (req, res) => {
    res.json({ user: (req.user as SignedInPerson | undefined) ?? null, csrfToken: csrfTokenFor(req), sessionExpired: !req.user && req.session.expiredAt !== undefined });
  });

  r.post("/", anyone, ownSession, signInLimiter, validate(SignInSchema), async (req, res, next) => {
    const { user, reason } = await new Promise<{ user: SignedInPerson | false; reason?: keyof typeof refusals }>((ok, fail) =>
      passport.authenticate("local", (err: unknown, found: SignedInPerson | false, info?: { message?: keyof typeof refusals }) =>
        err ? fail(err) : ok({ user: found, reason: info?.message }),
      )(req, res, next),
    );
    if (!user) return next(refusals[reason ?? "bad-credentials"] ?? refusals["bad-credentials"]);
    await logIn(req, user); // passport regenerates the session id here: no fixation
    delete req.session.expiredAt;
    req.session.lastSeenAt = Date.now();
    res.json({ user, csrfToken: csrfTokenFor(req) });
  });

  r.delete("/", anyone, ownSession, async (req, res) => {
    const person = req.user as SignedInPerson | undefined;
    if (person) {
      await ctx.db.transaction((tx) => recordAudit(tx, person, { action: "signed-out", entityType: "person", entityId: person.id }));
      await logOut(req);
    }
    await new Promise<void>((ok) => req.session.destroy(() => ok()));
    res.clearCookie("isobatch.sid").status(204).end();
  });

  r.post("/password", signedInEvenBeforePasswordChange, ownSession, validate(PasswordChangeSchema), async (req, res) => {
    const me = req.user as SignedInPerson;
    const { currentPassword, newPassword } = req.body as PasswordChangeInput;
    const row = await ctx.db.query.people.findFirst({ where: eq(people.id, me.id) });
    if (!row) throw new HttpError(401, "not-signed-in", "Sign in first.");
    const check = await ctx.checkCredentials(row.email, currentPassword, "signature");
    if (!check.ok) {
      if (check.reason === "bad-credentials") throw new HttpError(422, "wrong-current-password", "The current password is not right.", "currentPassword");
      throw refusals[check.reason];
    }
    const recent = [row.passwordHash, ...(row.passwordHistory ?? []).slice(0, ctx.settings.passwordHistory)];
    for (const old of recent) {
      if (await verifyPassword(newPassword, old)) throw new HttpError(422, "password-reused", `Choose a password different from your current one and your last ${ctx.settings.passwordHistory}.`, "newPassword");
    }
    const passwordHash = await hashPassword(newPassword);
    const passwordHistory = [row.passwordHash, ...(row.passwordHistory ?? [])].slice(0, ctx.settings.passwordHistory);
    const updated = await ctx.db.transaction(async (tx) => {
      const [u] = await tx.update(people).set({ passwordHash, passwordHistory, passwordChangedAt: sql`now()`, mustChangePassword: false }).where(eq(people.id, me.id)).returning();
      await recordAudit(tx, me, { action: "password-changed", entityType: "person", entityId: me.id, before: { mustChangePassword: row.mustChangePassword }, after: { mustChangePassword: false } });
      return u;
    });
    ctx.sessionCache.forgetPerson(me.id);
    const user = toSignedInPerson(updated);
    await logIn(req, user);
    req.session.lastSeenAt = Date.now();
    res.json({ user, csrfToken: csrfTokenFor(req) });
  });
  return r;
}
