import { useQuery } from "@tanstack/react-query";
import { useForm, type Path } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ApiError } from "../../api/client";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import { CampaignCreateSchema, type CampaignCreateInput } from "../../../../shared/schemas/campaigns";
import { masterRecordListQueryOptions } from "../masterRecords/queries";
import { rateModelListQueryOptions } from "../rateModels/queries";
import { formatNumber } from "../vessels/quantityFormat";
import { useCreateCampaignMutation } from "./mutations";
import type { CampaignView } from "./types";
import { FormActions } from "../../components/FormActions";

type CampaignValues = z.input<typeof CampaignCreateSchema>;
const FIELDS = ["code", "process", "masterRecordVersionId", "rateModelVersionId"] as const;
const CODE_HINT = "e.g. HF-24.";

/** Opens a campaign on one approved master-record version and one approved rate-model version (engineer). */
export function CampaignForm({ onDone, onCancel }: { onDone: (campaign: CampaignView) => void; onCancel: () => void }) {
  const models = useQuery(rateModelListQueryOptions());
  const records = useQuery(masterRecordListQueryOptions());
  const create = useCreateCampaignMutation();
  const { register, handleSubmit, setError, formState: { errors } } = useForm<CampaignValues, unknown, CampaignCreateInput>({
    resolver: zodResolver(CampaignCreateSchema),
    defaultValues: { code: "", process: "", masterRecordVersionId: "", rateModelVersionId: "" },
  });
  const approvedModels = (models.data ?? []).filter((v) => v.status === "approved");
  const approvedRecords = (records.data ?? []).filter((v) => v.status === "approved");

  const onSubmit = handleSubmit(async (values) => {
    try {
      onDone((await create.mutateAsync(values)).campaign);
    } catch (error) {
      const field = error instanceof ApiError ? (error.code === "code-taken" ? "code" : FIELDS.find((f) => f === error.field)) : undefined;
      if (field) setError(field as Path<CampaignValues>, { type: "server", message: errorMessage(error) }, { shouldFocus: true });
    }
  });

  const failure = create.error;
  const onField = failure instanceof ApiError && (failure.code === "code-taken" || FIELDS.some((f) => f === failure.field));
  const select = (name: "masterRecordVersionId" | "rateModelVersionId", label: string, options: { id: string; text: string }[], hint: string) => {
    const id = `campaign-${name}`;
    // The schema only knows "must be an id"; say what to do instead. Server refusals are shown as sent.
    const message = errors[name] ? (errors[name]?.type === "server" ? errors[name]?.message : "Choose an approved version.") : undefined;
    return (
      <SchemaField id={id} label={label} hint={hint} error={message}>
        <SelectInput id={id} invalid={Boolean(message)} aria-describedby={describedBy(id, hint, message)} {...register(name)}>
          <option value="">Choose…</option>
          {options.map((o) => (
            <option key={o.id} value={o.id}>
              {o.text}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
    );
  };

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div aria-live="assertive">{failure && !onField && <Notice tone="error">{errorMessage(failure)}</Notice>}</div>
      <SchemaField id="campaign-code" label="Campaign code" hint={CODE_HINT} error={errors.code?.message}>
        <TextInput id="campaign-code" autoComplete="off" invalid={Boolean(errors.code)} aria-describedby={describedBy("campaign-code", CODE_HINT, errors.code?.message)} {...register("code")} />
      </SchemaField>
      <SchemaField id="campaign-process" label="Process" error={errors.process?.message}>
        <TextInput id="campaign-process" autoComplete="off" invalid={Boolean(errors.process)} aria-describedby={describedBy("campaign-process", undefined, errors.process?.message)} {...register("process")} />
      </SchemaField>
      {select(
        "masterRecordVersionId",
        "Master record",
        approvedRecords.map((v) => ({ id: v.id, text: `${v.code} version ${v.version} — ${v.title}` })),
        "Only approved versions can be used.",
      )}
      {select(
        "rateModelVersionId",
        "Rate model",
        approvedModels.map((v) => ({ id: v.id, text: `${v.code} version ${v.version} — εA ${formatNumber(v.derived.epsilonA, 4)}` })),
        "Only approved versions can be used.",
      )}
      <FormActions submitLabel="Open campaign" busy={create.isPending} onCancel={onCancel} />
    </form>
  );
}
