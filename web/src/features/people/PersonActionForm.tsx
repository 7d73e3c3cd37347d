import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ApiError } from "../../api/client";
import type { Role } from "../../api/types";
import { Field, describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { TextInput } from "../../components/TextInput";
import { MIN_PASSWORD_LENGTH } from "../../lib/passwordRules";
import { applyServerFieldError, errorMessage } from "../../lib/serverFieldErrors";
import {
  useAssignRolesMutation,
  useDeactivatePersonMutation,
  useReactivatePersonMutation,
  useResetPasswordMutation,
  useUnlockPersonMutation,
} from "./mutations";
import { ACTION_BUTTON_LABELS, type PersonAction } from "./personActions";
import { assignRolesSchema, reasonSchema, resetPasswordSchema } from "./personSchemas";
import { ReasonField } from "./ReasonField";
import { RoleCheckboxes } from "./RoleCheckboxes";
import { FormActions } from "../../components/FormActions";

// One form covers every row action; fields the action does not use are simply not shown.
const actionFormSchema = assignRolesSchema.partial({ roles: true }).extend({
  temporaryPassword: resetPasswordSchema.shape.temporaryPassword.optional(),
  reason: reasonSchema,
});

type ActionFormValues = z.infer<typeof actionFormSchema>;

const FIELD_NAMES = ["roles", "temporaryPassword", "reason"] as const;
const PASSWORD_HINT = `At least ${MIN_PASSWORD_LENGTH} characters. Give it to the person in private.`;

/** The form inside the row-action dialog: the action's own inputs plus the reason. */
export function PersonActionForm({
  action,
  onDone,
  onCancel,
}: {
  action: PersonAction;
  onDone: () => void;
  onCancel: () => void;
}) {
  const { kind, person } = action;
  const assignRoles = useAssignRolesMutation();
  const deactivate = useDeactivatePersonMutation();
  const reactivate = useReactivatePersonMutation();
  const unlock = useUnlockPersonMutation();
  const resetPassword = useResetPasswordMutation();
  const mutations = { roles: assignRoles, deactivate, reactivate, unlock, "reset-password": resetPassword };
  const current = mutations[kind];

  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ActionFormValues>({
    resolver: zodResolver(actionFormSchema),
    defaultValues: {
      roles: kind === "roles" ? person.roles : undefined,
      temporaryPassword: kind === "reset-password" ? "" : undefined,
      reason: "",
    },
  });

  const onSubmit = handleSubmit(async ({ roles, temporaryPassword, reason }) => {
    const personId = person.id;
    try {
      if (kind === "roles") {
        if (!roles?.length) {
          setError("roles", { message: "Choose at least one role." });
          return;
        }
        await assignRoles.mutateAsync({ personId, roles: roles as Role[], reason });
      } else if (kind === "reset-password") {
        if (!temporaryPassword) {
          setError("temporaryPassword", { message: `Use at least ${MIN_PASSWORD_LENGTH} characters.` });
          return;
        }
        await resetPassword.mutateAsync({ personId, temporaryPassword, reason });
      } else {
        await mutations[kind].mutateAsync({ personId, reason });
      }
      onDone();
    } catch (error) {
      applyServerFieldError<ActionFormValues>(error, FIELD_NAMES, setError);
    }
  });

  const failure = current.error;
  const failureIsOnAField =
    failure instanceof ApiError && FIELD_NAMES.some((name) => name === failure.field);

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <p className="text-ink-700">{person.email}</p>
      <div aria-live="assertive">
        {failure && !failureIsOnAField && <Notice tone="error">{errorMessage(failure)}</Notice>}
      </div>
      {kind === "roles" && (
        <Controller
          control={control}
          name="roles"
          render={({ field }) => (
            <RoleCheckboxes
              idPrefix="action-role"
              value={field.value ?? []}
              onChange={field.onChange}
              error={errors.roles?.message}
            />
          )}
        />
      )}
      {kind === "reset-password" && (
        <Field
          id="action-temporary"
          label="Temporary password"
          hint={PASSWORD_HINT}
          error={errors.temporaryPassword?.message}
        >
          <TextInput
            id="action-temporary"
            type="text"
            autoComplete="off"
            spellCheck={false}
            invalid={Boolean(errors.temporaryPassword)}
            aria-describedby={describedBy("action-temporary", PASSWORD_HINT, errors.temporaryPassword?.message)}
            {...register("temporaryPassword")}
          />
        </Field>
      )}
      <ReasonField id="action-reason" error={errors.reason?.message} registration={register("reason")} />
      <FormActions submitLabel={ACTION_BUTTON_LABELS[kind] === "Roles" ? "Save roles" : ACTION_BUTTON_LABELS[kind]} busy={current.isPending} variant={kind === "deactivate" ? "danger" : "primary"} onCancel={onCancel} />
    </form>
  );
}
