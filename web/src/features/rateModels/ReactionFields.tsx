import { useFieldArray, useWatch } from "react-hook-form";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextInput } from "../../components/TextInput";
import { reactionEquation } from "./reactionEquation";
import { errorAt, useRateModelForm } from "./rateModelFormContext";

const PHASES = [
  { value: "gas", label: "Gas" },
  { value: "liquid", label: "Liquid" },
  { value: "solid", label: "Solid" },
] as const;

function ParticipantList({ side }: { side: "reactants" | "products" }) {
  const { control, register, formState: { errors } } = useRateModelForm();
  const { fields, append, remove } = useFieldArray({ control, name: `reaction.${side}` });
  const noun = side === "reactants" ? "reactant" : "product";
  const listError = schemaMessage(errorAt(errors, `reaction.${side}`));
  return (
    <fieldset className="flex flex-col gap-3 rounded-md border-2 border-ink-200 p-4">
      <legend className="px-1 text-lg font-bold">{side === "reactants" ? "Reactants" : "Products"}</legend>
      {listError && <p className="font-semibold text-alarm-800">{listError}</p>}
      {fields.map((row, index) => {
        const base = `reaction.${side}.${index}` as const;
        const id = (part: string) => `rm-${side}-${index}-${part}`;
        const speciesError = errorAt(errors, `${base}.species`);
        const coefficientError = errorAt(errors, `${base}.coefficient`);
        return (
          <div key={row.id} className="grid items-start gap-3 sm:grid-cols-[minmax(10rem,20rem)_8rem_9rem_auto]">
            <SchemaField id={id("species")} label={`Species (${noun} ${index + 1})`} error={speciesError}>
              <TextInput id={id("species")} autoComplete="off" invalid={Boolean(speciesError)} aria-describedby={describedBy(id("species"), undefined, speciesError)} {...register(`${base}.species`)} />
            </SchemaField>
            <SchemaField id={id("coefficient")} label="Coefficient" error={coefficientError}>
              <TextInput id={id("coefficient")} inputMode="decimal" autoComplete="off" invalid={Boolean(coefficientError)} aria-describedby={describedBy(id("coefficient"), undefined, coefficientError)} {...register(`${base}.coefficient`, { valueAsNumber: true })} />
            </SchemaField>
            <SchemaField id={id("phase")} label="Phase" error={errorAt(errors, `${base}.phase`)}>
              <SelectInput id={id("phase")} {...register(`${base}.phase`)}>
                {PHASES.map((phase) => (
                  <option key={phase.value} value={phase.value}>
                    {phase.label}
                  </option>
                ))}
              </SelectInput>
            </SchemaField>
            <Button variant="secondary" className="sm:mt-8" disabled={fields.length === 1} onClick={() => remove(index)}>
              Remove<span className="sr-only"> {noun} {index + 1}</span>
            </Button>
          </div>
        );
      })}
      <Button variant="secondary" className="self-start" onClick={() => append({ species: "", coefficient: 1, phase: "gas" })}>
        Add a {noun}
      </Button>
    </fieldset>
  );
}

/** The reaction: reactants and products with coefficient and phase, the key species, and the equation as written. */
export function ReactionFields() {
  const { control, register, formState: { errors } } = useRateModelForm();
  const reaction = useWatch({ control, name: "reaction" });
  const keySpecies = useWatch({ control, name: "keySpecies" });
  const names = [...new Set(reaction.reactants.map((r) => r.species.trim()).filter(Boolean))];
  if (keySpecies && !names.includes(keySpecies)) names.push(keySpecies);
  const keyError = errorAt(errors, "keySpecies");
  const hint = "The gas-phase reactant whose conversion the record follows (A).";
  return (
    <section aria-labelledby="rm-reaction-title" className="flex flex-col gap-4">
      <h2 id="rm-reaction-title" className="text-xl font-bold">
        Reaction
      </h2>
      <p className="rounded-md bg-ink-100 px-3 py-2 font-semibold" aria-live="polite">
        {reactionEquation(reaction) || "Enter the species to see the equation."}
      </p>
      <div className="flex flex-col gap-4">
        <ParticipantList side="reactants" />
        <ParticipantList side="products" />
      </div>
      <SchemaField id="rm-key-species" label="Key species" hint={hint} error={keyError}>
        <SelectInput id="rm-key-species" invalid={Boolean(keyError)} aria-describedby={describedBy("rm-key-species", hint, keyError)} className="max-w-64" {...register("keySpecies")}>
          <option value="">Choose a reactant</option>
          {names.map((name) => (
            <option key={name} value={name}>
              {name}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
    </section>
  );
}
