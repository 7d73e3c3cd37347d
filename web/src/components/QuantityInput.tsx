import type { UseFormRegisterReturn } from "react-hook-form";
import { describedBy } from "./Field";
import { SchemaField } from "./SchemaField";
import { SelectInput } from "./SelectInput";
import { TextInput } from "./TextInput";

export interface QuantityInputProps {
  id: string;
  label: string;
  hint?: string;
  /** The schema message for the value or the unit, whichever is wrong. */
  error?: string;
  units: readonly string[];
  value: UseFormRegisterReturn;
  unit: UseFormRegisterReturn;
}

/** A number with its unit beside it: the person types in the unit they work in. */
export function QuantityInput({ id, label, hint, error, units, value, unit }: QuantityInputProps) {
  return (
    <SchemaField id={id} label={label} hint={hint} error={error}>
      <div className="flex gap-2">
        <TextInput
          id={id}
          inputMode="decimal"
          autoComplete="off"
          invalid={Boolean(error)}
          aria-describedby={describedBy(id, hint, error)}
          className="max-w-48"
          {...value}
        />
        <SelectInput aria-label={`Unit for ${label}`} {...unit}>
          {units.map((symbol) => (
            <option key={symbol} value={symbol}>
              {symbol}
            </option>
          ))}
        </SelectInput>
      </div>
    </SchemaField>
  );
}
