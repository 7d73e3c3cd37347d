import { get, useFormContext, type FieldErrors } from "react-hook-form";
import type { MasterRecordFormOutput, MasterRecordFormValues } from "./masterRecordFormValues";

/** The master-record builder's form context, typed. */
export function useMasterRecordForm() {
  return useFormContext<MasterRecordFormValues, unknown, MasterRecordFormOutput>();
}

/** The error message at a dotted path (for a list, its own message), if any. */
export function builderErrorAt(errors: FieldErrors<MasterRecordFormValues>, path: string): string | undefined {
  const found = get(errors, path) as { message?: string; root?: { message?: string } } | undefined;
  return found?.message ?? found?.root?.message;
}
