import { rateConstantUnit } from "../../../../shared/schemas/rateModels";
import { DEVIATION_STATUS_WORDS } from "../deviations/deviationWords";
import { recordedValueText, limitsAtScaleText } from "../batches/fieldText";
import type { BatchFieldView, BatchStepView, BatchView } from "../batches/types";
import { MEANING_WORDS } from "../signatures/meaningWords";
import { formatLocal, formatUtc } from "../signatures/signatureTime";
import { formatNumber } from "../vessels/quantityFormat";
import type { ExceptionKind, ReviewExceptionView } from "./types";

/** One line of an exception's detail: what it is, and the value in words. */
export interface DetailLine {
  label: string;
  value: string;
}

/** A short name for each kind of exception, shown beside its title. */
export const EXCEPTION_KIND_WORDS: Record<ExceptionKind, string> = {
  "out-of-limit": "Value outside its limits",
  correction: "Corrected entry",
  "late-entry": "Late entry",
  "signature-mismatch": "Signature matches no entry",
  deviation: "Deviation",
  "kinetics-outside": "Kinetics outside the model",
  "kinetics-not-run": "Kinetics check missing",
  "attachment-hash": "Attachment changed",
};

const text = (v: unknown) => (typeof v === "string" ? v : "");
const when = (iso: unknown) => (typeof iso === "string" && iso ? `${formatUtc(iso)} (${formatLocal(iso)})` : "—");
const plainValue = (v: unknown) => (v === undefined || v === null || v === "" ? "—" : typeof v === "number" ? formatNumber(v) : String(v));

function entryOf(view: BatchView, stepKey: string | null, entryId: unknown): { step?: BatchStepView; entry?: BatchStepView["entries"][number] } {
  const step = view.steps.find((s) => s.key === stepKey);
  return { step, entry: step?.entries.find((e) => e.id === entryId) };
}

function valueOf(field: BatchFieldView | undefined, value: unknown, view: BatchView): string {
  if (!field) return plainValue(value);
  return recordedValueText(field, value, (id) => view.attachments.find((a) => a.file.id === id)?.file.name);
}

function whoAndWhen(entry: BatchStepView["entries"][number] | undefined): DetailLine[] {
  if (!entry) return [];
  return [{ label: "Entered by", value: `${entry.enteredBy?.name ?? "unknown"}, ${when(entry.enteredAt)}` }];
}

function outOfLimit(e: ReviewExceptionView, view: BatchView): DetailLine[] {
  const { step, entry } = entryOf(view, e.stepKey, e.detail.entryId);
  const field = step?.fields.find((f) => f.key === e.detail.field);
  const comment = text(e.detail.comment);
  return [
    { label: "Value recorded", value: valueOf(field, e.detail.value, view) },
    { label: "Limits at this batch's scale", value: (field && limitsAtScaleText(field)) ?? "—" },
    { label: "Comment given with it", value: comment || "None given" },
    { label: "Entry version", value: plainValue(e.detail.version) },
    ...whoAndWhen(entry),
  ];
}

function correction(e: ReviewExceptionView, view: BatchView): DetailLine[] {
  const { step, entry } = entryOf(view, e.stepKey, e.detail.entryId);
  const before = (e.detail.oldValues ?? {}) as Record<string, unknown>;
  const after = (e.detail.newValues ?? {}) as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
  const changed = keys.filter((k) => JSON.stringify(before[k]) !== JSON.stringify(after[k]));
  const lines: DetailLine[] = changed.map((k) => {
    const field = step?.fields.find((f) => f.key === k);
    return { label: field?.label ?? k, value: `${valueOf(field, before[k], view)} → ${valueOf(field, after[k], view)}` };
  });
  if (changed.length === 0) lines.push({ label: "Values", value: "No value changed (the comments may have)" });
  return [...lines, { label: "Reason for the correction", value: text(e.detail.reason) || "—" }, { label: "Now at version", value: plainValue(e.detail.version) }, ...whoAndWhen(entry)];
}

function lateEntry(e: ReviewExceptionView, view: BatchView): DetailLine[] {
  const { step, entry } = entryOf(view, e.stepKey, e.detail.entryId);
  const field = step?.fields.find((f) => f.key === e.detail.field);
  const recorded = new Date(text(e.detail.recordedTime)).getTime();
  const entered = new Date(text(e.detail.enteredAt)).getTime();
  const lag = Number.isFinite(recorded) && Number.isFinite(entered) ? Math.round((entered - recorded) / 60_000) : null;
  return [
    { label: field ? `${field.label} (the time recorded)` : "Time recorded", value: when(e.detail.recordedTime) },
    { label: "Entered at", value: when(e.detail.enteredAt) },
    { label: "Entered late by", value: lag === null ? "—" : `${lag} min` },
    ...whoAndWhen(entry),
  ];
}

function deviation(e: ReviewExceptionView, view: BatchView): DetailLine[] {
  const d = view.deviations.find((x) => x.id === e.detail.deviationId);
  const status = text(e.detail.status) as keyof typeof DEVIATION_STATUS_WORDS;
  const lines: DetailLine[] = [{ label: "Status", value: DEVIATION_STATUS_WORDS[status] ?? status }];
  if (d) lines.push({ label: "Raised", value: `${d.raisedBy?.name ?? "by the system"}, ${when(d.raisedAt)}` });
  lines.push({ label: "Root cause", value: text(e.detail.rootCause) || "Not investigated yet" }, { label: "Action", value: text(e.detail.action) || "—" });
  if (d?.coversKinetics) lines.push({ label: "Kinetics result", value: "Covered by this deviation once it is closed" });
  return lines;
}

function signatureMismatch(e: ReviewExceptionView): DetailLine[] {
  const meaning = text(e.detail.meaning) as keyof typeof MEANING_WORDS;
  return [
    { label: "Signed by", value: text(e.detail.signer) || "—" },
    { label: "Meaning", value: MEANING_WORDS[meaning] ?? meaning },
    { label: "Signed at", value: when(e.detail.signedAt) },
  ];
}

/** The detail of one review exception as lines to read, with the step's labels and units. */
export function exceptionDetailLines(e: ReviewExceptionView, view: BatchView): DetailLine[] {
  switch (e.kind) {
    case "out-of-limit":
      return outOfLimit(e, view);
    case "correction":
      return correction(e, view);
    case "late-entry":
      return lateEntry(e, view);
    case "deviation":
      return deviation(e, view);
    case "signature-mismatch":
      return signatureMismatch(e);
    case "kinetics-outside":
      return [
        { label: "Observed k", value: `${plainValue(e.detail.kObserved)} ${rateConstantUnit(view.rateModel.content.order)}` },
        { label: "Model k at the set temperature", value: `${plainValue(e.detail.kModel)} ${rateConstantUnit(view.rateModel.content.order)}` },
        { label: "Reasons", value: "Listed with the kinetics check below" },
      ];
    case "kinetics-not-run":
      return [{ label: "Trace files on the batch", value: plainValue(e.detail.traces) }];
    case "attachment-hash":
      return [
        { label: "Recorded SHA-256", value: text(e.detail.expected) || "—" },
        { label: "SHA-256 now", value: text(e.detail.actual) || "—" },
      ];
  }
}

/** What has to happen before an exception that is not reviewable yet can be signed off. */
export function notYetReviewableText(e: ReviewExceptionView): string {
  if (e.kind === "deviation") return "Close the deviation first (investigated by a supervisor, then closed by quality); it can be marked reviewed here after that.";
  return "Run the kinetics check on the current traces first (below); it can be marked reviewed after that.";
}
