import type { UseFormRegisterReturn } from "react-hook-form";
import { describedBy } from "./Field";
import { SchemaField } from "./SchemaField";
import { TextInput } from "./TextInput";

export interface NumberFieldProps {
  id: string;
  label: string;
  hint?: string;
  /** The raw schema message when the value is invalid. */
  error?: string;
  /** A fixed unit written after the box, e.g. "%" or "K". */
  unit?: string;
  registration: UseFormRegisterReturn;
}

/** A labelled number box (decimal keypad on tablets) with an optional fixed unit after it. */
export function NumberField({ id, label, hint, error, unit, registration }: NumberFieldProps) {
  const described = [describedBy(id, hint, error), unit ? `${id}-unit` : null].filter(Boolean).join(" ");
  return (
    <SchemaField id={id} label={label} hint={hint} error={error}>
      <div className="flex items-center gap-2">
        <TextInput
          id={id}
          inputMode="decimal"
          autoComplete="off"
          invalid={Boolean(error)}
          aria-describedby={described || undefined}
          className="max-w-48"
          {...registration}
        />
        {unit && (
          <span id={`${id}-unit`} className="font-semibold text-ink-700">
            {unit}
          </span>
        )}
      </div>
    </SchemaField>
  );
}
