import { useId } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { FormActions } from "../../components/FormActions";
import { Dialog } from "../../components/Dialog";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField } from "../../components/SchemaField";
import { TextArea } from "../../components/TextInput";
import { ReasonSchema } from "../../../../shared/schemas/people";
import { errorMessage } from "../../lib/serverFieldErrors";

const ReasonForm = z.object({ reason: ReasonSchema });
type ReasonValues = z.input<typeof ReasonForm>;

export interface ReasonDialogProps {
  open: boolean;
  title: string;
  /** What happens next, said above the box. */
  intro: string;
  submitLabel: string;
  danger?: boolean;
  /** Sends the reason; rejects with the API's error when it is refused. */
  onSubmit: (reason: string) => Promise<unknown>;
  onClose: () => void;
}

/** A dialog that asks why (kept in the record) before a hold or a rejection. */
export function ReasonDialog({ open, onClose, title, ...rest }: ReasonDialogProps) {
  return (
    <Dialog open={open} title={title} onClose={onClose}>
      {open && <ReasonBody onClose={onClose} {...rest} />}
    </Dialog>
  );
}

function ReasonBody({ intro, submitLabel, danger, onSubmit, onClose }: Omit<ReasonDialogProps, "open" | "title">) {
  const id = useId();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ReasonValues, unknown, z.output<typeof ReasonForm>>({ resolver: zodResolver(ReasonForm), defaultValues: { reason: "" } });
  const submit = handleSubmit(async ({ reason }) => {
    try {
      await onSubmit(reason);
    } catch (error) {
      setError("root.server", { type: "server", message: errorMessage(error) });
    }
  });
  const hint = "Kept in the batch record with your name and the time.";
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <p>{intro}</p>
      <div aria-live="assertive">{errors.root?.server && <Notice tone="error">{errors.root.server.message}</Notice>}</div>
      <SchemaField id={id} label="Reason" hint={hint} error={errors.reason?.message}>
        <TextArea id={id} rows={3} invalid={Boolean(errors.reason)} aria-describedby={describedBy(id, hint, errors.reason?.message)} {...register("reason")} />
      </SchemaField>
      <FormActions submitLabel={submitLabel} variant={danger ? "danger" : "primary"} busy={isSubmitting} onCancel={onClose} />
    </form>
  );
}
