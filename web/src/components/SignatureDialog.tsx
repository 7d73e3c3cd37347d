import { useId } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { SignatureSchema, type SignatureInput, type SignatureMeaning } from "../../../shared/schemas/common";
import { ApiError } from "../api/client";
import { useSession } from "../features/session/useSession";
import { errorMessage } from "../lib/serverFieldErrors";
import { FormActions } from "./FormActions";
import { Dialog } from "./Dialog";
import { describedBy } from "./Field";
import { Notice } from "./Notice";
import { SchemaField } from "./SchemaField";
import { TextArea, TextInput } from "./TextInput";

export interface SignatureDialogProps {
  open: boolean;
  meaning: SignatureMeaning;
  /** What is signed, e.g. "Rate model DMX-CRACK version 2". */
  subject: string;
  /** Sends the signature; rejects with the API's error when it is refused. */
  sign: (input: SignatureInput) => Promise<unknown>;
  onSigned: () => void;
  /** The account was locked by this attempt: the dialog closes and the caller shows `message`. */
  onLocked: (message: string) => void;
  onClose: () => void;
}

type SignatureValues = z.input<typeof SignatureSchema>;

const COMMENT_HINT = "Optional. Kept with the signature.";

/** The one password signature dialog: shows what is signed and its meaning, then asks for the password. */
export function SignatureDialog({ open, meaning, subject, sign, onSigned, onLocked, onClose }: SignatureDialogProps) {
  return (
    <Dialog open={open} title="Electronic signature" onClose={onClose}>
      {open && (
        <SignatureForm meaning={meaning} subject={subject} sign={sign} onSigned={onSigned} onLocked={onLocked} onClose={onClose} />
      )}
    </Dialog>
  );
}

function SignatureForm({ meaning, subject, sign, onSigned, onLocked, onClose }: Omit<SignatureDialogProps, "open">) {
  const { user } = useSession();
  const ids = { password: useId(), comment: useId(), statement: useId() };
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SignatureValues, unknown, SignatureInput>({
    resolver: zodResolver(SignatureSchema),
    defaultValues: { password: "", comment: "" },
  });
  const rootError = errors.root?.server?.message;

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sign({ password: values.password, comment: values.comment ? values.comment : undefined });
      onSigned();
    } catch (error) {
      if (error instanceof ApiError && error.code === "signature-password-wrong") {
        setError("password", { type: "server", message: error.message }, { shouldFocus: true });
      } else if (error instanceof ApiError && error.code === "account-locked") {
        onLocked(error.message);
      } else {
        setError("root.server", { type: "server", message: errorMessage(error) });
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-describedby={ids.statement}>
      <div className="rounded-md border-2 border-fen-700 bg-fen-50 px-4 py-3">
        <p className="text-[0.9rem] font-semibold text-ink-700">You are signing</p>
        <p className="text-lg font-bold">
          {meaning} — {subject}
        </p>
        <p className="mt-1">
          Signing as <strong>{user?.name ?? "you"}</strong>
          {user?.email ? ` (${user.email})` : ""}
        </p>
      </div>
      <p id={ids.statement}>
        This is your legally binding electronic signature, the equal of your handwritten one. It is
        recorded with your printed name, the meaning above and the time, and it is tied to this exact
        content.
      </p>
      <div aria-live="assertive">{rootError && <Notice tone="error">{rootError}</Notice>}</div>
      <SchemaField id={ids.password} label="Your password" error={errors.password?.message}>
        <TextInput
          id={ids.password}
          type="password"
          autoComplete="current-password"
          invalid={Boolean(errors.password)}
          aria-describedby={describedBy(ids.password, undefined, errors.password?.message)}
          {...register("password")}
        />
      </SchemaField>
      <SchemaField id={ids.comment} label="Comment" hint={COMMENT_HINT} error={errors.comment?.message}>
        <TextArea
          id={ids.comment}
          rows={2}
          invalid={Boolean(errors.comment)}
          aria-describedby={describedBy(ids.comment, COMMENT_HINT, errors.comment?.message)}
          {...register("comment")}
        />
      </SchemaField>
      <FormActions submitLabel={<>Sign: {meaning}</>} busy={isSubmitting} onCancel={onClose} />
    </form>
  );
}
