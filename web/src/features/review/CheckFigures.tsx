import { CheckFigureList, CheckNotesAndNotice } from "../kinetics/CheckFigureList";
import type { AnalysisOutcome } from "../kinetics/runAnalysis";
import { formatUtc } from "../signatures/signatureTime";
import type { ReviewCheckView } from "./types";

/** The check's verdict in words with every reason, its key figures, what it ran on, and its notice. */
export function CheckFigures({ check, outcome }: { check: ReviewCheckView; outcome: AnalysisOutcome }) {
  const within = check.verdict === "within";
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
      <CheckFigureList figures={{ ...check, kUnit: outcome.kUnit, residualRmsMax: outcome.residualRmsMax }}>
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
      </CheckFigureList>
      <CheckNotesAndNotice notes={outcome.notes} notice={check.result.notice} />
    </div>
  );
}
