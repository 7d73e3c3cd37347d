import { FormProvider, useForm, type Path } from "react-hook-form";
import { ApiError } from "../../api/client";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { NumberField } from "../../components/NumberField";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { TextArea, TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import { PHASES, type MasterRecordVersionView } from "../../../../shared/schemas/masterRecords";
import { ReasonField } from "../people/ReasonField";
import { masterRecordResolver, type MasterRecordFormMode, type MasterRecordFormOutput, type MasterRecordFormValues } from "./masterRecordFormValues";
import { builderErrorAt } from "./masterRecordFormContext";
import { useCreateMasterRecordMutation, useStartMasterRecordDraftMutation, useUpdateMasterRecordDraftMutation } from "./mutations";
import { PhaseEditor } from "./PhaseEditor";
import { FormActions } from "../../components/FormActions";

export interface MasterRecordFormProps {
  mode: MasterRecordFormMode;
  initial: MasterRecordFormValues;
  recordId?: string;
  draft?: MasterRecordVersionView;
  submitLabel: string;
  onSaved: (version: MasterRecordVersionView) => void;
  onCancel: () => void;
}

const CODE_HINT = "Short and unique, e.g. HF-DMX.";
const NUMBER = { valueAsNumber: true } as const;

function formPathOf(error: unknown): string | null {
  if (!(error instanceof ApiError)) return null;
  if (error.code === "code-taken") return "code";
  return error.field && /^(code|title|reason|content\..+)$/.test(error.field) ? error.field : null;
}

/** The master-record builder: conversions, then the steps of each phase with their fields and live operator preview. */
export function MasterRecordForm({ mode, initial, recordId, draft, submitLabel, onSaved, onCancel }: MasterRecordFormProps) {
  const create = useCreateMasterRecordMutation();
  const start = useStartMasterRecordDraftMutation();
  const update = useUpdateMasterRecordDraftMutation();
  const current = mode === "create" ? create : mode === "draft" ? start : update;
  const form = useForm<MasterRecordFormValues, unknown, MasterRecordFormOutput>({ resolver: masterRecordResolver(mode), defaultValues: initial });
  const { register, handleSubmit, setError, formState: { errors } } = form;

  const onSubmit = handleSubmit(async (output) => {
    try {
      let saved: { version: MasterRecordVersionView };
      if (mode === "create") saved = await create.mutateAsync({ code: output.code ?? "", title: output.title ?? "", content: output.content });
      else if (mode === "draft") saved = await start.mutateAsync({ recordId: recordId ?? "", content: output.content });
      else saved = await update.mutateAsync({ id: draft?.id ?? "", content: output.content, reason: output.reason ?? "", revision: draft?.revision ?? 0 });
      onSaved(saved.version);
    } catch (error) {
      const path = formPathOf(error);
      if (path) setError(path as Path<MasterRecordFormValues>, { type: "server", message: errorMessage(error) }, { shouldFocus: true });
    }
  });

  const failure = current.error;
  const phasesError = schemaMessage(builderErrorAt(errors, "content.phases"));

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
        <div aria-live="assertive">
          {failure && !formPathOf(failure) && (
            <Notice tone="error" title="The draft was not saved">
              {errorMessage(failure)}
            </Notice>
          )}
          {Object.keys(errors).length > 0 && !failure && <Notice tone="error">Some entries need attention; each is marked below.</Notice>}
        </div>
        {mode === "create" && (
          <div className="grid gap-4 sm:grid-cols-[16rem_1fr]">
            <SchemaField id="mr-code" label="Code" hint={CODE_HINT} error={errors.code?.message}>
              <TextInput id="mr-code" autoComplete="off" invalid={Boolean(errors.code)} aria-describedby={describedBy("mr-code", CODE_HINT, errors.code?.message)} {...register("code")} />
            </SchemaField>
            <SchemaField id="mr-title" label="Title" error={errors.title?.message}>
              <TextInput id="mr-title" autoComplete="off" invalid={Boolean(errors.title)} aria-describedby={describedBy("mr-title", undefined, errors.title?.message)} {...register("title")} />
            </SchemaField>
          </div>
        )}
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField id="mr-max-conversion" label="Highest conversion planned for" hint="Sizes the final volume of each batch; 1 means complete conversion." error={errors.content?.maxConversion?.message} registration={register("content.maxConversion", NUMBER)} />
          <NumberField id="mr-target-conversion" label="Conversion at which the run is complete" hint="Above 0, at most the highest conversion." error={errors.content?.targetConversion?.message} registration={register("content.targetConversion", NUMBER)} />
        </div>
        <h2 className="text-2xl font-bold">Steps</h2>
        {phasesError && <p className="font-semibold text-alarm-800">{phasesError}</p>}
        {PHASES.map((phase) => (
          <PhaseEditor key={phase} phase={phase} />
        ))}
        <SchemaField id="mr-notes" label="Notes" error={errors.content?.notes?.message}>
          <TextArea id="mr-notes" rows={3} {...register("content.notes")} />
        </SchemaField>
        {mode === "edit" && <ReasonField id="mr-reason" error={schemaMessage(errors.reason?.message)} registration={register("reason")} />}
        <FormActions submitLabel={submitLabel} busy={current.isPending} onCancel={onCancel} />
      </form>
    </FormProvider>
  );
}
