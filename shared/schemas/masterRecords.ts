import { z } from "zod";
import { finite } from "./common.js";
import { ReasonSchema } from "./people.js";

export const PHASES = ["charge", "run", "sample", "release"] as const;
export type Phase = (typeof PHASES)[number];

export const FIELD_KINDS = ["number", "text", "choice", "datetime", "attachment"] as const;

const Key = z.string({ error: "is required" }).trim().min(1, "is required").max(40).regex(/^[a-z][a-zA-Z0-9_]*$/, "must start with a lower-case letter and hold letters, digits or _");
const Label = z.string({ error: "is required" }).trim().min(1, "is required").max(120);

const NumberField = z
  .object({
    kind: z.literal("number"),
    key: Key,
    label: Label,
    unit: z.string().trim().max(20).default(""),
    low: finite().nullable().default(null),
    high: finite().nullable().default(null),
    /** A charge quantity given per litre of V0: the planned batch shows it scaled. */
    perLitreV0: z.boolean().default(false),
    required: z.boolean().default(true),
  })
  .refine((f) => f.low === null || f.high === null || f.low <= f.high, { message: "the low limit must not be above the high limit", path: ["low"] });
const TextField = z.object({ kind: z.literal("text"), key: Key, label: Label, required: z.boolean().default(true) });
const ChoiceField = z.object({
  kind: z.literal("choice"),
  key: Key,
  label: Label,
  choices: z.array(z.string().trim().min(1).max(80)).min(2, "needs at least two choices").max(20),
  required: z.boolean().default(true),
});
const DateTimeField = z.object({ kind: z.literal("datetime"), key: Key, label: Label, required: z.boolean().default(true) });
const AttachmentField = z.object({ kind: z.literal("attachment"), key: Key, label: Label, required: z.boolean().default(false) });

export const FieldSchema = z.discriminatedUnion("kind", [NumberField, TextField, ChoiceField, DateTimeField, AttachmentField]);
export type FieldDefinition = z.infer<typeof FieldSchema>;

export const StepSchema = z
  .object({
    key: Key,
    title: Label,
    instructions: z.string().trim().max(4000).default(""),
    critical: z.boolean().default(false),
    fields: z.array(FieldSchema).max(30),
  })
  .refine((s) => new Set(s.fields.map((f) => f.key)).size === s.fields.length, { message: "field keys must be unique within a step", path: ["fields"] });
export type StepDefinition = z.infer<typeof StepSchema>;

export const MasterRecordContentSchema = z
  .object({
    phases: z.object({
      charge: z.array(StepSchema).max(40),
      run: z.array(StepSchema).max(40),
      sample: z.array(StepSchema).max(40),
      release: z.array(StepSchema).max(40),
    }),
    /** The highest conversion the plan must allow for when it sizes the final volume (1 = complete). */
    maxConversion: finite().refine((x) => x > 0 && x <= 1, "must be above 0 and at most 1").default(1),
    /** The conversion at which the run is complete. */
    targetConversion: finite().refine((x) => x > 0 && x <= 1, "must be above 0 and at most 1"),
    /** Accepted yield: the final conversion against the theoretical (complete) conversion; outside it a deviation opens. */
    yieldLimits: z
      .object({ low: finite().refine((x) => x >= 0 && x <= 1.5, "must be between 0 and 1.5"), high: finite().refine((x) => x >= 0 && x <= 1.5, "must be between 0 and 1.5") })
      .refine((l) => l.low <= l.high, { message: "the low limit must not be above the high limit", path: ["low"] })
      .nullable()
      .default(null),
    notes: z.string().trim().max(4000).optional().default(""),
  })
  .refine((c) => c.targetConversion <= c.maxConversion, { message: "must not be above the maximum conversion", path: ["targetConversion"] })
  .refine((c) => new Set(PHASES.flatMap((p) => c.phases[p].map((s) => s.key))).size === PHASES.reduce((n, p) => n + c.phases[p].length, 0), {
    message: "step keys must be unique across the record",
    path: ["phases"],
  });
export type MasterRecordContent = z.infer<typeof MasterRecordContentSchema>;

export const MasterRecordCreateSchema = z.object({
  code: z.string({ error: "is required" }).trim().min(2).max(40).regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "may hold letters, digits, dots, hyphens and underscores"),
  title: z.string({ error: "is required" }).trim().min(3).max(200),
  content: MasterRecordContentSchema,
});
export const MasterRecordDraftSchema = z.object({ content: MasterRecordContentSchema });
export const MasterRecordDraftUpdateSchema = z.object({ content: MasterRecordContentSchema, reason: ReasonSchema, revision: z.number().int() });

export interface MasterRecordVersionView {
  id: string;
  masterRecordId: string;
  code: string;
  title: string;
  version: number;
  status: "draft" | "approved" | "superseded";
  content: MasterRecordContent;
  createdBy: { id: string; name: string };
  createdAt: string;
  approvedAt: string | null;
  revision: number;
  signatures: import("./common.js").SignatureView[];
  abilities: { edit: boolean; approve: boolean; succeed: boolean };
}
