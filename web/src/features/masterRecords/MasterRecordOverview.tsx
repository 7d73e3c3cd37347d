import { PHASES, type MasterRecordContent } from "../../../../shared/schemas/masterRecords";
import { formatNumber } from "../vessels/quantityFormat";
import { PHASE_TITLES } from "./masterRecordFormValues";
import { OperatorStepPreview } from "./OperatorStepPreview";

/** A master-record version as operators will meet it: conversions, then each phase's steps in order. */
export function MasterRecordOverview({ content, idPrefix }: { content: MasterRecordContent; idPrefix: string }) {
  return (
    <div className="flex flex-col gap-6">
      <dl className="grid gap-x-6 gap-y-1 rounded-lg border-2 border-ink-200 bg-white p-5 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Highest conversion planned for</dt>
        <dd>{formatNumber(content.maxConversion)}</dd>
        <dt className="font-semibold">Run complete at conversion</dt>
        <dd>{formatNumber(content.targetConversion)}</dd>
        {content.notes && (
          <>
            <dt className="font-semibold">Notes</dt>
            <dd className="whitespace-pre-wrap">{content.notes}</dd>
          </>
        )}
      </dl>
      {PHASES.map((phase) => (
        <section key={phase} aria-labelledby={`${idPrefix}-${phase}`} className="flex flex-col gap-3">
          <h2 id={`${idPrefix}-${phase}`} className="text-xl font-bold">
            {PHASE_TITLES[phase]}
          </h2>
          {content.phases[phase].length === 0 ? (
            <p className="text-ink-600">No steps in this phase.</p>
          ) : (
            <ol className="flex flex-col gap-3">
              {content.phases[phase].map((step, index) => (
                <li key={step.key}>
                  <OperatorStepPreview step={step} idPrefix={`${idPrefix}-${step.key}`} position={`${PHASE_TITLES[phase]} · step ${index + 1} · key ${step.key}`} />
                </li>
              ))}
            </ol>
          )}
        </section>
      ))}
    </div>
  );
}
