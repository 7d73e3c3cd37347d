import type { FieldError, Resolver } from "react-hook-form";
import { toNestErrors } from "@hookform/resolvers";
import {
  MasterRecordCreateSchema,
  MasterRecordDraftSchema,
  MasterRecordDraftUpdateSchema,
  PHASES,
  type FieldDefinition,
  type MasterRecordContent,
  type Phase,
  type StepDefinition,
} from "../../../../shared/schemas/masterRecords";

export type FieldKind = FieldDefinition["kind"];

/**
 * One field as the builder edits it: every kind's settings in one row, so the kind can be
 * switched without losing what was typed. Choices are typed one per line.
 */
export interface FieldRow {
  kind: FieldKind;
  key: string;
  label: string;
  required: boolean;
  unit: string;
  low: number | null;
  high: number | null;
  perLitreV0: boolean;
  choices: string;
}

export interface StepRow {
  key: string;
  title: string;
  instructions: string;
  critical: boolean;
  fields: FieldRow[];
}

export interface MasterRecordFormValues {
  code: string;
  title: string;
  content: {
    phases: Record<Phase, StepRow[]>;
    maxConversion: number;
    targetConversion: number;
    notes: string;
  };
  reason: string;
}

export interface MasterRecordFormOutput {
  code?: string;
  title?: string;
  content: MasterRecordContent;
  reason?: string;
}

export type MasterRecordFormMode = "create" | "draft" | "edit";

/** Words for each phase of a master record. */
export const PHASE_TITLES: Record<Phase, string> = { charge: "Charge", run: "Run", sample: "Sample", release: "Release" };

/** Words for each field kind. */
export const KIND_LABELS: Record<FieldKind, string> = {
  number: "Number",
  text: "Text",
  choice: "Choice",
  datetime: "Date and time",
  attachment: "Attachment",
};

const orNull = (x: number | null) => (x === null || x === undefined || Number.isNaN(x) ? null : x);

/** A builder row as the field definition the schema checks; only the chosen kind's settings are kept. */
export function rowToField(row: FieldRow): FieldDefinition {
  const base = { key: row.key.trim(), label: row.label.trim(), required: row.required };
  switch (row.kind) {
    case "number":
      return { kind: "number", ...base, unit: row.unit.trim(), low: orNull(row.low), high: orNull(row.high), perLitreV0: row.perLitreV0 };
    case "choice":
      return { kind: "choice", ...base, choices: row.choices.split("\n").map((c) => c.trim()).filter(Boolean) };
    default:
      return { kind: row.kind, ...base };
  }
}

/** A field definition as a builder row. */
export function fieldToRow(field: FieldDefinition): FieldRow {
  return {
    kind: field.kind,
    key: field.key,
    label: field.label,
    required: field.required,
    unit: field.kind === "number" ? field.unit : "",
    low: field.kind === "number" ? field.low : null,
    high: field.kind === "number" ? field.high : null,
    perLitreV0: field.kind === "number" ? field.perLitreV0 : false,
    choices: field.kind === "choice" ? field.choices.join("\n") : "",
  };
}

/** A builder step as the step definition the schema checks. */
export function rowToStep(step: StepRow): StepDefinition {
  return { key: step.key.trim(), title: step.title.trim(), instructions: step.instructions, critical: step.critical, fields: step.fields.map(rowToField) };
}

/** A version's content as builder values. */
export function contentToForm(content: MasterRecordContent, code = "", title = ""): MasterRecordFormValues {
  const phases = Object.fromEntries(
    PHASES.map((phase) => [phase, content.phases[phase].map((step) => ({ ...step, fields: step.fields.map(fieldToRow) }))]),
  ) as Record<Phase, StepRow[]>;
  return { code, title, content: { phases, maxConversion: content.maxConversion, targetConversion: content.targetConversion, notes: content.notes ?? "" }, reason: "" };
}

/** An empty master record: one step in each phase to start from. */
export function emptyMasterRecord(): MasterRecordFormValues {
  const phases = Object.fromEntries(PHASES.map((phase) => [phase, [newStep(phase, [])]])) as Record<Phase, StepRow[]>;
  return { code: "", title: "", content: { phases, maxConversion: 1, targetConversion: undefined as unknown as number, notes: "" }, reason: "" };
}

function freeKey(prefix: string, taken: string[]): string {
  let n = 1;
  while (taken.includes(`${prefix}${n}`)) n++;
  return `${prefix}${n}`;
}

/** A new step whose key is unused across the record. */
export function newStep(phase: Phase, takenKeys: string[]): StepRow {
  return { key: freeKey(`${phase}Step`, takenKeys), title: "", instructions: "", critical: false, fields: [] };
}

/** A new required text field whose key is unused in its step. */
export function newField(takenKeys: string[]): FieldRow {
  return { kind: "text", key: freeKey("field", takenKeys), label: "", required: true, unit: "", low: null, high: null, perLitreV0: false, choices: "" };
}

/** Every step key in the builder, for picking fresh ones. */
export function allStepKeys(phases: Record<Phase, StepRow[]>): string[] {
  return PHASES.flatMap((phase) => phases[phase].map((step) => step.key));
}

function schemaFor(mode: MasterRecordFormMode) {
  if (mode === "create") return MasterRecordCreateSchema;
  if (mode === "edit") return MasterRecordDraftUpdateSchema.omit({ revision: true });
  return MasterRecordDraftSchema;
}

/** Validates the builder with the shared schema the server uses; each problem lands on its input. */
export function masterRecordResolver(mode: MasterRecordFormMode): Resolver<MasterRecordFormValues, unknown, MasterRecordFormOutput> {
  return (values, _context, options) => {
    const { phases, maxConversion, targetConversion, notes } = values.content;
    const content = {
      phases: Object.fromEntries(PHASES.map((phase) => [phase, phases[phase].map(rowToStep)])),
      maxConversion,
      targetConversion,
      notes,
    };
    const body: Record<string, unknown> = { content };
    if (mode === "create") Object.assign(body, { code: values.code, title: values.title });
    if (mode === "edit") body.reason = values.reason;
    const parsed = schemaFor(mode).safeParse(body);
    if (parsed.success) return { values: parsed.data as MasterRecordFormOutput, errors: {} };
    const errors: Record<string, FieldError> = {};
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String).join(".") || "root";
      if (!errors[path]) errors[path] = { type: "schema", message: issue.message };
    }
    return { values: {}, errors: toNestErrors(errors, options) };
  };
}
