import type { UseFormRegisterReturn } from "react-hook-form";
import { Field, describedBy } from "../../components/Field";
import { TextArea } from "../../components/TextInput";

const HINT = "Kept in the audit trail with your name and the time.";

/** The "Reason for this change" box every account change asks for. */
export function ReasonField({
  id,
  error,
  registration,
}: {
  id: string;
  error?: string;
  registration: UseFormRegisterReturn;
}) {
  return (
    <Field id={id} label="Reason for this change" hint={HINT} error={error}>
      <TextArea
        id={id}
        rows={2}
        invalid={Boolean(error)}
        aria-describedby={describedBy(id, HINT, error)}
        {...registration}
      />
    </Field>
  );
}
