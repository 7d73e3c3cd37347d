import type { StepStatus } from "./types";

const LOOK: Record<StepStatus, { marker: string; words: string; classes: string }> = {
  "not-started": { marker: "○", words: "Not performed", classes: "border-ink-400 bg-white text-ink-800" },
  "awaiting-verification": { marker: "◐", words: "Performed — waits for a second person", classes: "border-caution-500 bg-caution-50 text-caution-800" },
  complete: { marker: "✓", words: "Complete", classes: "border-ok-800 bg-ok-50 text-ok-800" },
};

/** A step's status in words with a shape beside them. */
export function StepStatusBadge({ status }: { status: StepStatus }) {
  const look = LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-sm border-2 px-2 py-0.5 font-semibold ${look.classes}`}>
      <span aria-hidden="true">{look.marker}</span>
      {look.words}
    </span>
  );
}
