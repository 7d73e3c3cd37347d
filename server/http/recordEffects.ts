import type { RequestHandler } from "express";
import { z } from "zod";
import { ReasonSchema } from "../../shared/schemas/people.js";
import { fromZod } from "./errors.js";

/**
 * What a mutating route does to the records, declared on each one next to its access:
 * it creates a record, changes an existing one (so it needs a reason), signs one, moves a
 * batch through its lifecycle (the move decides whether a reason is needed), only computes,
 * or handles the caller's own session.
 */
export const RECORD_EFFECTS = ["creates", "changes", "signs", "moves", "computes", "session"] as const;
export type RecordEffect = (typeof RECORD_EFFECTS)[number];

type Declared = RequestHandler & { recordEffect: RecordEffect };

function declare(effect: RecordEffect, handler: RequestHandler = (_req, _res, next) => next()): Declared {
  return Object.assign(handler, { recordEffect: effect });
}

const WithReason = z.object({ reason: ReasonSchema });

/** A change to an existing record: refused with 400 naming `reason` when the body has none. */
export const changesRecord = declare("changes", (req, _res, next) => {
  const parsed = WithReason.safeParse(req.body ?? {});
  next(parsed.success ? undefined : fromZod(parsed.error));
});
export const createsRecord = declare("creates");
export const signsRecord = declare("signs");
export const movesBatch = declare("moves");
export const computesOnly = declare("computes");
export const ownSession = declare("session");

/** The effect a route's handlers declare, if any. */
export function declaredEffect(handlers: RequestHandler[]): RecordEffect | undefined {
  return (handlers.find((h) => "recordEffect" in h) as Declared | undefined)?.recordEffect;
}
