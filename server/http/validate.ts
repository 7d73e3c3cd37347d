import type { RequestHandler } from "express";
import type { ZodType } from "zod";
import { fromZod } from "./errors.js";

/** Replaces req.body with its parsed value, or answers 400 naming the first bad field. */
export function validate(schema: ZodType): RequestHandler {
  return (req, _res, next) => {
    const parsed = schema.safeParse(req.body ?? {});
    if (!parsed.success) return next(fromZod(parsed.error));
    req.body = parsed.data;
    next();
  };
}

/** Parses the query string with `schema`; 400 naming the field when it does not fit. */
export function parseQuery<T>(schema: ZodType<T>, query: unknown): T {
  const parsed = schema.safeParse(query);
  if (!parsed.success) throw fromZod(parsed.error);
  return parsed.data;
}
