import type { ReactNode } from "react";
import { Caution } from "../../components/Caution";
import { formatNumber } from "../vessels/quantityFormat";
import type { CheckResponse } from "../../../../shared/schemas/kinetics";

const mL = (litres: number | null) => (litres === null ? "—" : `${formatNumber(litres * 1000, 4)} mL`);

/** The figures of a kinetics check, whether it ran in the browser or on the server. */
export type CheckFigures = Pick<CheckResponse, "kObserved" | "kObservedCI95" | "kModel" | "kUnit" | "deviationPct" | "residualRms" | "points" | "maxConversion"> & {
  /** The model's residual limit, L. */
  residualRmsMax: number;
};

/** The check's key figures as a definition list; `children` adds rows of the caller's own. */
export function CheckFigureList({ figures: f, children }: { figures: CheckFigures; children?: ReactNode }) {
  const [lo, hi] = f.kObservedCI95;
  return (
    <dl className="grid gap-x-6 gap-y-1 rounded-lg border-2 border-ink-200 bg-white p-5 sm:grid-cols-[max-content_1fr]">
      <dt className="font-semibold">Observed k</dt>
      <dd className="tabular-nums">
        {formatNumber(f.kObserved, 5)} {f.kUnit}
        {lo !== null && hi !== null && ` (95 % interval ${formatNumber(lo, 5)} to ${formatNumber(hi, 5)})`}
      </dd>
      <dt className="font-semibold">Model k at the set temperature</dt>
      <dd className="tabular-nums">
        {formatNumber(f.kModel, 5)} {f.kUnit}
      </dd>
      <dt className="font-semibold">Deviation</dt>
      <dd className="tabular-nums">{f.deviationPct === null ? "—" : `${formatNumber(f.deviationPct, 3)} %`}</dd>
      <dt className="font-semibold">Residual RMS of the fit</dt>
      <dd className="tabular-nums">
        {mL(f.residualRms)} (limit {mL(f.residualRmsMax)})
      </dd>
      <dt className="font-semibold">Points used</dt>
      <dd className="tabular-nums">{f.points.toLocaleString("en-GB")}</dd>
      <dt className="font-semibold">Highest conversion read from the volume</dt>
      <dd className="tabular-nums">{formatNumber(f.maxConversion, 3)}</dd>
      {children}
    </dl>
  );
}

/** The check's notes (facts that are not reasons) and its standing notice. */
export function CheckNotesAndNotice({ notes, notice }: { notes: string[]; notice: string }) {
  return (
    <>
      {notes.length > 0 && (
        <ul className="list-disc pl-6 text-ink-800">
          {notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
      <Caution title="Caution: this check is an aid to review">
        <p>{notice}</p>
      </Caution>
    </>
  );
}
