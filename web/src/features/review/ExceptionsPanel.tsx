import { useState } from "react";
import { Link } from "react-router";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { SignatureDialog } from "../../components/SignatureDialog";
import { SignatureList } from "../../components/SignatureList";
import type { BatchView } from "../batches/types";
import { EXCEPTION_KIND_WORDS, exceptionDetailLines, notYetReviewableText } from "./exceptionDetail";
import { useMarkReviewedMutation } from "./mutations";
import type { ReviewExceptionView } from "./types";

type Standing = "waiting" | "blocked" | "reviewed";

const standingOf = (e: ReviewExceptionView): Standing => (e.reviewed ? "reviewed" : e.reviewable ? "waiting" : "blocked");
const ORDER: Record<Standing, number> = { waiting: 0, blocked: 1, reviewed: 2 };

/** Words and a shape for where each exception stands, so it never rests on colour. */
const STANDING: Record<Standing, { marker: string; words: string; classes: string }> = {
  waiting: { marker: "○", words: "Waits for review", classes: "border-caution-500 bg-caution-50 text-caution-800" },
  blocked: { marker: "◇", words: "Resolve elsewhere first", classes: "border-alarm-800 bg-alarm-50 text-alarm-800" },
  reviewed: { marker: "✓", words: "Reviewed", classes: "border-ok-800 bg-ok-50 text-ok-800" },
};

export interface ExceptionsPanelProps {
  view: BatchView;
  exceptions: ReviewExceptionView[];
  /** True when this person may sign exceptions off now (quality, batch in review). */
  canReview: boolean;
}

/** What needs a human before release: each exception with its detail, and its "reviewed" signature or the action to give it. */
export function ExceptionsPanel({ view, exceptions, canReview }: ExceptionsPanelProps) {
  const mutation = useMarkReviewedMutation(view.batch.id);
  const [signing, setSigning] = useState<ReviewExceptionView | null>(null);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const sorted = [...exceptions].sort((a, b) => ORDER[standingOf(a)] - ORDER[standingOf(b)]);
  const waiting = exceptions.filter((e) => standingOf(e) === "waiting").length;
  const blocked = exceptions.filter((e) => standingOf(e) === "blocked").length;

  return (
    <section aria-labelledby="exceptions-title" className="flex flex-col gap-4">
      <div>
        <h2 id="exceptions-title" className="text-2xl font-bold">
          Needs a human: review exceptions
        </h2>
        <p className="text-ink-800">
          {exceptions.length === 0
            ? "Nothing in this record was flagged: no value outside its limits, no correction, no late entry, no deviation, and the kinetics check is within the model."
            : `${exceptions.length} flagged; ${waiting} ${waiting === 1 ? "waits" : "wait"} for your review${blocked ? `, ${blocked} must be resolved elsewhere first` : ""}.`}
        </p>
      </div>
      <div aria-live="polite" className="empty:hidden">
        {message && <Notice tone={message.tone}>{message.text}</Notice>}
      </div>
      {sorted.length > 0 && (
        <ol className="flex flex-col gap-3">
          {sorted.map((e) => (
            <ExceptionItem key={e.key} exception={e} view={view} canReview={canReview} onReview={() => { setMessage(null); setSigning(e); }} />
          ))}
        </ol>
      )}
      <SignatureDialog
        open={signing !== null}
        meaning="reviewed"
        subject={signing ? `${signing.title} — batch ${view.batch.code}` : ""}
        sign={(signature) => mutation.mutateAsync({ key: signing?.key ?? "", ...signature })}
        onClose={() => setSigning(null)}
        onLocked={(text) => {
          setSigning(null);
          setMessage({ tone: "error", text });
        }}
        onSigned={() => {
          setMessage({ tone: "success", text: `Marked reviewed: ${signing?.title ?? "the exception"}.` });
          setSigning(null);
        }}
      />
    </section>
  );
}

function ExceptionItem({ exception: e, view, canReview, onReview }: { exception: ReviewExceptionView; view: BatchView; canReview: boolean; onReview: () => void }) {
  const standing = STANDING[standingOf(e)];
  const headingId = `exception-${e.key.replace(/[^a-zA-Z0-9-]/g, "-")}`;
  const step = e.stepKey ? view.steps.find((s) => s.key === e.stepKey) : undefined;
  return (
    <li aria-labelledby={headingId} className={`flex flex-col gap-3 rounded-lg border-2 bg-white p-4 ${e.reviewed ? "border-ink-200" : "border-ink-300"}`}>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <span className={`inline-flex items-center gap-1.5 rounded-sm border px-2 text-[0.85rem] font-semibold whitespace-nowrap ${standing.classes}`}>
          <span aria-hidden="true">{standing.marker}</span>
          {standing.words}
        </span>
        <span className="text-[0.9rem] font-semibold text-ink-700">{EXCEPTION_KIND_WORDS[e.kind]}</span>
      </div>
      <h3 id={headingId} className="text-lg font-bold">
        {e.title}
      </h3>
      <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
        {exceptionDetailLines(e, view).map((line) => (
          <div key={line.label} className="contents">
            <dt className="font-semibold">{line.label}</dt>
            <dd className="break-words">{line.value}</dd>
          </div>
        ))}
      </dl>
      {step && (
        <p>
          <Link to={`/batches/${view.batch.id}#step-${step.key}-title`} className="inline-flex min-h-11 items-center">
            Open step “{step.title}” on the batch page
          </Link>
        </p>
      )}
      {e.kind === "deviation" && (
        <p>
          <Link to={`/batches/${view.batch.id}#deviations-title`} className="inline-flex min-h-11 items-center">
            Open the batch's deviations
          </Link>
        </p>
      )}
      {e.reviewed && <SignatureList signatures={[e.reviewed]} />}
      {!e.reviewed && !e.reviewable && <p className="font-semibold">{notYetReviewableText(e)}</p>}
      {!e.reviewed && e.reviewable && canReview && (
        <div>
          <Button onClick={onReview} aria-describedby={headingId}>
            Mark reviewed
          </Button>
        </div>
      )}
    </li>
  );
}
