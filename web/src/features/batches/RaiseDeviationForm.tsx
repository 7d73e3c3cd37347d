import { useId } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextArea, TextInput } from "../../components/TextInput";
import { DEVIATION_SEVERITIES, DeviationRaiseSchema } from "../../../../shared/schemas/batches";
import { applyServerFieldError, errorMessage } from "../../lib/serverFieldErrors";
import { SEVERITY_WORDS } from "../deviations/deviationWords";
import { useRaiseDeviationMutation } from "./mutations";
import type { BatchView } from "./types";
import { FormActions } from "../../components/FormActions";

type RaiseValues = z.input<typeof DeviationRaiseSchema>;

/** Raises a deviation on the batch; the supervisors are told by mail. */
export function RaiseDeviationForm({ view, onDone, onCancel }: { view: BatchView; onDone: (title: string) => void; onCancel: () => void }) {
  const ids = { title: useId(), description: useId(), severity: useId(), step: useId() };
  const raise = useRaiseDeviationMutation(view.batch.id);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<RaiseValues, unknown, z.output<typeof DeviationRaiseSchema>>({
    resolver: zodResolver(DeviationRaiseSchema),
    defaultValues: { title: "", description: "", severity: "minor", stepKey: undefined },
  });
  const onSubmit = handleSubmit((values) =>
    raise.mutate(
      { ...values, stepKey: values.stepKey || undefined },
      {
        onSuccess: () => onDone(values.title),
        onError: (error) => applyServerFieldError<RaiseValues>(error, ["title", "description", "severity", "stepKey"], setError),
      },
    ),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div aria-live="assertive">{raise.error && <Notice tone="error">{errorMessage(raise.error)}</Notice>}</div>
      <SchemaField id={ids.title} label="What happened (short title)" error={errors.title?.message}>
        <TextInput id={ids.title} invalid={Boolean(errors.title)} aria-describedby={describedBy(ids.title, undefined, errors.title?.message)} {...register("title")} />
      </SchemaField>
      <SchemaField id={ids.description} label="Description" error={errors.description?.message}>
        <TextArea id={ids.description} rows={4} invalid={Boolean(errors.description)} aria-describedby={describedBy(ids.description, undefined, errors.description?.message)} {...register("description")} />
      </SchemaField>
      <SchemaField id={ids.severity} label="Severity" error={errors.severity?.message}>
        <SelectInput id={ids.severity} invalid={Boolean(errors.severity)} {...register("severity")}>
          {DEVIATION_SEVERITIES.map((s) => (
            <option key={s} value={s}>
              {SEVERITY_WORDS[s]}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
      <SchemaField id={ids.step} label="Step (optional)" error={errors.stepKey?.message}>
        <SelectInput id={ids.step} className="w-full max-w-xl" {...register("stepKey")}>
          <option value="">Not tied to one step</option>
          {view.steps.map((s) => (
            <option key={s.key} value={s.key}>
              {s.title}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
      <FormActions submitLabel="Raise the deviation" busy={raise.isPending} onCancel={onCancel} />
    </form>
  );
}
