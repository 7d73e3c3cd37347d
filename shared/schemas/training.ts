import { z } from "zod";
import { Uuid } from "./common.js";
import { ReasonSchema } from "./people.js";
import type { Role } from "./roles.js";

const Password = z.string({ error: "is required: re-enter your password to sign" }).min(1, "is required: re-enter your password to sign").max(256, "is too long");

/** True when `text` (YYYY-MM-DD) names a day that exists, e.g. not 2026-02-30. */
function isCalendarDay(text: string): boolean {
  const [y, m, d] = text.split("-").map(Number);
  const day = new Date(Date.UTC(y, m - 1, d));
  return day.getUTCFullYear() === y && day.getUTCMonth() === m - 1 && day.getUTCDate() === d;
}

/** A calendar day as YYYY-MM-DD, judged in UTC. */
export const CalendarDaySchema = z
  .string({ error: "must be a date (YYYY-MM-DD)" })
  .regex(/^(19|2\d)\d\d-\d\d-\d\d$/, "must be a date (YYYY-MM-DD) between 1900 and 2999")
  .refine(isCalendarDay, "is not a day of the calendar");

/** Recording a person's training on one master-record version, signed with the recorder's password. */
export const TrainingRecordSchema = z
  .object({
    personId: Uuid,
    masterRecordVersionId: Uuid,
    trainedOn: CalendarDaySchema,
    validUntil: CalendarDaySchema,
    note: z.string({ error: "must be text" }).trim().max(2000, "must be at most 2000 characters").optional(),
    password: Password,
  })
  .refine((v) => v.validUntil >= v.trainedOn, { path: ["validUntil"], message: "must be on or after the day of the training" });
export type TrainingRecordInput = z.infer<typeof TrainingRecordSchema>;

/** Withdrawing a training record: why, signed with the password. */
export const TrainingWithdrawSchema = z.object({ reason: ReasonSchema, password: Password });
export type TrainingWithdrawInput = z.infer<typeof TrainingWithdrawSchema>;

/** GET /api/training's optional filters. */
export const TrainingListQuerySchema = z.object({ personId: Uuid.optional(), masterRecordVersionId: Uuid.optional() });

export const TRAINING_STATUSES = ["current", "expired", "not-yet-valid", "withdrawn"] as const;
export type TrainingStatus = (typeof TRAINING_STATUSES)[number];

/** Why a person may not perform or verify steps of a master-record version now. */
export type TrainingProblemCode = "training-missing" | "training-expired" | "training-not-yet-valid";

/** A training record as the API shows it. */
export interface TrainingRecordView {
  id: string;
  person: { id: string; name: string };
  masterRecord: { versionId: string; code: string; title: string; version: number; status: "draft" | "approved" | "superseded" };
  trainedOn: string;
  validUntil: string;
  note: string | null;
  status: TrainingStatus;
  recordedBy: { id: string; name: string };
  recordedAt: string;
  withdrawnAt: string | null;
  withdrawnBy: { id: string; name: string } | null;
  withdrawReason: string | null;
}

/** A person a recorder may pick (never their email or sign-in state). */
export interface TraineeChoice {
  id: string;
  name: string;
  roles: Role[];
}

/** GET /api/training: the records the viewer may see; recorders and quality also get the people to filter by. */
export interface TrainingListView {
  today: string;
  records: TrainingRecordView[];
  /** True when there were more records than one answer holds (the newest are shown). */
  truncated: boolean;
  people?: TraineeChoice[];
}

/** The batch page's word on the viewer's training for the batch's master-record version. */
export interface BatchTrainingView {
  current: boolean;
  code?: TrainingProblemCode;
  message?: string;
}
