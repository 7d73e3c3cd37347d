import { useState } from "react";
import { Button } from "../../components/Button";
import { Dialog } from "../../components/Dialog";
import { SignatureDialog } from "../../components/SignatureDialog";
import type { Role } from "../../../../shared/schemas/roles";
import { InvestigateForm, type InvestigatedDeviation } from "./InvestigateForm";
import { useCloseDeviationMutation } from "./mutations";

export interface ActionableDeviation extends InvestigatedDeviation {
  status: "open" | "investigated" | "closed";
}

/** Investigate (supervisor, when open) and close with a signature (quality, once investigated). */
export function DeviationActions({ deviation, roles, batchCode, onMessage }: { deviation: ActionableDeviation; roles: readonly Role[]; batchCode: string; onMessage: (tone: "success" | "error", text: string) => void }) {
  const [open, setOpen] = useState<"investigate" | "close" | null>(null);
  const close = useCloseDeviationMutation();
  const canInvestigate = deviation.status === "open" && roles.includes("supervisor");
  const canClose = deviation.status === "investigated" && roles.includes("quality");
  if (!canInvestigate && !canClose) return null;
  return (
    <>
      {canInvestigate && (
        <Button variant="secondary" onClick={() => setOpen("investigate")}>
          Investigate<span className="sr-only"> {deviation.title}</span>
        </Button>
      )}
      {canClose && (
        <Button onClick={() => setOpen("close")}>
          Close with signature<span className="sr-only"> {deviation.title}</span>
        </Button>
      )}
      <Dialog open={open === "investigate"} title={`Investigate the deviation on ${batchCode}`} onClose={() => setOpen(null)}>
        {open === "investigate" && (
          <InvestigateForm
            deviation={deviation}
            onCancel={() => setOpen(null)}
            onDone={() => {
              setOpen(null);
              onMessage("success", `"${deviation.title}": the investigation is recorded; quality is told it waits for closing.`);
            }}
          />
        )}
      </Dialog>
      <SignatureDialog
        open={open === "close"}
        meaning="closed"
        subject={`Deviation "${deviation.title}" on batch ${batchCode}`}
        sign={({ password, comment }) => close.mutateAsync({ id: deviation.id, batchId: deviation.batchId, password, comment, revision: deviation.revision })}
        onSigned={() => {
          setOpen(null);
          onMessage("success", `"${deviation.title}" is closed.`);
        }}
        onLocked={(text) => {
          setOpen(null);
          onMessage("error", text);
        }}
        onClose={() => setOpen(null)}
      />
    </>
  );
}
