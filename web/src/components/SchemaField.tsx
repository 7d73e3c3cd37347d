import type { ReactNode } from "react";
import { Field } from "./Field";

/**
 * A shared-schema message ("must be a positive number") as a sentence for a field error.
 * The shared schemas word their messages to follow a field name; on screen the label does that.
 * Also used for server messages placed on a field.
 */
export function schemaMessage(message: string | undefined): string | undefined {
  if (!message) return undefined;
  // Server messages start with the field path ("reliefSetPressure: …"); beside the input it is noise.
  const text = message.trim().replace(/^[A-Za-z][\w.]*: /, "");
  const first = text.charAt(0).toUpperCase() + text.slice(1);
  return /[.!?]$/.test(first) ? first : `${first}.`;
}

export interface SchemaFieldProps {
  id: string;
  label: string;
  hint?: string;
  /** The raw message from the form's schema, if the value is invalid. */
  error?: string;
  children: ReactNode;
}

/** A labelled form row whose error comes from a shared zod schema. */
export function SchemaField({ id, label, hint, error, children }: SchemaFieldProps) {
  return (
    <Field id={id} label={label} hint={hint} error={schemaMessage(error)}>
      {children}
    </Field>
  );
}
