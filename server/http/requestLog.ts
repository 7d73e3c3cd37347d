import type { RequestHandler } from "express";
import type { Logger } from "pino";
import type { SignedInPerson } from "../policies/access.js";

export interface RequestLogOptions {
  /** Paths (without the query) that are answered without a log line, e.g. the health probe. */
  skip?: (path: string) => boolean;
}

/**
 * One access-log line per request once it is answered (or abandoned): method, path, status, time
 * taken and who asked. Headers, query strings and bodies are never logged, so session cookies,
 * CSRF tokens and passwords stay out of the log. Nothing is built when the levels are off.
 *
 * Written here rather than taken from pino-http, which serialises every request's headers
 * (the session cookie among them) into a child logger, even with logging off; that cost about
 * a fifth of a simple write's server time under load (tests/bench/load.ts).
 */
export function requestLog(log: Logger, opts: RequestLogOptions = {}): RequestHandler {
  return (req, res, next) => {
    if (!log.isLevelEnabled("warn")) return next();
    const path = req.originalUrl.split("?", 1)[0];
    if (opts.skip?.(path)) return next();
    const started = performance.now();
    res.once("close", () => {
      const status = res.statusCode;
      const level = !res.writableFinished ? "warn" : status >= 500 ? "error" : status >= 400 ? "warn" : "info";
      if (!log.isLevelEnabled(level)) return;
      const personId = (req.user as SignedInPerson | undefined)?.id ?? null;
      const ms = Math.round((performance.now() - started) * 10) / 10;
      const line = { method: req.method, path, status, ms, personId, ...(res.writableFinished ? {} : { abandoned: true }) };
      log[level](line, res.writableFinished ? "request answered" : "request abandoned before its answer was sent");
    });
    next();
  };
}
