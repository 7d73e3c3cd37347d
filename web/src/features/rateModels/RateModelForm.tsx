import { FormProvider, useForm, type Path } from "react-hook-form";
import { ApiError } from "../../api/client";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { TextArea, TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { ReasonField } from "../people/ReasonField";
import { EpsilonPanel } from "./EpsilonPanel";
import { FeedFields } from "./FeedFields";
import { KineticsFields } from "./KineticsFields";
import { useCreateRateModelMutation, useStartRateModelDraftMutation, useUpdateRateModelDraftMutation } from "./mutations";
import { ReactionFields } from "./ReactionFields";
import { contentPathToForm, rateModelResolver, type RateModelFormMode, type RateModelFormOutput, type RateModelFormValues } from "./rateModelFormValues";
import { FormActions } from "../../components/FormActions";

const HINTS = {
  code: "Short and unique, e.g. DMX-CRACK.",
  title: "What the model describes.",
  notes: "Where the values come from, and anything a reviewer should know.",
};

export interface RateModelFormProps {
  mode: RateModelFormMode;
  initial: RateModelFormValues;
  /** The model a new version belongs to (mode "draft"). */
  modelId?: string;
  /** The draft being changed (mode "edit"). */
  draft?: RateModelVersionView;
  submitLabel: string;
  onSaved: (version: RateModelVersionView) => void;
  onCancel: () => void;
}

/** Where an API error about the body belongs on this form, if it names a field. */
function formPathOf(error: unknown, values: RateModelFormValues): string | null {
  if (!(error instanceof ApiError)) return null;
  if (error.code === "code-taken") return "code";
  if (!error.field) return null;
  const [head, ...rest] = error.field.split(".");
  if (head === "content" && rest.length > 0) return contentPathToForm(rest, values);
  return head === "code" || head === "title" || head === "reason" ? head : null;
}

/** The rate-model draft form: identity (new models), reaction, feed with live εA, rate law and limits. */
export function RateModelForm({ mode, initial, modelId, draft, submitLabel, onSaved, onCancel }: RateModelFormProps) {
  const create = useCreateRateModelMutation();
  const start = useStartRateModelDraftMutation();
  const update = useUpdateRateModelDraftMutation();
  const current = mode === "create" ? create : mode === "draft" ? start : update;
  const form = useForm<RateModelFormValues, unknown, RateModelFormOutput>({ resolver: rateModelResolver(mode), defaultValues: initial });
  const { register, handleSubmit, setError, getValues, formState: { errors } } = form;

  const onSubmit = handleSubmit(async (output) => {
    try {
      let saved: { version: RateModelVersionView };
      if (mode === "create") saved = await create.mutateAsync({ code: output.code ?? "", title: output.title ?? "", content: output.content });
      else if (mode === "draft") saved = await start.mutateAsync({ modelId: modelId ?? "", content: output.content });
      else saved = await update.mutateAsync({ id: draft?.id ?? "", content: output.content, reason: output.reason ?? "", revision: draft?.revision ?? 0 });
      onSaved(saved.version);
    } catch (error) {
      const path = formPathOf(error, getValues());
      if (path) setError(path as Path<RateModelFormValues>, { type: "server", message: errorMessage(error) }, { shouldFocus: true });
    }
  });

  const failure = current.error;
  const failureOnField = failure !== null && formPathOf(failure, getValues()) !== null;

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
        <div aria-live="assertive">
          {failure && !failureOnField && (
            <Notice tone="error" title="The draft was not saved">
              {errorMessage(failure)}
            </Notice>
          )}
          {Object.keys(errors).length > 0 && !failure && (
            <Notice tone="error">Some values need attention; each is marked below.</Notice>
          )}
        </div>
        {mode === "create" && (
          <div className="grid gap-4 sm:grid-cols-[16rem_1fr]">
            <SchemaField id="rm-code" label="Code" hint={HINTS.code} error={errors.code?.message}>
              <TextInput id="rm-code" autoComplete="off" invalid={Boolean(errors.code)} aria-describedby={describedBy("rm-code", HINTS.code, errors.code?.message)} {...register("code")} />
            </SchemaField>
            <SchemaField id="rm-title" label="Title" hint={HINTS.title} error={errors.title?.message}>
              <TextInput id="rm-title" autoComplete="off" invalid={Boolean(errors.title)} aria-describedby={describedBy("rm-title", HINTS.title, errors.title?.message)} {...register("title")} />
            </SchemaField>
          </div>
        )}
        <ReactionFields />
        <section aria-labelledby="rm-feed-title" className="flex flex-col gap-4">
          <h2 id="rm-feed-title" className="text-xl font-bold">
            Feed
          </h2>
          <div className="grid items-start gap-4 lg:grid-cols-[3fr_2fr]">
            <FeedFields />
            <EpsilonPanel />
          </div>
        </section>
        <KineticsFields />
        <SchemaField id="rm-notes" label="Notes" hint={HINTS.notes} error={errors.notes?.message}>
          <TextArea id="rm-notes" rows={3} invalid={Boolean(errors.notes)} aria-describedby={describedBy("rm-notes", HINTS.notes, errors.notes?.message)} {...register("notes")} />
        </SchemaField>
        {mode === "edit" && <ReasonField id="rm-reason" error={schemaMessage(errors.reason?.message)} registration={register("reason")} />}
        <FormActions submitLabel={submitLabel} busy={current.isPending} onCancel={onCancel} />
      </form>
    </FormProvider>
  );
}
