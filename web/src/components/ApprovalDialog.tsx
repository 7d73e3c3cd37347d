import type { SignatureInput } from "../../../shared/schemas/common";
import { SignatureDialog } from "./SignatureDialog";

interface ApprovalDialogProps {
  open: boolean;
  /** What is approved, e.g. "Rate model DMX-CRACK version 2". */
  subject: string;
  approve: (signature: SignatureInput) => Promise<unknown>;
  onClose: () => void;
  /** The outcome in words, for the page's notice. */
  onOutcome: (outcome: { tone: "success" | "error"; text: string }) => void;
}

/** Quality's signed approval of a draft version; approving supersedes the version approved before it. */
export function ApprovalDialog({ open, subject, approve, onClose, onOutcome }: ApprovalDialogProps) {
  return (
    <SignatureDialog
      open={open}
      meaning="approved"
      subject={subject}
      sign={approve}
      onClose={onClose}
      onLocked={(text) => {
        onClose();
        onOutcome({ tone: "error", text });
      }}
      onSigned={() => {
        onClose();
        onOutcome({ tone: "success", text: `${subject} is approved. Any version approved before it is now superseded.` });
      }}
    />
  );
}
