import type { UseFormReturn } from "react-hook-form";
import { NumberField } from "../../components/NumberField";
import { QuantityInput } from "../../components/QuantityInput";
import { SchemaField } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TEMPERATURE_UNITS, convertUnit, type TemperatureUnit } from "../../../../shared/units";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { MANUAL_MODEL, applyVersion, type AnalysisFormValues, type AnalysisSetup } from "./analysisForm";

type Form = UseFormReturn<AnalysisFormValues, unknown, AnalysisSetup>;
const NUMBER = { valueAsNumber: true } as const;

/**
 * The rate model to check against: an approved version, or (for engineers and quality)
 * values typed in. People who may not type one in see the approved version's values only.
 */
export function ModelFields({ form, approved, mayType }: { form: Form; approved: RateModelVersionView[]; mayType: boolean }) {
  const { register, setValue, getValues, watch, formState } = form;
  const errors = formState.errors;
  const source = watch("modelSource");
  const locked = !mayType || source !== MANUAL_MODEL;
  const pick = (id: string) => {
    const version = approved.find((v) => v.id === id);
    if (version) applyVersion(form, version);
    else setValue("modelSource", id);
  };
  const fixed = (registration: ReturnType<typeof register>) => ({ ...registration, readOnly: locked });
  const id = (name: string) => `kin-model-${name}`;
  // A read-only temperature keeps its meaning when its unit is switched: the value is converted.
  const tRefUnit = register("TRef.unit");
  const tRefUnitConverting = {
    ...tRefUnit,
    onChange: async (event: { target: { value: string } }) => {
      const before = getValues("TRef");
      await tRefUnit.onChange(event);
      if (locked && Number.isFinite(before.value)) {
        setValue("TRef.value", Number(convertUnit(before.value, before.unit, event.target.value as TemperatureUnit).toPrecision(10)));
      }
    },
  };

  return (
    <section aria-labelledby="kin-model-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="kin-model-title" className="text-xl font-bold">
        2. Rate model
      </h2>
      <SchemaField id={id("source")} label="Model" hint={mayType ? "An approved version, or values typed in for a trial." : "Approved versions only; the values cannot be changed here."}>
        <SelectInput id={id("source")} value={source} onChange={(event) => pick(event.target.value)} aria-describedby={`${id("source")}-hint`} className="max-w-xl">
          {mayType && <option value={MANUAL_MODEL}>Typed in below (not an approved model)</option>}
          {!mayType && approved.length === 0 && <option value={MANUAL_MODEL}>No approved rate model yet</option>}
          {approved.map((v) => (
            <option key={v.id} value={v.id}>
              {v.code} version {v.version} (approved) — {v.title}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
      {locked && source !== MANUAL_MODEL && <p className="text-ink-700">Values from the approved version; shown read-only.</p>}
      <div className={`grid gap-4 sm:grid-cols-2 lg:grid-cols-3 ${locked ? "[&_input:read-only]:border-ink-300 [&_input:read-only]:bg-ink-100" : ""}`}>
        <NumberField id={id("order")} label="Order n" error={errors.order?.message} registration={fixed(register("order", NUMBER))} />
        <NumberField id={id("kref")} label="k at the reference temperature" hint="In (mol/L)^(1−n)/s; 1/s for n = 1." error={errors.kRef?.message} registration={fixed(register("kRef", NUMBER))} />
        <QuantityInput id={id("tref")} label="Reference temperature" units={TEMPERATURE_UNITS} error={errors.TRef?.value?.message} value={fixed(register("TRef.value", NUMBER))} unit={tRefUnitConverting} />
        <NumberField id={id("ea")} label="Activation energy Ea" unit="kJ/mol" error={errors.EaKJPerMol?.message} registration={fixed(register("EaKJPerMol", NUMBER))} />
        <NumberField id={id("eps")} label="εA" hint="Fractional volume change at full conversion." error={errors.epsilonA?.message} registration={fixed(register("epsilonA", NUMBER))} />
        <NumberField id={id("tol")} label="Tolerance on k" unit="%" error={errors.tolerancePct?.message} registration={fixed(register("tolerancePct", NUMBER))} />
        <NumberField id={id("rms")} label="Residual RMS limit" unit="% of V0" error={errors.residualPctOfV0?.message} registration={fixed(register("residualPctOfV0", NUMBER))} />
        <NumberField id={id("tband")} label="Temperature band" unit="± K" error={errors.temperatureBandK?.message} registration={fixed(register("temperatureBandK", NUMBER))} />
        <NumberField id={id("pband")} label="Pressure band" unit="± %" error={errors.pressureBandPct?.message} registration={fixed(register("pressureBandPct", NUMBER))} />
      </div>
    </section>
  );
}
