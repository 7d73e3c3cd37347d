import { useForm, useWatch, type Path } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ApiError } from "../../api/client";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { QuantityInput } from "../../components/QuantityInput";
import { SchemaField } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import { planBatch, type PlanModel } from "../../../../shared/planning/batchPlan";
import { BatchPlanSchema, type BatchPlanInput } from "../../../../shared/schemas/campaigns";
import type { MasterRecordContent } from "../../../../shared/schemas/masterRecords";
import type { VesselView } from "../../../../shared/schemas/vessels";
import { PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS, toSI } from "../../../../shared/units";
import { usePlanBatchMutation } from "./mutations";
import { PlanCaution } from "./PlanCaution";
import { PlanResult } from "./PlanResult";

type PlanValues = z.input<typeof BatchPlanSchema>;

const BLANK = undefined as unknown as number;
const NUMBER = { valueAsNumber: true } as const;
const CODE_HINT = "e.g. HF-24-P4.";
const SERVER_FIELDS = ["code", "vesselId", "v0.value", "temperature.value", "pressure.value"] as const;

export interface PlanBatchFormProps {
  campaignId: string;
  vessels: VesselView[];
  model: PlanModel;
  record: Pick<MasterRecordContent, "maxConversion" | "phases">;
  onPlanned: (code: string) => void;
}

function serverPath(error: unknown): (typeof SERVER_FIELDS)[number] | null {
  if (!(error instanceof ApiError) || error.code === "plan-refused") return null;
  if (error.code === "code-taken") return "code";
  const field = error.field?.split(".")[0];
  if (field === "v0" || field === "temperature" || field === "pressure") return `${field}.value`;
  return field === "code" || field === "vesselId" ? field : null;
}

/** Plans one batch: the plan is worked out while the person types, and saving waits until it has no problems. */
export function PlanBatchForm({ campaignId, vessels, model, record, onPlanned }: PlanBatchFormProps) {
  const plan = usePlanBatchMutation();
  const { register, control, handleSubmit, setError, setValue, formState: { errors } } = useForm<PlanValues, unknown, BatchPlanInput>({
    resolver: zodResolver(BatchPlanSchema),
    defaultValues: { code: "", vesselId: "", v0: { value: BLANK, unit: "L" }, temperature: { value: BLANK, unit: "°C" }, pressure: { value: BLANK, unit: "bar(a)" } },
  });
  const [vesselId, v0, temperature, pressure] = useWatch({ control, name: ["vesselId", "v0", "temperature", "pressure"] });
  const vessel = vessels.find((v) => v.id === vesselId);
  const ready = vessel && [v0.value, temperature.value, pressure.value].every((x) => typeof x === "number" && Number.isFinite(x));
  const live = ready ? planBatch({ v0, temperature, pressure } as BatchPlanInput, vessel, model, record) : null;
  const plannedPa = typeof pressure.value === "number" && Number.isFinite(pressure.value) ? toSI(pressure.value, pressure.unit) : Number.NaN;
  const canSave = live !== null && live.problems.length === 0;
  const problemOn = (field: string) => live?.problems.find((p) => p.field === field)?.message;

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { batch } = await plan.mutateAsync({ campaignId, ...values });
      onPlanned(batch.code);
      // The next batch is often planned at the same point: keep the values, clear the code.
      setValue("code", "");
    } catch (error) {
      const path = serverPath(error);
      if (path) setError(path as Path<PlanValues>, { type: "server", message: errorMessage(error) }, { shouldFocus: true });
    }
  });

  const failure = plan.error;
  const quantityError = (name: "v0" | "temperature" | "pressure") => errors[name]?.value?.message ?? errors[name]?.unit?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <PlanCaution vessel={vessel} plannedPa={plannedPa} />
      <div aria-live="assertive">
        {failure && !serverPath(failure) && (
          <Notice tone="error" title={failure instanceof ApiError && failure.code === "plan-refused" ? "The server refused this plan" : "The batch was not planned"}>
            {errorMessage(failure)}
          </Notice>
        )}
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <SchemaField id="plan-code" label="Batch code" hint={CODE_HINT} error={errors.code?.message}>
          <TextInput id="plan-code" autoComplete="off" invalid={Boolean(errors.code)} aria-describedby={describedBy("plan-code", CODE_HINT, errors.code?.message)} {...register("code")} />
        </SchemaField>
        <SchemaField id="plan-vessel" label="Vessel" error={errors.vesselId ? (errors.vesselId.type === "server" ? errors.vesselId.message : "Choose a vessel.") : problemOn("vesselId")}>
          <SelectInput id="plan-vessel" invalid={Boolean(errors.vesselId || problemOn("vesselId"))} aria-describedby={describedBy("plan-vessel", undefined, errors.vesselId?.message ?? problemOn("vesselId"))} {...register("vesselId")}>
            <option value="">Choose a vessel</option>
            {vessels.map((v) => (
              <option key={v.id} value={v.id}>
                {v.tag}
                {v.status === "in-service" ? "" : " (out of service)"}
              </option>
            ))}
          </SelectInput>
        </SchemaField>
        <QuantityInput id="plan-v0" label="Initial volume V0" units={VOLUME_UNITS} error={quantityError("v0") ?? problemOn("v0")} value={register("v0.value", NUMBER)} unit={register("v0.unit")} />
        <QuantityInput id="plan-temperature" label="Temperature" units={TEMPERATURE_UNITS} error={quantityError("temperature") ?? problemOn("temperature")} value={register("temperature.value", NUMBER)} unit={register("temperature.unit")} />
        <QuantityInput id="plan-pressure" label="Pressure" hint="Held constant through the run." units={PRESSURE_UNITS} error={quantityError("pressure") ?? problemOn("pressure")} value={register("pressure.value", NUMBER)} unit={register("pressure.unit")} />
      </div>
      {live && vessel ? (
        <PlanResult plan={live} vessel={vessel} />
      ) : (
        <p className="text-ink-700">Choose a vessel and enter V0, temperature and pressure to see the plan.</p>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={plan.isPending} disabled={!canSave} aria-describedby="plan-save-note">
          Save planned batch
        </Button>
        <p id="plan-save-note" className="text-ink-700">
          {canSave ? "The server checks the plan again before saving." : "Saving is possible once the plan has no problems."}
        </p>
      </div>
    </form>
  );
}
