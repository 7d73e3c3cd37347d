import { useId } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField } from "../../components/SchemaField";
import { TextArea } from "../../components/TextInput";
import { DeviationInvestigateSchema } from "../../../../shared/schemas/batches";
import { errorMessage } from "../../lib/serverFieldErrors";
import { useInvestigateDeviationMutation } from "./mutations";
import { FormActions } from "../../components/FormActions";

type InvestigateValues = z.input<typeof DeviationInvestigateSchema>;

export interface InvestigatedDeviation {
  id: string;
  batchId: string;
  title: string;
  revision: number;
}

/** The supervisor's investigation: root cause, action, and whether it explains the kinetics. */
export function InvestigateForm({ deviation, onDone, onCancel }: { deviation: InvestigatedDeviation; onDone: () => void; onCancel: () => void }) {
  const ids = { cause: useId(), action: useId(), kinetics: useId() };
  const investigate = useInvestigateDeviationMutation();
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<InvestigateValues, unknown, z.output<typeof DeviationInvestigateSchema>>({
    resolver: zodResolver(DeviationInvestigateSchema),
    defaultValues: { rootCause: "", action: "", coversKinetics: false, revision: deviation.revision },
  });
  const onSubmit = handleSubmit((values) => investigate.mutate({ id: deviation.id, batchId: deviation.batchId, ...values }, { onSuccess: onDone }));
  const kineticsHint = "Tick when this deviation explains a trace that left the rate model; once closed it lets the release go ahead despite the kinetics check.";
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <p className="font-semibold">{deviation.title}</p>
      <div aria-live="assertive">{investigate.error && <Notice tone="error">{errorMessage(investigate.error)}</Notice>}</div>
      <SchemaField id={ids.cause} label="Root cause" error={errors.rootCause?.message}>
        <TextArea id={ids.cause} rows={3} invalid={Boolean(errors.rootCause)} aria-describedby={describedBy(ids.cause, undefined, errors.rootCause?.message)} {...register("rootCause")} />
      </SchemaField>
      <SchemaField id={ids.action} label="Action taken or planned" error={errors.action?.message}>
        <TextArea id={ids.action} rows={3} invalid={Boolean(errors.action)} aria-describedby={describedBy(ids.action, undefined, errors.action?.message)} {...register("action")} />
      </SchemaField>
      <div className="flex flex-col gap-1">
        <label htmlFor={ids.kinetics} className="flex min-h-11 items-center gap-3 font-semibold">
          <input id={ids.kinetics} type="checkbox" className="h-6 w-6 accent-fen-700" aria-describedby={`${ids.kinetics}-hint`} {...register("coversKinetics")} />
          Covers the kinetics check
        </label>
        <p id={`${ids.kinetics}-hint`} className="text-[0.9rem] text-ink-600">
          {kineticsHint}
        </p>
      </div>
      <FormActions submitLabel="Record the investigation" busy={investigate.isPending} onCancel={onCancel} />
    </form>
  );
}
