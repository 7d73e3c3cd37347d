import { ApiError } from "../../api/client";
import type { Refusal } from "../../../../shared/machines/batchMoves";

/** The reasons a refused move carries (error.refusals), if any. */
export function refusalsOf(error: unknown): Refusal[] {
  if (!(error instanceof ApiError)) return [];
  const list = error.details.refusals;
  return Array.isArray(list) ? list.filter((r): r is Refusal => typeof r?.message === "string") : [];
}

/** True when someone else changed the batch since this screen showed it. */
export const isStaleRevision = (error: unknown) => error instanceof ApiError && error.code === "stale-revision";
