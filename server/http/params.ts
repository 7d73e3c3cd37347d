import type { Request } from "express";
import { z } from "zod";
import { HttpError } from "./errors.js";

const Uuid = z.uuid();

/** The `:id` path parameter as a UUID, or 404 (an id that cannot exist names nothing). */
export function idParam(req: Request, name = "id"): string {
  const value = req.params[name];
  if (!Uuid.safeParse(value).success) throw new HttpError(404, "not-found", `No record has the id "${String(value).slice(0, 60)}".`);
  return value as string;
}
