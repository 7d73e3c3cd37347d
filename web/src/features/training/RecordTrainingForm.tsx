import { useId } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery } from "@tanstack/react-query";
import type { z } from "zod";
import { ApiError } from "../../api/client";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField, schemaMessage } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { TextArea, TextInput } from "../../components/TextInput";
import { errorMessage } from "../../lib/serverFieldErrors";
import { TrainingRecordSchema, type TraineeChoice, type TrainingRecordView } from "../../../../shared/schemas/training";
import { masterRecordListQueryOptions } from "../masterRecords/queries";
import { useRecordTrainingMutation } from "./mutations";
import { utcDay } from "../../../../shared/execution/trainingStatus";
import { FormActions } from "../../components/FormActions";

type FormValues = z.input<typeof TrainingRecordSchema>;
const FIELDS = ["personId", "masterRecordVersionId", "trainedOn", "validUntil", "note", "password"] as const;
const todayUtc = () => utcDay(new Date());

/** Records one person's training on one approved master-record version, signed with the recorder's password. */
export function RecordTrainingForm({ people, selfId, onRecorded, onCancel }: { people: TraineeChoice[]; selfId: string; onRecorded: (record: TrainingRecordView) => void; onCancel: () => void }) {
  const ids = { person: useId(), version: useId(), trainedOn: useId(), validUntil: useId(), note: useId(), password: useId() };
  const versions = useQuery(masterRecordListQueryOptions());
  const approved = (versions.data ?? []).filter((v) => v.status === "approved");
  const record = useRecordTrainingMutation();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FormValues, unknown, z.output<typeof TrainingRecordSchema>>({
    resolver: zodResolver(TrainingRecordSchema),
    defaultValues: { personId: "", masterRecordVersionId: "", trainedOn: todayUtc(), validUntil: "", note: "", password: "" },
  });

  const onSubmit = handleSubmit((values) => {
    record.mutate(values, {
      onSuccess: ({ record: saved }) => onRecorded(saved),
      onError: (error) => {
        const field = error instanceof ApiError ? FIELDS.find((f) => f === error.field) : undefined;
        if (field) setError(field, { type: "server", message: error.message }, { shouldFocus: true });
      },
    });
  });
  const failure = record.error;
  const onField = failure instanceof ApiError && FIELDS.some((f) => f === failure.field);
  const error = (name: (typeof FIELDS)[number]) => errors[name]?.message;
  const described = (id: string, name: (typeof FIELDS)[number], hint?: string) => describedBy(id, hint, schemaMessage(error(name)));
  const passwordHint = "Your password signs this record with your name and the time.";

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div aria-live="assertive">{failure && !onField && <Notice tone="error">{errorMessage(failure)}</Notice>}</div>
      <SchemaField id={ids.person} label="Person" error={error("personId")}>
        <SelectInput id={ids.person} invalid={Boolean(errors.personId)} aria-describedby={described(ids.person, "personId")} {...register("personId")}>
          <option value="">Choose a person</option>
          {people
            .filter((p) => p.id !== selfId)
            .map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.roles.join(", ")})
              </option>
            ))}
        </SelectInput>
      </SchemaField>
      <SchemaField id={ids.version} label="Master record version" error={error("masterRecordVersionId")}>
        <SelectInput id={ids.version} invalid={Boolean(errors.masterRecordVersionId)} aria-describedby={described(ids.version, "masterRecordVersionId")} {...register("masterRecordVersionId")}>
          <option value="">{versions.isPending ? "Loading the approved versions…" : "Choose an approved version"}</option>
          {approved.map((v) => (
            <option key={v.id} value={v.id}>
              {v.code} version {v.version} — {v.title}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
      <div className="grid gap-4 sm:grid-cols-2">
        <SchemaField id={ids.trainedOn} label="Trained on" error={error("trainedOn")}>
          <TextInput id={ids.trainedOn} type="date" invalid={Boolean(errors.trainedOn)} aria-describedby={described(ids.trainedOn, "trainedOn")} {...register("trainedOn")} />
        </SchemaField>
        <SchemaField id={ids.validUntil} label="Valid until (last day, inclusive)" error={error("validUntil")}>
          <TextInput id={ids.validUntil} type="date" invalid={Boolean(errors.validUntil)} aria-describedby={described(ids.validUntil, "validUntil")} {...register("validUntil")} />
        </SchemaField>
      </div>
      <SchemaField id={ids.note} label="Note (optional)" error={error("note")}>
        <TextArea id={ids.note} rows={2} invalid={Boolean(errors.note)} aria-describedby={described(ids.note, "note")} {...register("note")} />
      </SchemaField>
      <SchemaField id={ids.password} label="Your password" hint={passwordHint} error={error("password")}>
        <TextInput id={ids.password} type="password" autoComplete="current-password" invalid={Boolean(errors.password)} aria-describedby={described(ids.password, "password", passwordHint)} {...register("password")} />
      </SchemaField>
      <FormActions submitLabel="Sign: training recorded" busy={record.isPending} onCancel={onCancel} />
    </form>
  );
}
