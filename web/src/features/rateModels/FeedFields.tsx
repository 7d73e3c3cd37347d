import { useFieldArray, useWatch } from "react-hook-form";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { TextInput } from "../../components/TextInput";
import { formatNumber } from "../vessels/quantityFormat";
import { errorAt, useRateModelForm } from "./rateModelFormContext";

/** The feed as species and mole fraction rows, inerts included, with the running sum. */
export function FeedFields() {
  const { control, register, formState: { errors } } = useRateModelForm();
  const { fields, append, remove } = useFieldArray({ control, name: "feed" });
  const feed = useWatch({ control, name: "feed" });
  const sum = feed.reduce((total, row) => total + (Number.isFinite(row.moleFraction) ? row.moleFraction : 0), 0);
  const feedError = schemaMessage(errorAt(errors, "feed"));
  return (
    <fieldset className="flex flex-col gap-3 rounded-md border-2 border-ink-200 p-4">
      <legend className="px-1 text-lg font-bold">Feed (mole fractions)</legend>
      <p className="text-ink-700">List every species charged, inerts such as N2 included. The fractions must sum to 1.</p>
      {feedError && <p className="font-semibold text-alarm-800">{feedError}</p>}
      {fields.map((row, index) => {
        const id = (part: string) => `rm-feed-${index}-${part}`;
        const speciesError = errorAt(errors, `feed.${index}.species`);
        const fractionError = errorAt(errors, `feed.${index}.moleFraction`);
        return (
          <div key={row.id} className="grid items-start gap-3 sm:grid-cols-[1fr_10rem_auto]">
            <SchemaField id={id("species")} label={`Species (feed ${index + 1})`} error={speciesError}>
              <TextInput id={id("species")} autoComplete="off" invalid={Boolean(speciesError)} aria-describedby={describedBy(id("species"), undefined, speciesError)} {...register(`feed.${index}.species`)} />
            </SchemaField>
            <SchemaField id={id("fraction")} label="Mole fraction" error={fractionError}>
              <TextInput id={id("fraction")} inputMode="decimal" autoComplete="off" invalid={Boolean(fractionError)} aria-describedby={describedBy(id("fraction"), undefined, fractionError)} {...register(`feed.${index}.moleFraction`, { valueAsNumber: true })} />
            </SchemaField>
            <Button variant="secondary" className="sm:mt-8" disabled={fields.length === 1} onClick={() => remove(index)}>
              Remove<span className="sr-only"> feed species {index + 1}</span>
            </Button>
          </div>
        );
      })}
      <div className="flex flex-wrap items-center gap-4">
        <Button variant="secondary" onClick={() => append({ species: "", moleFraction: undefined as unknown as number })}>
          Add a feed species
        </Button>
        <p aria-live="polite" className={`font-semibold ${Math.abs(sum - 1) > 1e-6 ? "text-caution-800" : "text-ok-800"}`}>
          Sum: {formatNumber(sum, 6)}
          {Math.abs(sum - 1) > 1e-6 ? " (not 1 yet)" : " ✓"}
        </p>
      </div>
    </fieldset>
  );
}
