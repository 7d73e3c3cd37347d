import { Link, type LinkProps } from "react-router";

const VARIANT_CLASSES = {
  primary: "bg-fen-700 text-white border-fen-700 hover:bg-fen-800 hover:border-fen-800 hover:text-white",
  secondary: "bg-white text-ink-950 border-ink-400 hover:bg-ink-100 hover:text-ink-950",
} as const;

/** A link that looks like a Button (44 px high), for actions that open another screen. */
export function ButtonLink({ variant = "primary", className = "", ...rest }: LinkProps & { variant?: keyof typeof VARIANT_CLASSES }) {
  return (
    <Link
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-md border-2 px-4 py-1.5 font-semibold leading-tight no-underline transition-colors ${VARIANT_CLASSES[variant]} ${className}`}
      {...rest}
    />
  );
}
