import { useFieldArray, useWatch } from "react-hook-form";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { TextArea, TextInput } from "../../components/TextInput";
import type { Phase } from "../../../../shared/schemas/masterRecords";
import { FieldEditor } from "./FieldEditor";
import { newField, PHASE_TITLES, rowToStep } from "./masterRecordFormValues";
import { builderErrorAt, useMasterRecordForm } from "./masterRecordFormContext";
import { MoveButtons } from "./MoveButtons";
import { OperatorStepPreview } from "./OperatorStepPreview";

export interface StepEditorProps {
  phase: Phase;
  index: number;
  count: number;
  idStem: string;
  onMove: (from: number, to: number) => void;
  onRemove: () => void;
}

/** One step: its key, title, instructions, critical mark and fields, beside the operator's live view of it. */
export function StepEditor({ phase, index, count, idStem, onMove, onRemove }: StepEditorProps) {
  const { control, register, formState: { errors } } = useMasterRecordForm();
  const base = `content.phases.${phase}.${index}` as const;
  const { fields, append, move, remove } = useFieldArray({ control, name: `${base}.fields` });
  const step = useWatch({ control, name: base });
  const err = (part: string) => builderErrorAt(errors, `${base}.${part}`);
  const id = (part: string) => `${idStem}-${part}`;
  const heading = `${PHASE_TITLES[phase]} step ${index + 1}${step.title ? `: ${step.title}` : ""}`;
  const fieldsError = schemaMessage(err("fields"));

  return (
    <li className="rounded-lg border-2 border-ink-300 bg-white">
      <details open className="group">
        <summary className="flex min-h-11 cursor-pointer flex-wrap items-center gap-3 px-4 py-2 font-bold">
          <span>{heading}</span>
          {step.critical && <span className="rounded-sm border border-caution-500 bg-caution-50 px-2 text-[0.85rem] text-caution-800">Critical</span>}
          <span className="font-normal text-ink-600">
            {step.fields.length} {step.fields.length === 1 ? "field" : "fields"}
          </span>
        </summary>
        <div className="grid gap-4 border-t-2 border-ink-200 p-4 2xl:grid-cols-[3fr_2fr]">
          <div className="flex flex-col gap-3">
            <MoveButtons what={`step ${index + 1}${step.title ? ` ${step.title}` : ""}`} index={index} count={count} idStem={idStem} onMove={onMove} onRemove={onRemove} />
            <div className="grid gap-3 sm:grid-cols-[1fr_14rem]">
              <SchemaField id={id("title")} label="Step title" error={err("title")}>
                <TextInput id={id("title")} autoComplete="off" invalid={Boolean(err("title"))} aria-describedby={describedBy(id("title"), undefined, err("title"))} {...register(`${base}.title`)} />
              </SchemaField>
              <SchemaField id={id("key")} label="Step key" error={err("key")}>
                <TextInput id={id("key")} autoComplete="off" invalid={Boolean(err("key"))} aria-describedby={describedBy(id("key"), undefined, err("key"))} {...register(`${base}.key`)} />
              </SchemaField>
            </div>
            <SchemaField id={id("instructions")} label="Instructions to the operator" error={err("instructions")}>
              <TextArea id={id("instructions")} rows={3} invalid={Boolean(err("instructions"))} aria-describedby={describedBy(id("instructions"), undefined, err("instructions"))} {...register(`${base}.instructions`)} />
            </SchemaField>
            <label htmlFor={id("critical")} className="flex min-h-11 items-center gap-3 font-semibold">
              <input id={id("critical")} type="checkbox" className="h-6 w-6 accent-fen-700" {...register(`${base}.critical`)} />
              Critical step (a second person verifies it)
            </label>
            <h4 className="font-bold">Fields</h4>
            {fieldsError && <p className="font-semibold text-alarm-800">{fieldsError}</p>}
            <ol className="flex flex-col gap-3">
              {fields.map((field, fieldIndex) => (
                <FieldEditor
                  key={field.id}
                  phase={phase}
                  stepIndex={index}
                  index={fieldIndex}
                  count={fields.length}
                  idStem={`f-${field.id}`}
                  onMove={move}
                  onRemove={() => remove(fieldIndex)}
                />
              ))}
            </ol>
            <Button variant="secondary" className="self-start" onClick={() => append(newField(step.fields.map((f) => f.key)))}>
              Add a field<span className="sr-only"> to step {index + 1}</span>
            </Button>
          </div>
          <div className="flex flex-col gap-2">
            <h4 className="font-bold">Operator preview</h4>
            <OperatorStepPreview step={rowToStep(step)} idPrefix={`${idStem}-preview`} position={`${PHASE_TITLES[phase]} · step ${index + 1}`} />
          </div>
        </div>
      </details>
    </li>
  );
}
