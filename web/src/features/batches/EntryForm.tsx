import { useRef, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { ApiError } from "../../api/client";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { SignatureDialog } from "../../components/SignatureDialog";
import { ReasonField } from "../people/ReasonField";
import { schemaMessage } from "../../components/SchemaField";
import { EntryField } from "./EntryField";
import { entryFormDefaults, entryResolver, toEntryInput, type EntryFormValues, type EntryInput } from "./entryValues";
import { typedOutOfLimit } from "./fieldText";
import { useCorrectStepMutation, usePerformStepMutation } from "./mutations";
import type { BatchStepView, BatchView } from "./types";

export interface EntryFormProps {
  view: BatchView;
  step: BatchStepView;
  mode: "perform" | "correct";
  onDone: (message: string) => void;
  onCancel?: () => void;
}

/**
 * A step's entry form, built from its field definitions and validated with the server's own
 * schema; signing it "performed" (password) sends it. A correction also asks for a reason.
 */
export function EntryForm({ view, step, mode, onDone, onCancel }: EntryFormProps) {
  const batchId = view.batch.id;
  const v0L = view.batch.v0L;
  const current = step.entries.at(-1) ?? null;
  const perform = usePerformStepMutation(batchId);
  const correct = useCorrectStepMutation(batchId);
  const [pending, setPending] = useState<EntryInput & { reason: string } | null>(null);
  const formFault = useRef(false);
  const idPrefix = `entry-${step.key}-${mode}`;
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    control,
    formState: { errors },
  } = useForm<EntryFormValues>({
    resolver: entryResolver(step, v0L, mode === "correct"),
    defaultValues: entryFormDefaults(step, mode === "correct" ? current : null),
    reValidateMode: "onChange",
  });
  const typed = useWatch({ control, name: "values" });
  const rootError = errors.root?.server?.message;

  const onSubmit = handleSubmit((form) => setPending({ ...toEntryInput(step, form), reason: form.reason.trim() }));

  const sign = async ({ password }: { password: string }) => {
    if (!pending) return;
    formFault.current = false;
    try {
      if (mode === "perform") await perform.mutateAsync({ stepKey: step.key, values: pending.values, comments: pending.comments, password });
      else await correct.mutateAsync({ stepKey: step.key, values: pending.values, comments: pending.comments, reason: pending.reason, password });
    } catch (error) {
      // A refusal about one of the boxes goes back onto that box; the dialog closes.
      const field = error instanceof ApiError ? error.field : undefined;
      if (field && /^(values|comments)\.[A-Za-z0-9_]+$/.test(field)) {
        formFault.current = true;
        setError(field as `values.${string}`, { type: "server", message: error instanceof ApiError ? error.message.replace(/^[^:]+: /, "") : "" }, { shouldFocus: true });
        return;
      }
      if (error instanceof ApiError && error.field === "reason") {
        formFault.current = true;
        setError("reason", { type: "server", message: error.message.replace(/^[^:]+: /, "") }, { shouldFocus: true });
        return;
      }
      throw error;
    }
  };

  const subject = `${mode === "correct" ? "Correction of " : ""}${step.title} — batch ${view.batch.code}`;

  return (
    <>
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={mode === "correct" ? `Correct ${step.title}` : `Record ${step.title}`}>
      <div aria-live="assertive">{rootError && <Notice tone="error">{rootError}</Notice>}</div>
      {step.fields.map((field) => (
        <EntryField
          key={field.key}
          field={field}
          id={`${idPrefix}-${field.key}`}
          v0L={v0L}
          register={register}
          setValue={setValue}
          valueError={errors.values?.[field.key]?.message}
          commentError={errors.comments?.[field.key]?.message}
          outOfLimit={typedOutOfLimit(field, typed?.[field.key], v0L)}
          attachments={view.attachments}
        />
      ))}
      {mode === "correct" && (
        <ReasonField id={`${idPrefix}-reason`} error={schemaMessage(errors.reason?.message)} registration={register("reason")} />
      )}
      <div className="flex flex-wrap gap-3 border-t border-ink-200 pt-3">
        <Button type="submit" className="min-h-14 px-6 text-lg">
          {mode === "correct" ? "Sign the correction" : step.critical ? "Sign as performed (then a second person verifies)" : "Sign as performed"}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
      <SignatureDialog
        open={pending !== null}
        meaning="performed"
        subject={subject}
        sign={sign}
        onSigned={() => {
          setPending(null);
          if (formFault.current) return;
          onDone(mode === "correct" ? `${step.title}: the correction is recorded and signed.` : `${step.title}: recorded and signed as performed.${step.critical ? " It now waits for a second person to verify it." : ""}`);
        }}
        onLocked={(text) => {
          setPending(null);
          setError("root.server", { type: "server", message: text });
        }}
        onClose={() => setPending(null)}
      />
    </>
  );
}
