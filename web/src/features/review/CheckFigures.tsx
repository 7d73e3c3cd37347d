import { Caution } from "../../components/Caution";
import type { AnalysisOutcome } from "../kinetics/runAnalysis";
import { formatUtc } from "../signatures/signatureTime";
import { formatNumber } from "../vessels/quantityFormat";
import type { ReviewCheckView } from "./types";

const mL = (litres: number | null) => (litres === null ? "—" : `${formatNumber(litres * 1000, 4)} mL`);

/** The check's verdict in words with every reason, its key figures, what it ran on, and its notice. */
export function CheckFigures({ check, outcome }: { check: ReviewCheckView; outcome: AnalysisOutcome }) {
  const within = check.verdict === "within";
  const [lo, hi] = check.kObservedCI95;
  return (
    <div className="flex flex-col gap-4">
      <div className={`rounded-lg border-l-8 px-5 py-4 ${within ? "border-ok-800 bg-ok-50 text-ok-800" : "border-alarm-800 bg-alarm-50 text-alarm-800"}`}>
        <h3 className="flex items-center gap-2 text-xl font-bold">
          <span aria-hidden="true">{within ? "✓" : "✕"}</span>
          {within ? "Within the rate model" : "Outside the rate model"}
        </h3>
        <p className="text-ink-950">
          {within ? "The observed rate constant, the fit and the bands agree with the model at this batch's conditions." : `${check.reasons.length} ${check.reasons.length === 1 ? "reason" : "reasons"}:`}
        </p>
        {check.reasons.length > 0 && (
          <ol className="mt-2 list-decimal pl-6 text-ink-950">
            {check.reasons.map((r, i) => (
              <li key={`${i}-${r.code}`} className="mt-1">
                {r.message}
              </li>
            ))}
          </ol>
        )}
      </div>
      <dl className="grid gap-x-6 gap-y-1 rounded-lg border-2 border-ink-200 bg-white p-5 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Observed k</dt>
        <dd className="tabular-nums">
          {formatNumber(check.kObserved, 5)} {outcome.kUnit}
          {lo !== null && hi !== null && ` (95 % interval ${formatNumber(lo, 5)} to ${formatNumber(hi, 5)})`}
        </dd>
        <dt className="font-semibold">Model k at the set temperature</dt>
        <dd className="tabular-nums">
          {formatNumber(check.kModel, 5)} {outcome.kUnit}
        </dd>
        <dt className="font-semibold">Deviation</dt>
        <dd className="tabular-nums">{check.deviationPct === null ? "—" : `${formatNumber(check.deviationPct, 3)} %`}</dd>
        <dt className="font-semibold">Residual RMS of the fit</dt>
        <dd className="tabular-nums">
          {mL(check.residualRms)} (limit {mL(outcome.residualRmsMax)})
        </dd>
        <dt className="font-semibold">Points used</dt>
        <dd className="tabular-nums">{check.points.toLocaleString("en-GB")}</dd>
        <dt className="font-semibold">Highest conversion read from the volume</dt>
        <dd className="tabular-nums">{formatNumber(check.maxConversion, 3)}</dd>
        <dt className="font-semibold">Ran at</dt>
        <dd>{formatUtc(check.ranAt)}</dd>
        <dt className="font-semibold">Kinetics library</dt>
        <dd>version {check.libraryVersion}</dd>
        <dt className="font-semibold">Trace files (SHA-256)</dt>
        <dd>
          <ul>
            {check.traceHashes.map((h) => (
              <li key={h} className="font-mono text-[0.85rem] break-all">
                {h}
              </li>
            ))}
          </ul>
        </dd>
      </dl>
      {outcome.notes.length > 0 && (
        <ul className="list-disc pl-6 text-ink-800">
          {outcome.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
      <Caution title="Caution: this check is an aid to review">
        <p>{check.result.notice}</p>
      </Caution>
    </div>
  );
}
