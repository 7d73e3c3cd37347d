import { Button } from "../../components/Button";
import { formatInUnit, formatNumber } from "../vessels/quantityFormat";
import type { CandidateBatch } from "./candidateBatches";

export interface BatchPickerProps {
  candidates: CandidateBatch[];
  chosen: string[];
  onChange: (ids: string[]) => void;
  error?: string;
}

/** Checkboxes for the released batches on this model; the order of `candidates` is kept. */
export function BatchPicker({ candidates, chosen, onChange, error }: BatchPickerProps) {
  const toggle = (id: string, on: boolean) => {
    const next = new Set(chosen);
    if (on) next.add(id);
    else next.delete(id);
    onChange(candidates.filter((c) => next.has(c.id)).map((c) => c.id));
  };
  return (
    <fieldset aria-describedby={error ? "picker-error" : undefined} aria-invalid={error ? true : undefined} className="flex flex-col gap-2">
      <legend className="mb-1 text-lg font-semibold">Released batches to fit from</legend>
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" onClick={() => onChange(candidates.map((c) => c.id))}>
          Choose all {candidates.length}
        </Button>
        <Button variant="secondary" onClick={() => onChange([])} disabled={chosen.length === 0}>
          Clear the choice
        </Button>
      </div>
      <ul className="flex flex-col">
        {candidates.map((c) => (
          <li key={c.id}>
            <label htmlFor={`pick-${c.id}`} className="inline-flex min-h-11 cursor-pointer items-center gap-3">
              <input id={`pick-${c.id}`} type="checkbox" checked={chosen.includes(c.id)} onChange={(e) => toggle(c.id, e.target.checked)} className="h-6 w-6 accent-fen-700" />
              <span>
                <span className="font-semibold">{c.code}</span> — campaign {c.campaignCode}, vessel {c.vesselTag}, V0 {formatNumber(c.v0L, 4)} L
                {c.temperatureK !== null && `, planned at ${formatInUnit(c.temperatureK, "°C", 4)}`}
              </span>
            </label>
          </li>
        ))}
      </ul>
      {error && (
        <p id="picker-error" className="font-semibold text-alarm-800">
          {error}
        </p>
      )}
    </fieldset>
  );
}
