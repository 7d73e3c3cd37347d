import { useId } from "react";

/** A labelled progress bar (0–1) with the percentage written beside it. */
export function ProgressBar({ label, fraction }: { label: string; fraction: number }) {
  const id = useId();
  const pct = Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <div className="flex items-center gap-3">
        <progress id={id} max={100} value={pct} className="h-4 w-full max-w-md accent-fen-700">
          {pct} %
        </progress>
        <span aria-hidden="true" className="w-14 text-right font-semibold tabular-nums">
          {pct} %
        </span>
      </div>
    </div>
  );
}
