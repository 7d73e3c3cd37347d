import { useState, type ReactNode } from "react";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { SignatureDialog } from "../../components/SignatureDialog";
import { SignatureList } from "../../components/SignatureList";
import { EntryForm } from "./EntryForm";
import { EntryHistory } from "./EntryHistory";
import { FieldSummary } from "./FieldSummary";
import { useVerifyStepMutation } from "./mutations";
import { PHASE_STATE, stepAbilities } from "./stepAbilities";
import { StepStatusBadge } from "./StepStatusBadge";
import { TrainingBlock } from "./TrainingBlock";
import { STATE_WORDS } from "./batchStates";
import type { BatchStepView, BatchView } from "./types";

export interface StepCardProps {
  view: BatchView;
  step: BatchStepView;
  /** Shown above the entry form, e.g. the pressurised-vessel caution before pressurising. */
  caution?: ReactNode;
}

type Message = { tone: "success" | "error"; text: string };

function SecondPersonMark() {
  return (
    <p className="flex items-center gap-2 font-bold text-caution-800">
      <span aria-hidden="true" className="inline-flex h-7 min-w-7 items-center justify-center rounded-sm bg-caution-400 px-1 text-ink-950">
        2
      </span>
      Critical step: needs a second person to verify it.
    </p>
  );
}

/** One step of the batch: instructions, fields, what was recorded and signed, and what the viewer may do. */
export function StepCard({ view, step, caution }: StepCardProps) {
  const able = stepAbilities(view, step);
  const verify = useVerifyStepMutation(view.batch.id);
  const [correcting, setCorrecting] = useState(false);
  const [verifying, setVerifying] = useState(false);
  const [message, setMessage] = useState<Message | null>(null);
  const headingId = `step-${step.key}-title`;
  const blockId = `step-${step.key}-training`;
  const blocked = able.trainingBlock !== null;
  const done = (text: string) => {
    setCorrecting(false);
    setMessage({ tone: "success", text });
  };

  return (
    <article aria-labelledby={headingId} className="flex flex-col gap-4 rounded-lg border-2 border-ink-300 bg-white p-5">
      <header className="flex flex-col gap-2">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h3 id={headingId} className="text-xl font-bold">
            {step.title}
          </h3>
          <StepStatusBadge status={step.status} />
        </div>
        {step.critical && <SecondPersonMark />}
      </header>
      {step.instructions && <p className="whitespace-pre-wrap">{step.instructions}</p>}
      <div aria-live="polite" className="empty:hidden">
        {message && <Notice tone={message.tone}>{message.text}</Notice>}
      </div>
      {able.trainingBlock && <TrainingBlock id={blockId} message={able.trainingBlock} />}
      {able.perform && blocked ? (
        <>
          <FieldSummary step={step} v0L={view.batch.v0L} />
          <div className="border-t border-ink-200 pt-3">
            <Button className="min-h-14 px-6 text-lg" disabled aria-describedby={blockId}>
              Sign as performed
            </Button>
          </div>
        </>
      ) : able.perform ? (
        <>
          {caution}
          <EntryForm view={view} step={step} mode="perform" onDone={done} />
        </>
      ) : step.entries.length === 0 ? (
        <>
          {caution}
          <FieldSummary step={step} v0L={view.batch.v0L} />
          <p className="text-ink-700">
            Performed by {able.performedBy} while the batch is {STATE_WORDS[PHASE_STATE[step.phase]].toLowerCase()}.
          </p>
        </>
      ) : null}
      <EntryHistory view={view} step={step} />
      {step.signatures.length > 0 && (
        <div className="flex flex-col gap-2">
          <h4 className="text-lg font-bold">Signatures</h4>
          <SignatureList signatures={step.signatures} />
        </div>
      )}
      {step.status === "awaiting-verification" && !able.verify && (
        <p className="font-semibold text-caution-800">
          {able.ownEntry ? "You entered this step, so a second person must verify it." : "Waits for a supervisor to verify it."}
        </p>
      )}
      {(able.verify || (able.correct && !correcting)) && (
        <div className="flex flex-wrap gap-3 border-t border-ink-200 pt-3">
          {able.verify && (
            <Button className="min-h-14 px-6 text-lg" disabled={blocked} aria-describedby={blocked ? blockId : undefined} onClick={() => (setMessage(null), setVerifying(true))}>
              Verify as second person
            </Button>
          )}
          {able.correct && !correcting && (
            <Button variant="secondary" disabled={blocked} aria-describedby={blocked ? blockId : undefined} onClick={() => (setMessage(null), setCorrecting(true))}>
              Correct this entry
            </Button>
          )}
        </div>
      )}
      {correcting && (
        <section aria-label={`Correct ${step.title}`} className="flex flex-col gap-3 rounded-md border-2 border-fen-700 bg-fen-50 p-4">
          <p>
            A correction adds a new version; the values now recorded stay in the record, struck through, and signatures over them stop matching.
            {step.critical ? " A second person must verify the corrected entry again." : ""}
          </p>
          <EntryForm view={view} step={step} mode="correct" onDone={done} onCancel={() => setCorrecting(false)} />
        </section>
      )}
      <SignatureDialog
        open={verifying}
        meaning="verified"
        subject={`${step.title} — batch ${view.batch.code}, as entered by ${step.entries.at(-1)?.enteredBy?.name ?? "another person"}`}
        sign={({ password, comment }) => verify.mutateAsync({ stepKey: step.key, password, comment })}
        onSigned={() => {
          setVerifying(false);
          setMessage({ tone: "success", text: `${step.title}: verified. The step is complete.` });
        }}
        onLocked={(text) => {
          setVerifying(false);
          setMessage({ tone: "error", text });
        }}
        onClose={() => setVerifying(false)}
      />
    </article>
  );
}
