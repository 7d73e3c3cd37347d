import type { FieldErrors, Resolver } from "react-hook-form";
import { SampleRecordSchema } from "../../../../shared/schemas/batches";
import { readNumber } from "./fieldText";

/** The sample form as typed. */
export interface SampleFormValues {
  sampledAt: string;
  volumeValue: string;
  volumeUnit: "mL" | "L" | "m³";
  labResult: string;
}

/** The typed sample as the API takes it (fileId added once a file is uploaded). */
export function toSampleBody(form: SampleFormValues) {
  const when = new Date(form.sampledAt);
  return {
    sampledAt: form.sampledAt && !Number.isNaN(when.getTime()) ? when.toISOString() : form.sampledAt,
    volume: { value: readNumber(form.volumeValue), unit: form.volumeUnit },
    labResult: form.labResult.trim() || undefined,
  };
}

const FORM_FIELD: Record<string, keyof SampleFormValues> = { sampledAt: "sampledAt", "volume.value": "volumeValue", "volume.unit": "volumeUnit", labResult: "labResult" };

/** Validates the typed sample with the API's own schema (SampleRecordSchema). */
export const sampleResolver: Resolver<SampleFormValues> = async (form) => {
  const parsed = SampleRecordSchema.safeParse(toSampleBody(form));
  if (parsed.success) return { values: form, errors: {} };
  const errors: Partial<Record<keyof SampleFormValues, { type: string; message: string }>> = {};
  for (const issue of parsed.error.issues) {
    const field = FORM_FIELD[issue.path.join(".")];
    if (field) errors[field] ??= { type: "validation", message: issue.message };
  }
  return { values: {}, errors: errors as FieldErrors<SampleFormValues> };
};
