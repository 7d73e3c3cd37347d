import { useForm, useWatch, type Control } from "react-hook-form";
import { ApiError } from "../../api/client";
import { Caution } from "../../components/Caution";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { QuantityInput } from "../../components/QuantityInput";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { TextArea, TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import { AREA_UNITS, PRESSURE_UNITS, VOLUME_UNITS, toSI } from "../../../../shared/units";
import type { VesselView } from "../../../../shared/schemas/vessels";
import { ReasonField } from "../people/ReasonField";
import { useCreateVesselMutation, useUpdateVesselMutation } from "./mutations";
import { formatNumber } from "./quantityFormat";
import { EMPTY_VESSEL, vesselErrorPath, vesselResolver, vesselToForm, type VesselFormOutput, type VesselFormValues } from "./vesselFormValues";
import { FormActions } from "../../components/FormActions";

const NUMBER = { valueAsNumber: true } as const;
const TAG_HINT = "As painted on the vessel, e.g. R-101.";

/** The vessel caution with the pressures being entered, both in bar(a), and a warning if relief exceeds MAWP. */
function VesselPressureCaution({ control }: { control: Control<VesselFormValues, unknown, VesselFormOutput> }) {
  const [mawp, relief] = useWatch({ control, name: ["mawp", "reliefSetPressure"] });
  const mawpPa = Number.isFinite(mawp.value) ? toSI(mawp.value, mawp.unit) : Number.NaN;
  const reliefPa = Number.isFinite(relief.value) ? toSI(relief.value, relief.unit) : Number.NaN;
  const bar = (pa: number) => (Number.isFinite(pa) ? `${formatNumber(pa / 1e5, 4)} bar(a)` : "not entered");
  return (
    <Caution>
      <p>
        Every batch planned in this vessel is checked against the MAWP and relief set pressure
        entered here. Copy them from the nameplate and the current inspection and relief-valve
        certificates, never from memory, and defer to local pressure-equipment codes and the
        competent person responsible for the vessel.
      </p>
      <p className="mt-1 font-semibold">
        MAWP: {bar(mawpPa)} · Relief set pressure: {bar(reliefPa)}
      </p>
      {reliefPa > mawpPa && (
        <p className="mt-1 font-bold text-alarm-800">The relief set pressure is above the MAWP; it will be refused.</p>
      )}
    </Caution>
  );
}

/** Registers a vessel or, given one, changes it with a reason. Quantities keep the unit typed. */
export function VesselForm({ vessel, onDone, onCancel }: { vessel?: VesselView; onDone: (saved: VesselView) => void; onCancel: () => void }) {
  const editing = Boolean(vessel);
  const create = useCreateVesselMutation();
  const update = useUpdateVesselMutation();
  const current = editing ? update : create;
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<VesselFormValues, unknown, VesselFormOutput>({
    resolver: vesselResolver(editing),
    defaultValues: vessel ? vesselToForm(vessel) : EMPTY_VESSEL,
  });

  const onSubmit = handleSubmit(async (body) => {
    try {
      const saved = vessel
        ? await update.mutateAsync({ ...body, reason: body.reason ?? "", id: vessel.id, revision: vessel.revision })
        : await create.mutateAsync(body);
      onDone(saved.vessel);
    } catch (error) {
      const path = error instanceof ApiError ? (error.code === "tag-taken" ? "tag" : vesselErrorPath(error.field)) : null;
      if (path && error instanceof ApiError) setError(path, { type: "server", message: error.message }, { shouldFocus: true });
    }
  });

  const failure = current.error;
  const onField = failure instanceof ApiError && (failure.code === "tag-taken" || vesselErrorPath(failure.field) !== null);
  const quantityError = (name: "mawp" | "reliefSetPressure" | "minVolume" | "maxVolume" | "boreArea") =>
    errors[name]?.value?.message ?? errors[name]?.unit?.message ?? errors[name]?.message;
  const id = (name: string) => `vessel-${name}`;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <VesselPressureCaution control={control} />
      <div aria-live="assertive">
        {failure && !onField && (
          <Notice tone="error">
            {errorMessage(failure)}
            {failure instanceof ApiError && failure.code === "stale-revision" && " Close this form and open the vessel again."}
          </Notice>
        )}
      </div>
      <SchemaField id={id("tag")} label="Tag" hint={TAG_HINT} error={errors.tag?.message}>
        <TextInput
          id={id("tag")}
          autoComplete="off"
          invalid={Boolean(errors.tag)}
          aria-describedby={describedBy(id("tag"), TAG_HINT, errors.tag?.message)}
          {...register("tag")}
        />
      </SchemaField>
      <SchemaField id={id("description")} label="Description" error={errors.description?.message}>
        <TextArea
          id={id("description")}
          rows={2}
          invalid={Boolean(errors.description)}
          aria-describedby={describedBy(id("description"), undefined, errors.description?.message)}
          {...register("description")}
        />
      </SchemaField>
      <div className="grid gap-4 sm:grid-cols-2">
        <QuantityInput id={id("mawp")} label="MAWP" hint="Maximum allowable working pressure." units={PRESSURE_UNITS} error={quantityError("mawp")} value={register("mawp.value", NUMBER)} unit={register("mawp.unit")} />
        <QuantityInput id={id("relief")} label="Relief set pressure" hint="Must not exceed the MAWP." units={PRESSURE_UNITS} error={quantityError("reliefSetPressure")} value={register("reliefSetPressure.value", NUMBER)} unit={register("reliefSetPressure.unit")} />
        <QuantityInput id={id("min-volume")} label="Rated minimum working volume" units={VOLUME_UNITS} error={quantityError("minVolume")} value={register("minVolume.value", NUMBER)} unit={register("minVolume.unit")} />
        <QuantityInput id={id("max-volume")} label="Rated maximum working volume" units={VOLUME_UNITS} error={quantityError("maxVolume")} value={register("maxVolume.value", NUMBER)} unit={register("maxVolume.unit")} />
        <QuantityInput id={id("bore")} label="Piston bore area" hint="Leave empty if the volume is not read from a piston." units={AREA_UNITS} error={quantityError("boreArea")} value={register("boreArea.value", NUMBER)} unit={register("boreArea.unit")} />
      </div>
      {editing && <ReasonField id={id("reason")} error={schemaMessage(errors.reason?.message)} registration={register("reason")} />}
      <FormActions submitLabel={editing ? "Save changes" : "Register vessel"} busy={current.isPending} onCancel={onCancel} />
    </form>
  );
}
