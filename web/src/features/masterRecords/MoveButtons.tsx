import { Button } from "../../components/Button";

export interface MoveButtonsProps {
  /** What is moved, for screen readers, e.g. "step Charge DMX". */
  what: string;
  index: number;
  count: number;
  /** The DOM id stem; the buttons are `${idStem}-up`, `-down` and `-remove`. */
  idStem: string;
  onMove: (from: number, to: number) => void;
  onRemove: () => void;
}

/** Move up, move down and remove, as plain buttons so the order can be changed from the keyboard. */
export function MoveButtons({ what, index, count, idStem, onMove, onRemove }: MoveButtonsProps) {
  // Keep focus on the same button after the move, so repeated presses keep moving the item.
  const move = (to: number, button: "up" | "down") => {
    onMove(index, to);
    requestAnimationFrame(() => {
      const same = document.getElementById(`${idStem}-${button}`);
      const other = document.getElementById(`${idStem}-${button === "up" ? "down" : "up"}`);
      (same && !same.hasAttribute("disabled") ? same : other)?.focus();
    });
  };
  return (
    <div className="flex flex-wrap gap-2">
      <Button id={`${idStem}-up`} variant="secondary" disabled={index === 0} onClick={() => move(index - 1, "up")}>
        <span aria-hidden="true">↑</span> Move up<span className="sr-only"> {what}</span>
      </Button>
      <Button id={`${idStem}-down`} variant="secondary" disabled={index === count - 1} onClick={() => move(index + 1, "down")}>
        <span aria-hidden="true">↓</span> Move down<span className="sr-only"> {what}</span>
      </Button>
      <Button id={`${idStem}-remove`} variant="secondary" onClick={onRemove}>
        Remove<span className="sr-only"> {what}</span>
      </Button>
    </div>
  );
}
