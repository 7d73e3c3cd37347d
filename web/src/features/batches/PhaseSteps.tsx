import type { Phase } from "../../../../shared/schemas/masterRecords";
import { PHASE_WORDS } from "./batchStates";
import { StepCard } from "./StepCard";
import { VesselCaution } from "./VesselCaution";
import type { BatchView } from "./types";

function progressWords(view: BatchView, phase: Phase): string {
  const steps = view.steps.filter((s) => s.phase === phase);
  const complete = steps.filter((s) => s.status === "complete").length;
  return steps.length === 0 ? "no steps" : `${complete} of ${steps.length} step${steps.length === 1 ? "" : "s"} complete`;
}

function Steps({ view, phase }: { view: BatchView; phase: Phase }) {
  const steps = view.steps.filter((s) => s.phase === phase);
  if (steps.length === 0) return <p className="text-ink-600">This phase has no steps.</p>;
  return (
    <div className="flex flex-col gap-4">
      {steps.map((step, index) => (
        <StepCard
          key={step.key}
          view={view}
          step={step}
          // Before pressurising: the run phase's first step, until it is performed.
          caution={phase === "run" && index === 0 && step.entries.length === 0 ? <VesselCaution view={view} moment="pressurising" /> : undefined}
        />
      ))}
    </div>
  );
}

/** The phase being executed, open, with its steps. */
export function CurrentPhase({ view, phase }: { view: BatchView; phase: Phase }) {
  return (
    <section aria-labelledby={`phase-${phase}-title`} className="flex flex-col gap-3">
      <h2 id={`phase-${phase}-title`} className="text-2xl font-bold">
        Now: {PHASE_WORDS[phase]} <span className="text-lg font-semibold text-ink-700">— {progressWords(view, phase)}</span>
      </h2>
      <Steps view={view} phase={phase} />
    </section>
  );
}

/** Another phase, folded away until opened. */
export function FoldedPhase({ view, phase }: { view: BatchView; phase: Phase }) {
  return (
    <details className="group rounded-lg border-2 border-ink-200 bg-white">
      <summary className="flex min-h-14 cursor-pointer items-center gap-3 px-5 text-xl font-bold">
        <span aria-hidden="true" className="inline-block w-5 transition-transform group-open:rotate-90">
          ▸
        </span>
        {PHASE_WORDS[phase]} <span className="text-lg font-semibold text-ink-700">— {progressWords(view, phase)}</span>
      </summary>
      <div className="px-5 pb-5">
        <Steps view={view} phase={phase} />
      </div>
    </details>
  );
}
