import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { ApiError } from "../../api/client";
import type { Person } from "../../api/types";
import { Field, describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { TextInput } from "../../components/TextInput";
import { MIN_PASSWORD_LENGTH } from "../../lib/passwordRules";
import { applyServerFieldError, errorMessage } from "../../lib/serverFieldErrors";
import { useCreatePersonMutation } from "./mutations";
import { createPersonSchema, type CreatePersonValues } from "./personSchemas";
import { ReasonField } from "./ReasonField";
import { RoleCheckboxes } from "./RoleCheckboxes";
import { FormActions } from "../../components/FormActions";

const FIELD_NAMES = ["name", "email", "roles", "temporaryPassword", "reason"] as const;
const PASSWORD_HINT = `At least ${MIN_PASSWORD_LENGTH} characters. Give it to the person in private; they must replace it when they first sign in.`;

/** The form that creates an account with roles and a temporary password. */
export function CreatePersonForm({
  onCreated,
  onCancel,
}: {
  onCreated: (person: Person) => void;
  onCancel: () => void;
}) {
  const createPerson = useCreatePersonMutation();
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<CreatePersonValues>({
    resolver: zodResolver(createPersonSchema),
    defaultValues: { name: "", email: "", roles: [], temporaryPassword: "", reason: "" },
  });

  const onSubmit = handleSubmit((values) => {
    createPerson.mutate(values, {
      onSuccess: ({ person }) => onCreated(person),
      onError: (error) => {
        if (error instanceof ApiError && error.code === "email-taken") {
          setError("email", { type: "server", message: "An account with this email already exists." }, { shouldFocus: true });
          return;
        }
        applyServerFieldError<CreatePersonValues>(error, FIELD_NAMES, setError);
      },
    });
  });

  const failure = createPerson.error;
  const failureIsOnAField =
    failure instanceof ApiError &&
    (failure.code === "email-taken" || FIELD_NAMES.some((name) => name === failure.field));

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div aria-live="assertive">
        {failure && !failureIsOnAField && <Notice tone="error">{errorMessage(failure)}</Notice>}
      </div>
      <Field id="new-person-name" label="Full name" error={errors.name?.message}>
        <TextInput
          id="new-person-name"
          autoComplete="off"
          invalid={Boolean(errors.name)}
          aria-describedby={describedBy("new-person-name", undefined, errors.name?.message)}
          {...register("name")}
        />
      </Field>
      <Field id="new-person-email" label="Email address" error={errors.email?.message}>
        <TextInput
          id="new-person-email"
          type="email"
          autoComplete="off"
          invalid={Boolean(errors.email)}
          aria-describedby={describedBy("new-person-email", undefined, errors.email?.message)}
          {...register("email")}
        />
      </Field>
      <Controller
        control={control}
        name="roles"
        render={({ field }) => (
          <RoleCheckboxes
            idPrefix="new-person-role"
            value={field.value}
            onChange={field.onChange}
            error={errors.roles?.message}
          />
        )}
      />
      <Field
        id="new-person-temporary"
        label="Temporary password"
        hint={PASSWORD_HINT}
        error={errors.temporaryPassword?.message}
      >
        <TextInput
          id="new-person-temporary"
          type="text"
          autoComplete="off"
          spellCheck={false}
          invalid={Boolean(errors.temporaryPassword)}
          aria-describedby={describedBy("new-person-temporary", PASSWORD_HINT, errors.temporaryPassword?.message)}
          {...register("temporaryPassword")}
        />
      </Field>
      <ReasonField id="new-person-reason" error={errors.reason?.message} registration={register("reason")} />
      <FormActions submitLabel="Create account" busy={createPerson.isPending} onCancel={onCancel} />
    </form>
  );
}
