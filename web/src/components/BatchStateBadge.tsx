import type { BatchState } from "../../../shared/machines/batchMoves";
import { STATE_MARKERS, STATE_TONES, STATE_WORDS, type StateTone } from "../features/batches/batchStates";

const TONE_CLASSES: Record<StateTone, string> = {
  plain: "border-ink-400 bg-white text-ink-800",
  active: "border-fen-700 bg-fen-50 text-fen-900",
  waiting: "border-caution-500 bg-caution-50 text-caution-800",
  done: "border-ok-800 bg-ok-50 text-ok-800",
  stopped: "border-alarm-800 bg-alarm-50 text-alarm-800",
};

/** A batch state in words with a shape beside them; `large` for the batch page header. */
export function BatchStateBadge({ state, large = false }: { state: BatchState; large?: boolean }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-sm border font-semibold whitespace-nowrap ${TONE_CLASSES[STATE_TONES[state]]} ${
        large ? "border-2 px-3 py-0.5 text-lg" : "px-2 text-[0.85rem]"
      }`}
    >
      <span aria-hidden="true">{STATE_MARKERS[state]}</span>
      {STATE_WORDS[state]}
    </span>
  );
}
