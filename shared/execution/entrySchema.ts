import { z } from "zod";
import type { FieldDefinition, StepDefinition } from "../schemas/masterRecords.js";

/** A field's limits at this batch's scale (per-litre-of-V0 quantities multiplied by V0). */
export function limitsAtScale(field: FieldDefinition, v0L: number): { low: number | null; high: number | null } {
  if (field.kind !== "number") return { low: null, high: null };
  const k = field.perLitreV0 ? v0L : 1;
  return { low: field.low === null ? null : field.low * k, high: field.high === null ? null : field.high * k };
}

/** True when a number lies outside the field's limits at this scale. */
export function isOutOfLimit(field: FieldDefinition, value: unknown, v0L: number): boolean {
  if (field.kind !== "number" || typeof value !== "number") return false;
  const { low, high } = limitsAtScale(field, v0L);
  return (low !== null && value < low) || (high !== null && value > high);
}

export interface StepEntryInput {
  values: Record<string, unknown>;
  comments: Record<string, string>;
}

function fieldSchema(field: FieldDefinition): z.ZodType {
  switch (field.kind) {
    case "number":
      return z.number({ error: "must be a number" }).refine(Number.isFinite, "must be a number");
    case "text":
      return z.string({ error: "must be text" }).trim().min(field.required ? 1 : 0, "is required").max(4000, "is too long");
    case "choice":
      return z.enum(field.choices as [string, ...string[]], { error: `must be one of: ${field.choices.join(", ")}` });
    case "datetime":
      return z.iso.datetime({ offset: true, error: "must be a date and time (ISO 8601, with a time zone)" });
    case "attachment":
      return z.uuid({ error: "must be the id of an uploaded file" });
  }
}

/**
 * The zod schema of one step's entry, built from its field definitions. An out-of-limit number
 * is accepted only with a comment for that field. Client and server both validate with it.
 */
export function entrySchemaFor(step: StepDefinition, v0L: number) {
  const shape: Record<string, z.ZodType> = {};
  for (const field of step.fields) shape[field.key] = field.required ? fieldSchema(field) : fieldSchema(field).optional().nullable();
  return z
    .object({
      values: z.object(shape, { error: "values: must be an object of the step's fields" }).strict(),
      comments: z.record(z.string(), z.string().trim().max(2000, "is too long")).default({}),
    })
    .superRefine((entry, ctx) => {
      for (const field of step.fields) {
        if (!isOutOfLimit(field, entry.values[field.key], v0L)) continue;
        if (!entry.comments[field.key]?.trim()) {
          const { low, high } = limitsAtScale(field, v0L);
          ctx.addIssue({ code: "custom", path: ["comments", field.key], message: `${field.label} is outside its limits (${low ?? "—"} to ${high ?? "—"} ${field.kind === "number" ? field.unit : ""}); say why in a comment` });
        }
      }
    });
}

/** Field keys of an entry that are outside their limits. */
export function outOfLimitKeys(step: StepDefinition, values: Record<string, unknown>, v0L: number): string[] {
  return step.fields.filter((f) => isOutOfLimit(f, values[f.key], v0L)).map((f) => f.key);
}
