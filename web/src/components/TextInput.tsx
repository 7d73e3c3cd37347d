import type { ComponentProps } from "react";

export type TextInputProps = ComponentProps<"input"> & { invalid?: boolean };

/** A text input sized for touch, with a clear border that turns red when invalid. */
export function TextInput({ invalid = false, className = "", ...rest }: TextInputProps) {
  return (
    <input
      aria-invalid={invalid || undefined}
      className={`min-h-11 w-full rounded-md border-2 bg-white px-3 py-1.5 text-ink-950 placeholder:text-ink-500 ${
        invalid ? "border-alarm-800" : "border-ink-400"
      } ${className}`}
      {...rest}
    />
  );
}

export type TextAreaProps = ComponentProps<"textarea"> & { invalid?: boolean };

/** A multi-line text box with the same look as TextInput. */
export function TextArea({ invalid = false, className = "", ...rest }: TextAreaProps) {
  return (
    <textarea
      aria-invalid={invalid || undefined}
      className={`min-h-22 w-full rounded-md border-2 bg-white px-3 py-2 text-ink-950 ${
        invalid ? "border-alarm-800" : "border-ink-400"
      } ${className}`}
      {...rest}
    />
  );
}
