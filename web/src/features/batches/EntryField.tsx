import type { UseFormRegister, UseFormSetValue } from "react-hook-form";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextArea, TextInput } from "../../components/TextInput";
import { isoToLocalInput, type EntryFormValues } from "./entryValues";
import { limitsAtScaleText, perLitreNote } from "./fieldText";
import type { AttachmentView, BatchFieldView } from "./types";

export interface EntryFieldProps {
  field: BatchFieldView;
  id: string;
  v0L: number;
  register: UseFormRegister<EntryFormValues>;
  setValue: UseFormSetValue<EntryFormValues>;
  valueError?: string;
  commentError?: string;
  /** The typed number is outside the limits: the value is flagged and a comment is needed. */
  outOfLimit: boolean;
  attachments: AttachmentView[];
}

function OutOfLimitFlag({ id, limits }: { id: string; limits: string | null }) {
  return (
    <p id={id} className="flex items-start gap-2 rounded-md border-2 border-alarm-800 bg-alarm-50 px-3 py-2 font-semibold text-alarm-800">
      <span aria-hidden="true" className="inline-flex h-6 min-w-6 items-center justify-center rounded-sm bg-alarm-800 px-1 text-white">
        ≠
      </span>
      <span>Outside the limits{limits ? ` (${limits})` : ""}. Say why in the comment below before you sign.</span>
    </p>
  );
}

/** One field of a step's entry form, drawn from its definition: unit, limits at scale, and the out-of-limit comment. */
export function EntryField({ field, id, v0L, register, setValue, valueError, commentError, outOfLimit, attachments }: EntryFieldProps) {
  const label = `${field.label}${field.required ? "" : " (optional)"}`;
  const limits = limitsAtScaleText(field);
  const notes = [limits ? `Limits: ${limits}.` : null, perLitreNote(field, v0L)].filter(Boolean).join(" ");
  const hint = notes || undefined;
  const flagId = `${id}-flag`;
  const described = [describedBy(id, hint, valueError), outOfLimit ? flagId : null].filter(Boolean).join(" ") || undefined;
  const registration = register(`values.${field.key}`);

  let control;
  if (field.kind === "choice") {
    return (
      <fieldset className="flex flex-col gap-1" aria-describedby={valueError ? `${id}-error` : undefined}>
        <legend className="font-semibold">{label}</legend>
        {field.choices.map((choice, index) => (
          <label key={choice} className="flex min-h-11 items-center gap-3">
            <input type="radio" value={choice} id={index === 0 ? id : undefined} className="h-6 w-6 accent-fen-700" {...registration} />
            {choice}
          </label>
        ))}
        {valueError && (
          <p id={`${id}-error`} className="font-semibold text-alarm-800">
            {schemaMessage(valueError)}
          </p>
        )}
      </fieldset>
    );
  }
  if (field.kind === "number") {
    control = (
      <div className="flex items-center gap-2">
        <TextInput id={id} inputMode="decimal" autoComplete="off" invalid={Boolean(valueError) || outOfLimit} aria-describedby={described} className="max-w-48" {...registration} />
        {field.unit && <span className="font-semibold text-ink-700">{field.unit}</span>}
      </div>
    );
  } else if (field.kind === "datetime") {
    control = (
      <div className="flex flex-wrap items-center gap-2">
        <TextInput id={id} type="datetime-local" invalid={Boolean(valueError)} aria-describedby={described} className="max-w-72" {...registration} />
        <Button variant="secondary" onClick={() => setValue(`values.${field.key}`, isoToLocalInput(new Date().toISOString()), { shouldValidate: true })}>
          Now<span className="sr-only"> for {field.label}</span>
        </Button>
      </div>
    );
  } else if (field.kind === "attachment") {
    control = (
      <SelectInput id={id} invalid={Boolean(valueError)} aria-describedby={described} className="w-full max-w-xl" {...registration}>
        <option value="">{attachments.length ? "Choose a file attached to this batch" : "No file attached to this batch yet"}</option>
        {attachments.map((a) => (
          <option key={a.id} value={a.file.id}>
            {a.file.name} (SHA-256 {a.file.sha256.slice(0, 12)}…)
          </option>
        ))}
      </SelectInput>
    );
  } else {
    control = <TextInput id={id} autoComplete="off" invalid={Boolean(valueError)} aria-describedby={described} {...registration} />;
  }

  const fieldHint = field.kind === "attachment" ? "Attach the file in the Attachments panel first; then choose it here." : hint;
  const commentId = `${id}-comment`;
  const commentHint = "Required for a value outside its limits. Kept with the entry.";
  const commentMessage = commentError ? `A comment is needed: say why ${field.label} is outside its limits${limits ? ` (${limits})` : ""}.` : undefined;
  return (
    <div className="flex flex-col gap-2">
      <SchemaField id={id} label={label} hint={fieldHint} error={valueError}>
        {control}
      </SchemaField>
      {outOfLimit && <OutOfLimitFlag id={flagId} limits={limits} />}
      {(outOfLimit || commentError) && (
        <SchemaField id={commentId} label={`Comment on ${field.label}`} hint={commentHint} error={commentMessage}>
          <TextArea id={commentId} rows={2} invalid={Boolean(commentError)} aria-describedby={describedBy(commentId, commentHint, commentMessage)} {...register(`comments.${field.key}`)} />
        </SchemaField>
      )}
    </div>
  );
}
