import { useWatch } from "react-hook-form";
import { NumberField } from "../../components/NumberField";
import { QuantityInput } from "../../components/QuantityInput";
import { rateConstantUnit } from "../../../../shared/schemas/rateModels";
import { TEMPERATURE_UNITS, toSI } from "../../../../shared/units";
import { formatNumber } from "../vessels/quantityFormat";
import { errorAt, useRateModelForm } from "./rateModelFormContext";

const NUMBER = { valueAsNumber: true } as const;

/** Order, k at the reference temperature, Arrhenius Ea, and the limits a batch is checked against. */
export function KineticsFields() {
  const { control, register, formState: { errors } } = useRateModelForm();
  const [order, tRef] = useWatch({ control, name: ["order", "TRef"] });
  const kUnit = Number.isFinite(order) && order >= 0 ? rateConstantUnit(order) : "—";
  const kelvin = Number.isFinite(tRef.value) ? toSI(tRef.value, tRef.unit) : Number.NaN;
  const tHint = Number.isFinite(kelvin) ? `= ${formatNumber(kelvin, 7)} K` : "In °C or K.";
  return (
    <>
      <section aria-labelledby="rm-kinetics-title" className="flex flex-col gap-4">
        <h2 id="rm-kinetics-title" className="text-xl font-bold">
          Rate law
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField id="rm-order" label="Order in A" hint="Between 0 and 4." error={errorAt(errors, "order")} registration={register("order", NUMBER)} />
          <NumberField id="rm-k" label="k at the reference temperature" hint={`Unit for this order: ${kUnit}`} unit={kUnit} error={errorAt(errors, "kRef")} registration={register("kRef", NUMBER)} />
          <QuantityInput id="rm-tref" label="Reference temperature" hint={tHint} units={TEMPERATURE_UNITS} error={errorAt(errors, "TRef.value")} value={register("TRef.value", NUMBER)} unit={register("TRef.unit")} />
          <NumberField id="rm-ea" label="Activation energy Ea" unit="kJ/mol" error={errorAt(errors, "EaKJPerMol")} registration={register("EaKJPerMol", NUMBER)} />
        </div>
      </section>
      <section aria-labelledby="rm-acceptance-title" className="flex flex-col gap-4">
        <h2 id="rm-acceptance-title" className="text-xl font-bold">
          Acceptance limits for a batch
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField id="rm-tolerance" label="Allowed deviation of observed k" hint="From the model's k at the batch temperature." unit="± %" error={errorAt(errors, "tolerancePct")} registration={register("tolerancePct", NUMBER)} />
          <NumberField id="rm-residual" label="Largest residual RMS of the fit" hint="As a percentage of V0, so one limit serves every scale." unit="% of V0" error={errorAt(errors, "residualRmsMaxPctOfV0")} registration={register("residualRmsMaxPctOfV0", NUMBER)} />
          <NumberField id="rm-t-band" label="Temperature band" unit="± K" error={errorAt(errors, "temperatureBandK")} registration={register("temperatureBandK", NUMBER)} />
          <NumberField id="rm-p-band" label="Pressure band" unit="± %" error={errorAt(errors, "pressureBandPct")} registration={register("pressureBandPct", NUMBER)} />
        </div>
      </section>
    </>
  );
}
