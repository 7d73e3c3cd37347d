import type { ComponentProps } from "react";

export type SelectInputProps = ComponentProps<"select"> & { invalid?: boolean };

/** A drop-down sized for touch, with the same border and error look as TextInput. */
export function SelectInput({ invalid = false, className = "", children, ...rest }: SelectInputProps) {
  return (
    <select
      aria-invalid={invalid || undefined}
      className={`min-h-11 rounded-md border-2 bg-white px-3 py-1.5 text-ink-950 ${
        invalid ? "border-alarm-800" : "border-ink-400"
      } ${className}`}
      {...rest}
    >
      {children}
    </select>
  );
}
