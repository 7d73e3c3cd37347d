import express, { type Express } from "express";
import helmet from "helmet";
import { existsSync } from "node:fs";
import { join } from "node:path";
import type { AppServices, RouteContext } from "./services/types.js";
import type { RouteDeclaration } from "./http/policyRouter.js";
import { errorHandler, notFoundRoute } from "./http/errors.js";
import { requestLog } from "./http/requestLog.js";
import { sessionMiddleware } from "./http/session.js";
import { SESSION_CACHE_LIMITS, SessionCache } from "./http/sessionCache.js";
import { idempotency } from "./http/idempotency.js";
import { signingLimiter } from "./http/signingLimiter.js";
import { createCredentialChecker } from "./commands/credentialChecker.js";
import { createNotifier } from "./commands/notifier.js";
import { createChangeFeed } from "./services/live.js";
import { healthRoutes } from "./routes/health/health.js";
import { sessionRoutes } from "./routes/session/session.js";
import { peopleRoutes } from "./routes/people/people.js";
import { fileRoutes } from "./routes/files/files.js";
import { mailRoutes } from "./routes/mail/mail.js";
import { auditRoutes } from "./routes/audit/audit.js";
import { vesselRoutes } from "./routes/vessels/vessels.js";
import { rateModelRoutes } from "./routes/rateModels/rateModels.js";
import { masterRecordRoutes } from "./routes/masterRecords/masterRecords.js";
import { campaignRoutes } from "./routes/campaigns/campaigns.js";
import { kineticsRoutes } from "./routes/kinetics/kinetics.js";
import { batchRoutes } from "./routes/batches/batches.js";
import { deviationRoutes } from "./routes/deviations/deviations.js";
import { queueRoutes } from "./routes/queues/queues.js";
import { liveRoutes } from "./routes/live/live.js";
import { trainingRoutes } from "./routes/training/training.js";

export interface BuiltApp {
  app: Express;
  routes: RouteDeclaration[];
  sessionCache: SessionCache;
  close(): Promise<void>;
}

/** Builds the Express app from its services; index.ts and the tests each call this. */
export function createApp(services: AppServices): BuiltApp {
  const { settings, log } = services;
  const app = express();
  app.set("trust proxy", "loopback");
  app.disable("x-powered-by");
  const sessionCache = new SessionCache(SESSION_CACHE_LIMITS);
  const checkCredentials = createCredentialChecker({ db: services.db, mail: services.mail, lockoutThreshold: settings.lockoutThreshold, appUrl: settings.appUrl, passwordMaxAgeDays: settings.passwordMaxAgeDays, afterPersonChange: (id) => sessionCache.forgetPerson(id) });
  const changes = createChangeFeed(services.pool, log);
  const ctx: RouteContext = { ...services, checkCredentials, notify: createNotifier(services.mail, settings.appUrl), changes, sessionCache };
  const routes: RouteDeclaration[] = [];

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", "data:", "blob:"],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      strictTransportSecurity: settings.secureCookie,
    }),
  );
  app.use(requestLog(log, { skip: (path) => path === "/api/health" }));
  app.use("/api", express.json({ limit: "1mb" }));
  const sessions = sessionMiddleware({ pool: services.pool, db: services.db, secret: settings.sessionSecret, idleMinutes: settings.sessionIdleMinutes, secureCookie: settings.secureCookie, checkCredentials, sessionCache, log });
  app.use("/api", ...sessions.handlers);
  app.use("/api", idempotency(services.db));
  app.use("/api", signingLimiter(settings.signaturesPerMinute));

  const routers = [
    healthRoutes(ctx, routes),
    sessionRoutes(ctx, routes, sessions.passport),
    peopleRoutes(ctx, routes),
    fileRoutes(ctx, routes),
    mailRoutes(ctx, routes),
    auditRoutes(ctx, routes),
    vesselRoutes(ctx, routes),
    rateModelRoutes(ctx, routes),
    masterRecordRoutes(ctx, routes),
    campaignRoutes(ctx, routes),
    kineticsRoutes(ctx, routes),
    batchRoutes(ctx, routes),
    deviationRoutes(ctx, routes),
    queueRoutes(ctx, routes),
    liveRoutes(ctx, routes),
    trainingRoutes(ctx, routes),
  ];
  for (const r of routers) {
    app.use(r.mountPath, r.router);
  }
  app.use("/api", notFoundRoute);

  if (settings.webDist && existsSync(join(settings.webDist, "index.html"))) {
    const dist = settings.webDist;
    app.use(express.static(dist, { index: false, maxAge: "1h", setHeaders: (res, path) => path.includes("/assets/") && res.setHeader("Cache-Control", "public, max-age=31536000, immutable") }));
    // The client routes its own paths: every other GET gets the app's page.
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(join(dist, "index.html")));
  }
  app.use(errorHandler(log));
  return {
    app,
    routes,
    sessionCache,
    close: async () => {
      changes.close();
      sessions.close();
    },
  };
}
