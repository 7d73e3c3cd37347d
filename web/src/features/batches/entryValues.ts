import type { FieldErrors, Resolver } from "react-hook-form";
import { entrySchemaFor } from "../../../../shared/execution/entrySchema";
import type { StepDefinition } from "../../../../shared/schemas/masterRecords";
import { ReasonSchema } from "../../../../shared/schemas/people";
import { readNumber } from "./fieldText";
import type { BatchStepView, StepEntryView } from "./types";

/** The entry form as typed: every box holds text until it is read for sending. */
export interface EntryFormValues {
  values: Record<string, string>;
  comments: Record<string, string>;
  reason: string;
}

/** The API's entry body: typed values and the non-empty comments. */
export interface EntryInput {
  values: Record<string, unknown>;
  comments: Record<string, string>;
}

const pad = (n: number) => String(n).padStart(2, "0");

/** An ISO time as a datetime-local box shows it (the tablet's own time zone). */
export function isoToLocalInput(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return "";
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Reads the typed form into the entry the API takes; unreadable text is passed on for the schema to name. */
export function toEntryInput(step: BatchStepView, form: EntryFormValues): EntryInput {
  const values: Record<string, unknown> = {};
  for (const field of step.fields) {
    const text = (form.values[field.key] ?? "").trim();
    if (text === "") continue;
    if (field.kind === "number") values[field.key] = readNumber(text);
    else if (field.kind === "datetime") {
      const d = new Date(text);
      values[field.key] = Number.isNaN(d.getTime()) ? text : d.toISOString();
    } else values[field.key] = text;
  }
  const comments: Record<string, string> = {};
  for (const [key, text] of Object.entries(form.comments ?? {})) if (text?.trim()) comments[key] = text.trim();
  return { values, comments };
}

/** The form's starting text: empty, or the current entry's values for a correction. */
export function entryFormDefaults(step: BatchStepView, entry: StepEntryView | null): EntryFormValues {
  const values: Record<string, string> = {};
  const comments: Record<string, string> = {};
  for (const field of step.fields) {
    const value = entry?.values[field.key];
    values[field.key] = value === undefined || value === null ? "" : field.kind === "datetime" && typeof value === "string" ? isoToLocalInput(value) : String(value);
    comments[field.key] = entry?.comments[field.key] ?? "";
  }
  return { values, comments, reason: "" };
}

/**
 * Validates the typed entry with the very schema the server uses (entrySchemaFor), plus the
 * reason a correction needs; errors land on the boxes they concern.
 */
export function entryResolver(step: BatchStepView, v0L: number, needsReason: boolean): Resolver<EntryFormValues> {
  const schema = entrySchemaFor(step as unknown as StepDefinition, v0L);
  return async (form) => {
    const errors: Record<string, Record<string, { type: string; message: string }> | { type: string; message: string }> = {};
    const parsed = schema.safeParse(toEntryInput(step, form));
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [group, key] = issue.path.map(String);
        if ((group === "values" || group === "comments") && key) {
          const bucket = (errors[group] ??= {}) as Record<string, { type: string; message: string }>;
          bucket[key] ??= { type: "validation", message: issue.message };
        }
      }
    }
    if (needsReason) {
      const reason = ReasonSchema.safeParse(form.reason);
      if (!reason.success) errors.reason = { type: "validation", message: reason.error.issues[0]?.message ?? "is required" };
    }
    if (Object.keys(errors).length) return { values: {}, errors: errors as FieldErrors<EntryFormValues> };
    return { values: form, errors: {} };
  };
}
