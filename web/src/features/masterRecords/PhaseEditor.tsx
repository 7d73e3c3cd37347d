import { useFieldArray } from "react-hook-form";
import { Button } from "../../components/Button";
import { schemaMessage } from "../../components/SchemaField";
import type { Phase } from "../../../../shared/schemas/masterRecords";
import { allStepKeys, newStep, PHASE_TITLES } from "./masterRecordFormValues";
import { builderErrorAt, useMasterRecordForm } from "./masterRecordFormContext";
import { StepEditor } from "./StepEditor";

/** The steps of one phase, in order, with adding, removing and moving them. */
export function PhaseEditor({ phase }: { phase: Phase }) {
  const { control, getValues, formState: { errors } } = useMasterRecordForm();
  const { fields, append, move, remove } = useFieldArray({ control, name: `content.phases.${phase}` });
  const listError = schemaMessage(builderErrorAt(errors, `content.phases.${phase}`));
  return (
    <section aria-labelledby={`phase-${phase}-title`} className="flex flex-col gap-3">
      <h3 id={`phase-${phase}-title`} className="text-xl font-bold">
        {PHASE_TITLES[phase]}
      </h3>
      {listError && <p className="font-semibold text-alarm-800">{listError}</p>}
      {fields.length === 0 && <p className="text-ink-600">No steps in this phase.</p>}
      <ol className="flex flex-col gap-3">
        {fields.map((step, index) => (
          <StepEditor key={step.id} phase={phase} index={index} count={fields.length} idStem={`s-${step.id}`} onMove={move} onRemove={() => remove(index)} />
        ))}
      </ol>
      <Button variant="secondary" className="self-start" onClick={() => append(newStep(phase, allStepKeys(getValues("content.phases"))))}>
        Add a step to {PHASE_TITLES[phase].toLowerCase()}
      </Button>
    </section>
  );
}
