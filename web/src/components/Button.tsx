import type { ComponentProps } from "react";

type Variant = "primary" | "secondary" | "danger" | "quiet";

const VARIANT_CLASSES: Record<Variant, string> = {
  primary: "bg-fen-700 text-white border-fen-700 hover:bg-fen-800 hover:border-fen-800",
  secondary: "bg-white text-ink-950 border-ink-400 hover:bg-ink-100",
  danger: "bg-alarm-800 text-white border-alarm-800 hover:bg-[#851616]",
  quiet: "bg-transparent text-fen-700 border-transparent hover:bg-fen-50 underline underline-offset-2",
};

export type ButtonProps = ComponentProps<"button"> & { variant?: Variant; busy?: boolean };

/** A button at least 44 px high; `busy` disables it and tells assistive tech it is working. */
export function Button({
  variant = "primary",
  busy = false,
  type = "button",
  className = "",
  disabled,
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-md border-2 px-4 py-1.5 font-semibold leading-tight transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${VARIANT_CLASSES[variant]} ${className}`}
      {...rest}
    >
      {children}
    </button>
  );
}
