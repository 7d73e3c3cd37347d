import type { RequestHandler } from "express";
import { and, eq, lt, sql } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { idempotencyKeys } from "../db/schema.js";
import { HttpError } from "./errors.js";
import type { SignedInPerson } from "../policies/access.js";

const MUTATING = new Set(["POST", "PUT", "PATCH", "DELETE"]);
const KEY = /^[A-Za-z0-9_-]{8,100}$/;
const KEEP_HOURS = 24;

/**
 * Applies a signed-in person's mutating request once per Idempotency-Key: a repeat gets the
 * first answer back; a repeat while the first is still running gets 409. Server errors (5xx)
 * are not kept, so the request can be tried again.
 */
export function idempotency(db: Db): RequestHandler {
  let lastSweep = 0;
  return async (req, res, next) => {
    const key = req.get("idempotency-key");
    const person = req.user as SignedInPerson | undefined;
    if (!key || !person || !MUTATING.has(req.method)) return next();
    if (!KEY.test(key)) return next(new HttpError(400, "invalid-idempotency-key", "The Idempotency-Key header must be 8–100 letters, digits, - or _.", "Idempotency-Key"));
    try {
      if (Date.now() - lastSweep > 3_600_000) {
        lastSweep = Date.now();
        await db.delete(idempotencyKeys).where(lt(idempotencyKeys.createdAt, sql`now() - ${KEEP_HOURS} * interval '1 hour'`));
      }
      const path = req.originalUrl.split("?")[0];
      const claimed = await db.insert(idempotencyKeys).values({ personId: person.id, key, method: req.method, path }).onConflictDoNothing().returning();
      if (claimed.length === 0) {
        const [seen] = await db.select().from(idempotencyKeys).where(and(eq(idempotencyKeys.personId, person.id), eq(idempotencyKeys.key, key)));
        if (!seen) return next(new HttpError(409, "request-in-progress", "This request is still being handled; wait for its answer."));
        if (seen.method !== req.method || seen.path !== path) return next(new HttpError(422, "idempotency-key-reused", "This Idempotency-Key was used for another request; send a new key.", "Idempotency-Key"));
        if (seen.status === null) return next(new HttpError(409, "request-in-progress", "This request is still being handled; wait for its answer."));
        res.set("Idempotent-Replay", "true");
        return seen.body === null ? res.status(seen.status).end() : res.status(seen.status).json(seen.body);
      }
      const where = and(eq(idempotencyKeys.personId, person.id), eq(idempotencyKeys.key, key));
      const json = res.json.bind(res);
      // The answer is stored before it is sent, so a retry that follows it finds it.
      res.json = (value: unknown) => {
        const store = res.statusCode >= 500 ? db.delete(idempotencyKeys).where(where) : db.update(idempotencyKeys).set({ status: res.statusCode, body: value as object }).where(where);
        store.then(
          () => json(value),
          () => json(value),
        );
        return res;
      };
      res.on("finish", () => {
        // Answers without a JSON body (204) are stored here.
        db.update(idempotencyKeys).set({ status: res.statusCode }).where(and(where, sql`${idempotencyKeys.status} is null`)).catch(() => undefined);
      });
      next();
    } catch (err) {
      next(err);
    }
  };
}
