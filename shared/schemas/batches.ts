import { z } from "zod";
import { BATCH_MOVES, type BatchMove } from "../machines/batchMoves.js";
import { finite, Uuid } from "./common.js";
import { ReasonSchema } from "./people.js";
import { VOLUME_UNITS } from "../units/index.js";

const Password = z.string({ error: "is required: re-enter your password to sign" }).min(1, "is required: re-enter your password to sign").max(256);

/** Moves that change the course of a batch need a reason: holding it, resuming it, rejecting it. */
export const MOVES_WITH_REASON: readonly BatchMove[] = ["HOLD", "RESUME", "REJECT"];

/** A move of the lifecycle, with the batch revision the person saw (optimistic locking). */
export const BatchEventSchema = z
  .object({
    move: z.enum(BATCH_MOVES, { error: `must be one of ${BATCH_MOVES.join(", ")}` }),
    revision: z.number({ error: "must be the batch revision you saw" }).int(),
    reason: z.string().trim().max(2000).optional(),
    password: Password.optional(),
    comment: z.string().trim().max(2000).optional(),
  })
  .superRefine((e, ctx) => {
    if (MOVES_WITH_REASON.includes(e.move) && (!e.reason || e.reason.length < 3)) ctx.addIssue({ code: "custom", path: ["reason"], message: "is required: say why" });
    if ((e.move === "RESUME" || e.move === "RELEASE" || e.move === "REJECT") && !e.password) ctx.addIssue({ code: "custom", path: ["password"], message: "is required: re-enter your password to sign" });
  });
export type BatchEventInput = z.infer<typeof BatchEventSchema>;

/** Performing a step: the entry, signed "performed" with the password. */
export const StepPerformSchema = z.object({ values: z.record(z.string(), z.unknown()), comments: z.record(z.string(), z.string()).default({}), password: Password });
export const StepCorrectSchema = StepPerformSchema.extend({ reason: ReasonSchema });
export const StepVerifySchema = z.object({ password: Password, comment: z.string().trim().max(2000).optional() });

export const DEVIATION_SEVERITIES = ["minor", "major", "critical"] as const;
export const DeviationRaiseSchema = z.object({
  title: z.string({ error: "is required" }).trim().min(3, "must say what happened (at least 3 characters)").max(200),
  description: z.string({ error: "is required" }).trim().min(3, "must describe what happened").max(4000),
  severity: z.enum(DEVIATION_SEVERITIES, { error: "must be minor, major or critical" }),
  stepKey: z.string().max(40).optional(),
});
export const DeviationInvestigateSchema = z.object({
  rootCause: z.string({ error: "is required" }).trim().min(3, "is required").max(4000),
  action: z.string({ error: "is required" }).trim().min(3, "is required").max(4000),
  coversKinetics: z.boolean().default(false),
  revision: z.number().int(),
});
export const DeviationCloseSchema = z.object({ password: Password, comment: z.string().trim().max(2000).optional(), revision: z.number().int() });

export const AttachmentAddSchema = z.object({ fileId: Uuid, stepKey: z.string().max(40).optional(), note: z.string().trim().max(500).optional() });
export const TraceAddSchema = z.object({
  fileId: Uuid,
  /** Needed when the logger records piston travel instead of volume. */
  boreAreaM2: finite().positive().optional(),
});
export const SampleRecordSchema = z.object({
  sampledAt: z.iso.datetime({ offset: true, error: "must be a date and time (ISO 8601, with a time zone)" }),
  volume: z.object({ value: finite().positive("must be a positive volume"), unit: z.enum(VOLUME_UNITS) }),
  labResult: z.string().trim().max(2000).optional(),
  fileId: Uuid.optional(),
});
