import { get, useFormContext, type FieldErrors } from "react-hook-form";
import type { RateModelFormOutput, RateModelFormValues } from "./rateModelFormValues";

/** The rate-model form's context, typed. */
export function useRateModelForm() {
  return useFormContext<RateModelFormValues, unknown, RateModelFormOutput>();
}

/** The error message at a dotted path (for an array, its own message), if any. */
export function errorAt(errors: FieldErrors<RateModelFormValues>, path: string): string | undefined {
  const found = get(errors, path) as { message?: string; root?: { message?: string } } | undefined;
  return found?.message ?? found?.root?.message;
}
