import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";

/** An error with the HTTP status, code and message a person should see. */
export class HttpError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public field?: string,
    public extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const badInput = (message: string, field?: string) => new HttpError(400, "invalid-input", message, field);
export const notFound = (what: string) => new HttpError(404, "not-found", `${what} was not found.`);
export const conflict = (code: string, message: string, extra?: Record<string, unknown>) => new HttpError(409, code, message, undefined, extra);

/** Turns a zod failure into the first issue's message, naming its field. */
export function fromZod(err: ZodError): HttpError {
  const issue = err.issues[0];
  const field = issue?.path.join(".") || undefined;
  const message = issue ? `${field ?? "body"}: ${issue.message}` : "The request is not valid.";
  return new HttpError(400, "invalid-input", message, field, { issues: err.issues.slice(0, 20).map((i) => ({ field: i.path.join("."), message: i.message })) });
}

export const notFoundRoute: RequestHandler = (req, _res, next) => next(new HttpError(404, "no-such-route", `No API route ${req.method} ${req.path}.`));

const unavailableCodes = new Set(["57P01", "57P02", "57P03", "08000", "08001", "08003", "08006", "53300"]);
/** True for PostgreSQL and socket errors that mean "the database is not there right now". */
export const isDbUnavailable = (err: any) =>
  unavailableCodes.has(err?.code) || ["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT"].includes(err?.code) || /Connection terminated|timeout exceeded when trying to connect|is not queryable/i.test(String(err?.message));

/** The one error shape: `{ error: { code, message, field? } }`; never a stack trace. */
export function errorHandler(log: { error: (obj: object, msg: string) => void }): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let e: HttpError;
    if (err instanceof HttpError) e = err;
    else if (err instanceof ZodError) e = fromZod(err);
    else if (err?.type === "entity.parse.failed") e = new HttpError(400, "invalid-json", "The request body is not valid JSON.");
    else if (err?.type === "entity.too.large") e = new HttpError(413, "body-too-large", "The request body is too large.");
    else if (err?.type === "charset.unsupported" || err?.type === "encoding.unsupported") e = new HttpError(415, "unsupported-encoding", "The request body's encoding is not supported.");
    else if (isDbUnavailable(err) || isDbUnavailable(err?.cause)) e = new HttpError(503, "database-unavailable", "The database is not reachable just now. Nothing was saved; try again in a moment.");
    else {
      log.error({ err, method: req.method, url: req.originalUrl }, "unhandled error");
      e = new HttpError(500, "internal-error", "Something went wrong on the server. Nothing was saved; the error has been logged.");
    }
    if (res.headersSent) return res.destroy();
    const body: Record<string, unknown> = { code: e.code, message: e.message };
    if (e.field) body.field = e.field;
    if (e.extra) Object.assign(body, e.extra);
    res.status(e.status).json({ error: body });
  };
}
