import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError } from "../api/client";

/**
 * Puts an API error on the form field it names, when that field is one of `fields`.
 * Returns true when it did, so the caller can skip the general error banner.
 */
export function applyServerFieldError<T extends FieldValues>(
  error: unknown,
  fields: readonly Path<T>[],
  setError: UseFormSetError<T>,
): boolean {
  if (!(error instanceof ApiError) || !error.field) return false;
  const field = fields.find((name) => name === error.field);
  if (!field) return false;
  setError(field, { type: "server", message: error.message }, { shouldFocus: true });
  return true;
}

/** A readable message for any thrown value. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return "Something unexpected went wrong. Try again.";
}
