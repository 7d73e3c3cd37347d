import type { UseFormReturn } from "react-hook-form";
import { NumberField } from "../../components/NumberField";
import { QuantityInput } from "../../components/QuantityInput";
import { PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS } from "../../../../shared/units";
import type { AnalysisFormValues, AnalysisSetup } from "./analysisForm";

type Form = UseFormReturn<AnalysisFormValues, unknown, AnalysisSetup>;
const NUMBER = { valueAsNumber: true } as const;

/** The batch's set conditions, each in the unit the person works in. */
export function ConditionFields({ form }: { form: Form }) {
  const { register, formState } = form;
  const errors = formState.errors;
  const id = (name: string) => `kin-cond-${name}`;
  return (
    <section aria-labelledby="kin-cond-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="kin-cond-title" className="text-xl font-bold">
        3. Batch conditions
      </h2>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <QuantityInput id={id("t")} label="Set temperature" units={TEMPERATURE_UNITS} error={errors.T?.value?.message} value={register("T.value", NUMBER)} unit={register("T.unit")} />
        <QuantityInput id={id("p")} label="Set pressure" hint="Absolute, or gauge with (g)." units={PRESSURE_UNITS} error={errors.P?.value?.message} value={register("P.value", NUMBER)} unit={register("P.unit")} />
        <QuantityInput id={id("v0")} label="Gas volume at the start, V0" hint="Leave empty to take the trace's first volume." units={VOLUME_UNITS} error={errors.V0?.value?.message} value={register("V0.value", NUMBER)} unit={register("V0.unit")} />
        <NumberField id={id("ya0")} label="Mole fraction of A fed, yA0" hint="Gives cA0 = yA0·P/(R·T); needed unless n = 1, and to compare orders." error={errors.yA0?.message} registration={register("yA0", NUMBER)} />
      </div>
    </section>
  );
}
