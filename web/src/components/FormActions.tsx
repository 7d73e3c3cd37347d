import type { ReactNode } from "react";
import { Button } from "./Button";

interface FormActionsProps {
  submitLabel: ReactNode;
  busy: boolean;
  onCancel: () => void;
  variant?: "primary" | "danger";
}

/** A form's submit button and its Cancel, side by side. */
export function FormActions({ submitLabel, busy, onCancel, variant = "primary" }: FormActionsProps) {
  return (
    <div className="flex flex-wrap gap-3">
      <Button type="submit" variant={variant} busy={busy}>
        {submitLabel}
      </Button>
      <Button variant="secondary" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
