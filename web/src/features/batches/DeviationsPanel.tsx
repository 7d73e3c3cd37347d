import { useState } from "react";
import { Button } from "../../components/Button";
import { Dialog } from "../../components/Dialog";
import { Notice } from "../../components/Notice";
import { DeviationActions } from "../deviations/DeviationActions";
import { DeviationStatusBadge, SeverityLabel } from "../deviations/DeviationStatusBadge";
import { sourceWords } from "../deviations/deviationWords";
import { formatLocal, formatUtc } from "../signatures/signatureTime";
import { RaiseDeviationForm } from "./RaiseDeviationForm";
import type { BatchView, DeviationOnBatch } from "./types";

const RAISERS = ["operator", "supervisor", "quality", "engineer"];

function DeviationItem({ view, deviation, onMessage }: { view: BatchView; deviation: DeviationOnBatch; onMessage: (tone: "success" | "error", text: string) => void }) {
  const step = deviation.stepKey ? view.steps.find((s) => s.key === deviation.stepKey)?.title : null;
  return (
    <li className={`flex flex-col gap-2 rounded-md border-2 px-4 py-3 ${deviation.status === "closed" ? "border-ink-200" : "border-alarm-800"}`}>
      <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <span className="text-lg font-bold">{deviation.title}</span>
        <DeviationStatusBadge status={deviation.status} />
        <SeverityLabel severity={deviation.severity} />
      </p>
      <p className="whitespace-pre-wrap">{deviation.description}</p>
      <p className="text-[0.95rem] text-ink-700">
        {sourceWords(deviation.source)}
        {deviation.raisedBy && deviation.source === "person" ? ` (${deviation.raisedBy.name})` : ""}, {formatUtc(deviation.raisedAt)} ({formatLocal(deviation.raisedAt)}){step ? ` — step ${step}` : ""}
      </p>
      {deviation.rootCause && (
        <dl className="grid gap-x-4 sm:grid-cols-[max-content_1fr]">
          <dt className="font-semibold">Root cause</dt>
          <dd>{deviation.rootCause}</dd>
          <dt className="font-semibold">Action</dt>
          <dd>{deviation.action}</dd>
          <dt className="font-semibold">Investigated by</dt>
          <dd>
            {deviation.investigatedBy?.name ?? "—"}
            {deviation.coversKinetics ? "; covers the kinetics check" : ""}
          </dd>
          {deviation.closedAt && (
            <>
              <dt className="font-semibold">Closed</dt>
              <dd>
                {deviation.closedBy?.name ?? "—"}, {formatUtc(deviation.closedAt)}
              </dd>
            </>
          )}
        </dl>
      )}
      <div className="flex flex-wrap gap-3">
        <DeviationActions deviation={{ ...deviation, batchId: view.batch.id }} roles={view.facts.roles} batchCode={view.batch.code} onMessage={onMessage} />
      </div>
    </li>
  );
}

/** The batch's deviations, open ones first, and a way to raise one. */
export function DeviationsPanel({ view }: { view: BatchView }) {
  const [raising, setRaising] = useState(false);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const ordered = [...view.deviations].sort((a, b) => Number(a.status === "closed") - Number(b.status === "closed"));
  const openCount = view.deviations.filter((d) => d.status !== "closed").length;
  const canRaise = view.facts.roles.some((r) => RAISERS.includes(r)) && view.batch.state !== "released" && view.batch.state !== "rejected";
  return (
    <section aria-labelledby="deviations-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="deviations-title" className="text-xl font-bold">
          Deviations {openCount > 0 && <span className="text-alarm-800">({openCount} open)</span>}
        </h2>
        {canRaise && (
          <Button variant="secondary" onClick={() => (setMessage(null), setRaising(true))}>
            Raise a deviation
          </Button>
        )}
      </div>
      <div aria-live="polite" className="empty:hidden">
        {message && <Notice tone={message.tone}>{message.text}</Notice>}
      </div>
      {ordered.length === 0 ? (
        <p className="text-ink-600">None raised.</p>
      ) : (
        <ul className="flex flex-col gap-3">
          {ordered.map((d) => (
            <DeviationItem key={d.id} view={view} deviation={d} onMessage={(tone, text) => setMessage({ tone, text })} />
          ))}
        </ul>
      )}
      <Dialog open={raising} title={`Raise a deviation on ${view.batch.code}`} onClose={() => setRaising(false)}>
        {raising && (
          <RaiseDeviationForm
            view={view}
            onCancel={() => setRaising(false)}
            onDone={(title) => {
              setRaising(false);
              setMessage({ tone: "success", text: `Deviation "${title}" is raised; the supervisors are told.` });
            }}
          />
        )}
      </Dialog>
    </section>
  );
}
