import type { ReactNode } from "react";

export interface FieldProps {
  /** The id of the control inside; the label points at it. */
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}

/** Ids a control should list in aria-describedby for its hint and error. */
export function describedBy(id: string, hint?: string, error?: string): string | undefined {
  const ids = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean);
  return ids.length ? ids.join(" ") : undefined;
}

/** A labelled form row with an optional hint and an error message tied to the control. */
export function Field({ id, label, hint, error, children }: FieldProps) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-[0.9rem] text-ink-600">
          {hint}
        </p>
      )}
      {children}
      {error && (
        <p id={`${id}-error`} className="font-semibold text-alarm-800">
          {error}
        </p>
      )}
    </div>
  );
}
