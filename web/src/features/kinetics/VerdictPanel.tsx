import { forwardRef } from "react";
import { formatNumber } from "../vessels/quantityFormat";
import type { AnalysisOutcome } from "./runAnalysis";
import { CheckFigureList, CheckNotesAndNotice } from "./CheckFigureList";

/** The verdict in words, every reason for it, the key figures and the standing notice. */
export const VerdictPanel = forwardRef<HTMLHeadingElement, { outcome: AnalysisOutcome }>(function VerdictPanel({ outcome }, headingRef) {
  const within = outcome.verdict === "within";
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
      <CheckFigureList figures={{ ...outcome, kObservedCI95: outcome.kObservedCI95 }}>
        <dt className="font-semibold">V0 used</dt>
        <dd className="tabular-nums">{formatNumber(outcome.V0, 6)} L</dd>
      </CheckFigureList>
      <CheckNotesAndNotice notes={outcome.notes} notice={outcome.notice} />
    </section>
  );
});
