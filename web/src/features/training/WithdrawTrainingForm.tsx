import { useId } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ApiError } from "../../api/client";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import { TrainingWithdrawSchema, type TrainingRecordView } from "../../../../shared/schemas/training";
import { ReasonField } from "../people/ReasonField";
import { useWithdrawTrainingMutation } from "./mutations";
import { FormActions } from "../../components/FormActions";

type FormValues = z.input<typeof TrainingWithdrawSchema>;
const FIELDS = ["reason", "password"] as const;

/** Withdraws one training record with a reason, signed; the person may then no longer act on that version. */
export function WithdrawTrainingForm({ record, onDone, onCancel }: { record: TrainingRecordView; onDone: () => void; onCancel: () => void }) {
  const passwordId = useId();
  const withdraw = useWithdrawTrainingMutation();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FormValues, unknown, z.output<typeof TrainingWithdrawSchema>>({
    resolver: zodResolver(TrainingWithdrawSchema),
    defaultValues: { reason: "", password: "" },
  });

  const onSubmit = handleSubmit((values) => {
    withdraw.mutate(
      { id: record.id, ...values },
      {
        onSuccess: onDone,
        onError: (error) => {
          const field = error instanceof ApiError ? FIELDS.find((f) => f === error.field) : undefined;
          if (field) setError(field, { type: "server", message: error.message }, { shouldFocus: true });
        },
      },
    );
  });
  const failure = withdraw.error;
  const onField = failure instanceof ApiError && FIELDS.some((f) => f === failure.field);
  const passwordError = errors.password?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <p>
        {record.person.name} on {record.masterRecord.code} version {record.masterRecord.version}, valid until {record.validUntil}. Once withdrawn, they may not perform or verify
        its steps until new training is recorded.
      </p>
      <div aria-live="assertive">{failure && !onField && <Notice tone="error">{errorMessage(failure)}</Notice>}</div>
      <ReasonField id="training-withdraw-reason" error={schemaMessage(errors.reason?.message)} registration={register("reason")} />
      <SchemaField id={passwordId} label="Your password" error={passwordError}>
        <TextInput id={passwordId} type="password" autoComplete="current-password" invalid={Boolean(passwordError)} aria-describedby={describedBy(passwordId, undefined, schemaMessage(passwordError))} {...register("password")} />
      </SchemaField>
      <FormActions submitLabel="Sign: training withdrawn" busy={withdraw.isPending} variant="danger" onCancel={onCancel} />
    </form>
  );
}
