import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { useNavigate } from "react-router";
import { ApiError } from "../api/client";
import { Button } from "../components/Button";
import { Field, describedBy } from "../components/Field";
import { Notice } from "../components/Notice";
import { TextInput } from "../components/TextInput";
import { useChangePasswordMutation } from "../features/session/mutations";
import { homePathFor } from "../features/session/roles";
import { useSession } from "../features/session/useSession";
import { MIN_PASSWORD_LENGTH, passwordSchema } from "../lib/passwordRules";
import { applyServerFieldError, errorMessage } from "../lib/serverFieldErrors";

const changePasswordSchema = z
  .object({
    currentPassword: z.string().min(1, "Enter your current password."),
    newPassword: passwordSchema,
    repeatPassword: z.string(),
  })
  .refine((values) => values.newPassword !== values.currentPassword, {
    path: ["newPassword"],
    message: "Choose a password different from the current one.",
  })
  .refine((values) => values.repeatPassword === values.newPassword, {
    path: ["repeatPassword"],
    message: "The two new passwords are not the same.",
  });

type ChangePasswordValues = z.infer<typeof changePasswordSchema>;

const FIELDS = [
  { name: "currentPassword", id: "current-password", label: "Current password", autoComplete: "current-password" },
  { name: "newPassword", id: "new-password", label: "New password", autoComplete: "new-password" },
  { name: "repeatPassword", id: "repeat-password", label: "Repeat new password", autoComplete: "new-password" },
] as const;

/** The screen where a person sets their own password (required after a reset). */
export default function ChangePassword() {
  const navigate = useNavigate();
  const { user } = useSession();
  const changePassword = useChangePasswordMutation();
  const [changed, setChanged] = useState(false);
  const forced = Boolean(user?.mustChangePassword);

  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<ChangePasswordValues>({ resolver: zodResolver(changePasswordSchema) });

  const onSubmit = handleSubmit(({ currentPassword, newPassword }) => {
    setChanged(false);
    changePassword.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: ({ user: updated }) => {
          reset();
          if (forced) navigate(homePathFor(updated.roles), { replace: true });
          else setChanged(true);
        },
        onError: (error) => {
          applyServerFieldError<ChangePasswordValues>(
            error,
            ["currentPassword", "newPassword"],
            setError,
          );
        },
      },
    );
  });

  const failureIsOnAField =
    changePassword.error instanceof ApiError &&
    (changePassword.error.field === "currentPassword" || changePassword.error.field === "newPassword");

  return (
    <section className="flex max-w-xl flex-col gap-5">
      <h1 className="text-3xl font-bold">Change password</h1>
      {forced ? (
        <Notice tone="info">
          Your password was set by an administrator. Choose your own before you carry on.
        </Notice>
      ) : (
        <p>Choose a new password for your own account.</p>
      )}
      <div aria-live="assertive">
        {changePassword.isError && !failureIsOnAField && (
          <Notice tone="error">{errorMessage(changePassword.error)}</Notice>
        )}
        {changed && <Notice tone="success">Your password has been changed.</Notice>}
      </div>
      <form
        onSubmit={onSubmit}
        noValidate
        className="flex flex-col gap-5 rounded-lg border-2 border-ink-200 bg-white p-6"
      >
        {FIELDS.map(({ name, id, label, autoComplete }) => {
          const message = errors[name]?.message;
          const hint =
            name === "newPassword"
              ? `At least ${MIN_PASSWORD_LENGTH} characters, different from the current one.`
              : undefined;
          return (
            <Field key={name} id={id} label={label} hint={hint} error={message}>
              <TextInput
                id={id}
                type="password"
                autoComplete={autoComplete}
                invalid={Boolean(message)}
                aria-describedby={describedBy(id, hint, message)}
                {...register(name)}
              />
            </Field>
          );
        })}
        <Button type="submit" busy={changePassword.isPending} className="self-start">
          Change password
        </Button>
      </form>
    </section>
  );
}
