import type { TrainingStatus } from "../schemas/training.js";

/** The calendar day of `now` in UTC, as YYYY-MM-DD: the day training dates are judged on. */
export const utcDay = (now: Date): string => now.toISOString().slice(0, 10);

/** A record's status on `day` (YYYY-MM-DD, UTC); valid_until counts as a whole day. */
export function trainingStatusOn(record: { trainedOn: string; validUntil: string; withdrawnAt: Date | null }, day: string): TrainingStatus {
  if (record.withdrawnAt) return "withdrawn";
  if (day < record.trainedOn) return "not-yet-valid";
  if (day > record.validUntil) return "expired";
  return "current";
}
