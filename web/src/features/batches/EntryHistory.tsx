import { formatLocal, formatUtc } from "../signatures/signatureTime";
import { recordedValueText } from "./fieldText";
import type { BatchStepView, BatchView, StepEntryView } from "./types";

function EntryValues({ step, entry, replaced, fileName }: { step: BatchStepView; entry: StepEntryView; replaced: boolean; fileName: (id: string) => string | undefined }) {
  return (
    <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
      {step.fields.map((field) => {
        const text = recordedValueText(field, entry.values[field.key], fileName);
        const flagged = entry.outOfLimit.includes(field.key);
        const comment = entry.comments[field.key];
        return (
          <div key={field.key} className="contents">
            <dt className="font-semibold">{field.label}</dt>
            <dd>
              {replaced ? (
                <del className="text-ink-600">
                  <span className="sr-only">replaced value: </span>
                  {text}
                </del>
              ) : (
                <span className="font-semibold">{text}</span>
              )}
              {flagged && (
                <span className="ml-2 inline-flex items-center gap-1 rounded-sm border border-alarm-800 bg-alarm-50 px-1.5 text-[0.85rem] font-semibold text-alarm-800">
                  <span aria-hidden="true">≠</span> outside limits
                </span>
              )}
              {comment && <span className="block text-[0.95rem] text-ink-700">Comment: {comment}</span>}
            </dd>
          </div>
        );
      })}
    </dl>
  );
}

/** Every version of a step's entry, the current one first; replaced values are struck through with who and when. */
export function EntryHistory({ view, step }: { view: BatchView; step: BatchStepView }) {
  if (step.entries.length === 0) return null;
  const fileName = (id: string) => view.attachments.find((a) => a.file.id === id)?.file.name;
  const newestFirst = [...step.entries].reverse();
  return (
    <div className="flex flex-col gap-3">
      <h4 className="text-lg font-bold">Recorded</h4>
      <ol className="flex flex-col gap-3">
        {newestFirst.map((entry, index) => {
          const replaced = index > 0;
          return (
            <li key={entry.id} className={`rounded-md border-2 px-4 py-3 ${replaced ? "border-dashed border-ink-300 bg-ink-50" : "border-ink-200 bg-white"}`}>
              <p className="mb-1 text-[0.95rem]">
                <span className="font-semibold">
                  Version {entry.version}
                  {replaced ? " (replaced by a correction)" : step.entries.length > 1 ? " (current)" : ""}
                </span>{" "}
                — entered by {entry.enteredBy?.name ?? "unknown"}, <time dateTime={entry.enteredAt}>{formatUtc(entry.enteredAt)}</time> ({formatLocal(entry.enteredAt)})
              </p>
              {entry.reason && <p className="mb-1">Reason for the correction: {entry.reason}</p>}
              <EntryValues step={step} entry={entry} replaced={replaced} fileName={fileName} />
            </li>
          );
        })}
      </ol>
    </div>
  );
}
