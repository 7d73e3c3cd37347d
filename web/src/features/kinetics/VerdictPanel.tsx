import { forwardRef } from "react";
import { Caution } from "../../components/Caution";
import { formatNumber } from "../vessels/quantityFormat";
import type { AnalysisOutcome } from "./runAnalysis";

const mL = (litres: number | null) => (litres === null ? "—" : `${formatNumber(litres * 1000, 4)} mL`);

/** The verdict in words, every reason for it, the key figures and the standing notice. */
export const VerdictPanel = forwardRef<HTMLHeadingElement, { outcome: AnalysisOutcome }>(function VerdictPanel({ outcome }, headingRef) {
  const within = outcome.verdict === "within";
  const [lo, hi] = outcome.kObservedCI95;
  return (
    <section aria-labelledby="kin-verdict-title" className="flex flex-col gap-4">
      <div
        role="status"
        className={`rounded-lg border-l-8 px-5 py-4 ${within ? "border-ok-800 bg-ok-50 text-ok-800" : "border-alarm-800 bg-alarm-50 text-alarm-800"}`}
      >
        <h2 id="kin-verdict-title" ref={headingRef} tabIndex={-1} className="text-2xl font-bold">
          {within ? "Within the rate model" : "Outside the rate model"}
        </h2>
        <p className="text-ink-950">
          {within
            ? "The observed rate constant, the fit and the bands all agree with the model at these conditions."
            : `${outcome.reasons.length} ${outcome.reasons.length === 1 ? "reason" : "reasons"}, each below.`}{" "}
          Worked out {outcome.where === "browser" ? "in this browser" : "on the server"} by the same kinetics library.
        </p>
        {outcome.reasons.length > 0 && (
          <ol className="mt-2 list-decimal pl-6 text-ink-950">
            {outcome.reasons.map((r, i) => (
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
          {formatNumber(outcome.kObserved, 5)} {outcome.kUnit}
          {lo !== null && hi !== null && ` ± ${((hi - lo) / 2).toPrecision(2)} (95 % interval)`}
        </dd>
        <dt className="font-semibold">Model k at the set temperature</dt>
        <dd className="tabular-nums">
          {formatNumber(outcome.kModel, 5)} {outcome.kUnit}
        </dd>
        <dt className="font-semibold">Deviation</dt>
        <dd className="tabular-nums">{outcome.deviationPct === null ? "—" : `${formatNumber(outcome.deviationPct, 3)} %`}</dd>
        <dt className="font-semibold">Residual RMS of the fit</dt>
        <dd className="tabular-nums">
          {mL(outcome.residualRms)} (limit {mL(outcome.residualRmsMax)})
        </dd>
        <dt className="font-semibold">Points used</dt>
        <dd className="tabular-nums">{outcome.points.toLocaleString("en-GB")}</dd>
        <dt className="font-semibold">Highest conversion read from the volume</dt>
        <dd className="tabular-nums">{formatNumber(outcome.maxConversion, 3)}</dd>
        <dt className="font-semibold">V0 used</dt>
        <dd className="tabular-nums">{formatNumber(outcome.V0, 6)} L</dd>
      </dl>
      {outcome.notes.length > 0 && (
        <ul className="list-disc pl-6 text-ink-800">
          {outcome.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
      <Caution title="Caution: this check is an aid to review">
        <p>{outcome.notice}</p>
      </Caution>
    </section>
  );
});
