import { TextInput } from "../../components/TextInput";
import type { FieldDefinition, StepDefinition } from "../../../../shared/schemas/masterRecords";
import { formatNumber } from "../vessels/quantityFormat";

function limitsText(field: Extract<FieldDefinition, { kind: "number" }>): string | null {
  const unit = field.unit ? ` ${field.unit}` : "";
  if (field.low !== null && field.high !== null) return `Limits: ${formatNumber(field.low)} to ${formatNumber(field.high)}${unit}`;
  if (field.low !== null) return `Limit: at least ${formatNumber(field.low)}${unit}`;
  if (field.high !== null) return `Limit: at most ${formatNumber(field.high)}${unit}`;
  return null;
}

function PreviewField({ field, id }: { field: FieldDefinition; id: string }) {
  const label = `${field.label || "(no label yet)"}${field.required ? "" : " (optional)"}`;
  const notes: string[] = [];
  if (field.kind === "number") {
    const limits = limitsText(field);
    if (limits) notes.push(limits);
    if (field.perLitreV0) notes.push("Given per litre of V0: the batch record shows it scaled to the planned V0.");
  }
  const hintId = notes.length ? `${id}-hint` : undefined;
  if (field.kind === "choice") {
    return (
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold">{label}</legend>
        {field.choices.length === 0 && <p className="text-ink-600">No choices yet.</p>}
        {field.choices.map((choice, index) => (
          <label key={`${choice}-${index}`} className="flex min-h-11 items-center gap-3">
            <input type="radio" name={id} className="h-6 w-6 accent-fen-700" />
            {choice}
          </label>
        ))}
      </fieldset>
    );
  }
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hintId && (
        <div id={hintId} className="text-[0.9rem] text-ink-700">
          {notes.map((note) => (
            <p key={note}>{note}</p>
          ))}
        </div>
      )}
      {field.kind === "number" && (
        <div className="flex items-center gap-2">
          <TextInput id={id} inputMode="decimal" aria-describedby={hintId} className="max-w-48" />
          {field.unit && <span className="font-semibold text-ink-700">{field.unit}</span>}
        </div>
      )}
      {field.kind === "text" && <TextInput id={id} autoComplete="off" />}
      {field.kind === "datetime" && <TextInput id={id} type="datetime-local" className="max-w-72" />}
      {field.kind === "attachment" && <TextInput id={id} type="file" className="max-w-96" />}
    </div>
  );
}

/** How an operator will see a step: its instructions and inputs with limits, units and the second-person mark. */
export function OperatorStepPreview({ step, idPrefix, position }: { step: StepDefinition; idPrefix: string; position?: string }) {
  return (
    <article aria-label={`Operator view of ${step.title || "the step"}`} className="flex flex-col gap-3 rounded-lg border-2 border-ink-300 bg-white p-4">
      <header className="flex flex-col gap-1">
        {position && <p className="text-[0.9rem] font-semibold text-ink-600">{position}</p>}
        <h4 className="text-lg font-bold">{step.title || "(no title yet)"}</h4>
        {step.critical && (
          <p className="flex items-center gap-2 font-bold text-caution-800">
            <span aria-hidden="true" className="inline-flex h-6 min-w-6 items-center justify-center rounded-sm bg-caution-400 px-1 text-ink-950">
              2
            </span>
            Critical step: a second person must verify it before the batch goes on.
          </p>
        )}
      </header>
      {step.instructions && <p className="whitespace-pre-wrap">{step.instructions}</p>}
      {step.fields.length === 0 ? (
        <p className="text-ink-600">No entries are asked for in this step.</p>
      ) : (
        step.fields.map((field, index) => <PreviewField key={`${field.key}-${index}`} field={field} id={`${idPrefix}-${index}`} />)
      )}
      <div className="flex flex-wrap gap-3 border-t border-ink-200 pt-3 text-ink-600">
        <span className="inline-flex min-h-11 items-center rounded-md border-2 border-dashed border-ink-300 px-4 font-semibold">
          {step.critical ? "Sign as performed, then ask for verification" : "Sign as performed"}
        </span>
      </div>
    </article>
  );
}
