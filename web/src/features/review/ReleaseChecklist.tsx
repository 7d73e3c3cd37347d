import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Notice } from "../../components/Notice";
import { SignatureList } from "../../components/SignatureList";
import { Button } from "../../components/Button";
import { EntryForm } from "../batches/EntryForm";
import { TrainingBlock } from "../batches/TrainingBlock";
import { recordedValueText } from "../batches/fieldText";
import type { BatchStepView, BatchView } from "../batches/types";
import { reviewKey } from "./queries";

/** The release phase's own steps (quality's checklist): recorded with their signatures, or the form to perform them. */
export function ReleaseChecklist({ view, canPerform }: { view: BatchView; canPerform: boolean }) {
  const steps = view.steps.filter((s) => s.phase === "release");
  const queryClient = useQueryClient();
  const [done, setDone] = useState<string | null>(null);
  if (steps.length === 0) return null;
  return (
    <div className="flex flex-col gap-4">
      <div aria-live="polite" className="empty:hidden">
        {done && <Notice tone="success">{done}</Notice>}
      </div>
      {steps.map((step) => (
        <div key={step.key} className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-4">
          <h3 className="text-xl font-bold">{step.title}</h3>
          <p className="text-ink-800">{step.instructions}</p>
          {step.status === "not-started" && canPerform && !view.training.current && (
            <>
              <TrainingBlock id={`release-${step.key}-training`} message={view.training.message ?? "Your training on this master record version is not current."} />
              <div>
                <Button className="min-h-14 px-6 text-lg" disabled aria-describedby={`release-${step.key}-training`}>
                  Sign as performed
                </Button>
              </div>
            </>
          )}
          {step.status === "not-started" &&
            (canPerform && view.training.current ? (
              <EntryForm
                view={view}
                step={step}
                mode="perform"
                onDone={(text) => {
                  setDone(text);
                  void queryClient.invalidateQueries({ queryKey: reviewKey(view.batch.id) });
                }}
              />
            ) : canPerform ? null : (
              <p className="font-semibold">Not performed yet. Quality performs it while the batch is in review.</p>
            ))}
          {step.status !== "not-started" && <RecordedStep step={step} />}
        </div>
      ))}
    </div>
  );
}

function RecordedStep({ step }: { step: BatchStepView }) {
  const entry = step.entries.at(-1);
  return (
    <>
      {entry && (
        <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
          {step.fields.map((field) => (
            <div key={field.key} className="contents">
              <dt className="font-semibold">{field.label}</dt>
              <dd>{recordedValueText(field, entry.values[field.key])}</dd>
            </div>
          ))}
        </dl>
      )}
      {step.status === "awaiting-verification" && <p className="font-semibold">Waits for a second person to verify it on the batch page.</p>}
      <SignatureList signatures={step.signatures} />
    </>
  );
}
