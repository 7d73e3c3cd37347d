import rateLimit from "express-rate-limit";
import type { RequestHandler } from "express";
import { HttpError } from "./errors.js";
import type { SignedInPerson } from "../policies/access.js";

/**
 * Limits password-bearing requests of a signed-in person (electronic signatures), so a stolen
 * session cannot be used to guess the password quickly; the lockout still counts every failure.
 */
export function signingLimiter(perMinute: number): RequestHandler {
  const limiter = rateLimit({
    windowMs: 60_000,
    limit: perMinute,
    standardHeaders: "draft-7",
    legacyHeaders: false,
    keyGenerator: (req) => (req.user as SignedInPerson).id,
    handler: (_req, _res, next) => next(new HttpError(429, "too-many-signatures", "Too many signing attempts in a minute. Wait a moment and try again; nothing was signed.")),
  });
  return (req, res, next) => {
    const signing = req.method !== "GET" && req.user && typeof req.body?.password === "string";
    return signing ? limiter(req, res, next) : next();
  };
}
