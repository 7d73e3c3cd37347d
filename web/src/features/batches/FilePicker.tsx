import type { ComponentProps } from "react";

/** A file chooser sized for touch: the browse button is at least 44 px high. */
export function FilePicker({ className = "", ...rest }: Omit<ComponentProps<"input">, "type">) {
  return (
    <input
      type="file"
      className={`block w-full max-w-xl rounded-md border-2 border-ink-400 bg-white text-ink-950 file:mr-3 file:min-h-11 file:cursor-pointer file:border-0 file:border-r-2 file:border-ink-400 file:bg-ink-100 file:px-4 file:font-semibold ${className}`}
      {...rest}
    />
  );
}
