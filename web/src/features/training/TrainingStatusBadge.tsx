import type { TrainingStatus } from "../../../../shared/schemas/training";

const STATUS: Record<TrainingStatus, { words: string; classes: string }> = {
  current: { words: "Current", classes: "border-ok-800 bg-ok-50 text-ok-800" },
  expired: { words: "Expired", classes: "border-alarm-800 bg-alarm-50 text-alarm-800" },
  "not-yet-valid": { words: "Not yet valid", classes: "border-caution-500 bg-caution-50 text-caution-800" },
  withdrawn: { words: "Withdrawn", classes: "border-ink-400 bg-white text-ink-800" },
};

/** How each status reads on screen. */
export const TRAINING_STATUS_WORDS: Record<TrainingStatus, string> = Object.fromEntries(Object.entries(STATUS).map(([k, v]) => [k, v.words])) as Record<TrainingStatus, string>;

/** A training record's status in words inside a tinted box; the word carries the meaning. */
export function TrainingStatusBadge({ status }: { status: TrainingStatus }) {
  const { words, classes } = STATUS[status];
  return <span className={`inline-block rounded-sm border px-2 text-[0.85rem] font-semibold whitespace-nowrap ${classes}`}>{words}</span>;
}
