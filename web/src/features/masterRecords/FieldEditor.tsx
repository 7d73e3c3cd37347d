import { useWatch } from "react-hook-form";
import { describedBy } from "../../components/Field";
import { SchemaField } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextArea, TextInput } from "../../components/TextInput";
import { FIELD_KINDS, type Phase } from "../../../../shared/schemas/masterRecords";
import { KIND_LABELS } from "./masterRecordFormValues";
import { builderErrorAt, useMasterRecordForm } from "./masterRecordFormContext";
import { MoveButtons } from "./MoveButtons";

const nullableNumber = { setValueAs: (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v)) };

export interface FieldEditorProps {
  phase: Phase;
  stepIndex: number;
  index: number;
  count: number;
  /** Stable DOM id stem for this field (follows it when it moves). */
  idStem: string;
  onMove: (from: number, to: number) => void;
  onRemove: () => void;
}

function Check({ id, label, registration }: { id: string; label: string; registration: ReturnType<ReturnType<typeof useMasterRecordForm>["register"]> }) {
  return (
    <label htmlFor={id} className="flex min-h-11 items-center gap-3 font-semibold">
      <input id={id} type="checkbox" className="h-6 w-6 accent-fen-700" {...registration} />
      {label}
    </label>
  );
}

/** One field of a step: kind, key, label and the kind's own settings (unit, limits, per-litre, choices). */
export function FieldEditor({ phase, stepIndex, index, count, idStem, onMove, onRemove }: FieldEditorProps) {
  const { control, register, formState: { errors } } = useMasterRecordForm();
  const base = `content.phases.${phase}.${stepIndex}.fields.${index}` as const;
  const [kind, label] = useWatch({ control, name: [`${base}.kind`, `${base}.label`] });
  const err = (part: string) => builderErrorAt(errors, `${base}.${part}`);
  const id = (part: string) => `${idStem}-${part}`;
  const input = (part: "key" | "label" | "unit") => (
    <TextInput id={id(part)} autoComplete="off" invalid={Boolean(err(part))} aria-describedby={describedBy(id(part), undefined, err(part))} {...register(`${base}.${part}`)} />
  );
  const what = `field ${index + 1}${label ? ` ${label}` : ""}`;

  return (
    <li className="flex flex-col gap-3 rounded-md border-2 border-ink-200 bg-ink-50 p-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="font-bold">Field {index + 1}</p>
        <MoveButtons what={what} index={index} count={count} idStem={idStem} onMove={onMove} onRemove={onRemove} />
      </div>
      <div className="grid gap-3 sm:grid-cols-[12rem_1fr_1fr]">
        <SchemaField id={id("kind")} label="Kind" error={err("kind")}>
          <SelectInput id={id("kind")} {...register(`${base}.kind`)}>
            {FIELD_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </SelectInput>
        </SchemaField>
        <SchemaField id={id("label")} label="Label" error={err("label")}>
          {input("label")}
        </SchemaField>
        <SchemaField id={id("key")} label="Key" error={err("key")}>
          {input("key")}
        </SchemaField>
      </div>
      {kind === "number" && (
        <div className="grid gap-3 sm:grid-cols-3">
          <SchemaField id={id("unit")} label="Unit" error={err("unit")}>
            {input("unit")}
          </SchemaField>
          {(["low", "high"] as const).map((limit) => (
            <SchemaField key={limit} id={id(limit)} label={limit === "low" ? "Low limit" : "High limit"} error={err(limit)}>
              <TextInput id={id(limit)} inputMode="decimal" autoComplete="off" invalid={Boolean(err(limit))} aria-describedby={describedBy(id(limit), undefined, err(limit))} {...register(`${base}.${limit}`, nullableNumber)} />
            </SchemaField>
          ))}
        </div>
      )}
      {kind === "choice" && (
        <SchemaField id={id("choices")} label="Choices, one per line" error={err("choices")}>
          <TextArea id={id("choices")} rows={3} invalid={Boolean(err("choices"))} aria-describedby={describedBy(id("choices"), undefined, err("choices"))} {...register(`${base}.choices`)} />
        </SchemaField>
      )}
      <div className="flex flex-wrap gap-x-6">
        <Check id={id("required")} label="Required" registration={register(`${base}.required`)} />
        {kind === "number" && <Check id={id("per-litre")} label="Per litre of V0 (scaled on the batch record)" registration={register(`${base}.perLitreV0`)} />}
      </div>
    </li>
  );
}
