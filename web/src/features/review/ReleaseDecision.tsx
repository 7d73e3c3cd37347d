import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { SignatureDialog } from "../../components/SignatureDialog";
import { BatchEventSchema } from "../../../../shared/schemas/batches";
import type { Refusal } from "../../../../shared/machines/batchMoves";
import { errorMessage } from "../../lib/serverFieldErrors";
import { STATE_WORDS } from "../batches/batchStates";
import { isStaleRevision, refusalsOf } from "../batches/moveErrors";
import { useBatchMoveMutation } from "../batches/mutations";
import { ReasonDialog } from "../batches/ReasonDialog";
import type { BatchView } from "../batches/types";
import { reviewKey } from "./queries";

type Decision = "RELEASE" | "REJECT";
type Open = { move: Decision; reason?: string; step: "reason" | "sign" } | null;
type Message = { tone: "success" | "error" | "info"; title?: string; text: string; refusals?: Refusal[] };

function RefusalList({ refusals }: { refusals: Refusal[] }) {
  return (
    <ul className="ml-5 list-disc">
      {refusals.map((r) => (
        <li key={r.code + r.message}>{r.message}</li>
      ))}
    </ul>
  );
}

/** Release (signed "released") or rejection (a reason, signed "rejected"); every refusal is shown in words. */
export function ReleaseDecision({ view, onStale }: { view: BatchView; onStale: () => void }) {
  const mutation = useBatchMoveMutation(view.batch.id);
  const queryClient = useQueryClient();
  const [open, setOpen] = useState<Open>(null);
  const [message, setMessage] = useState<Message | null>(null);
  const release = view.moves.find((m) => m.move === "RELEASE");
  const reject = view.moves.find((m) => m.move === "REJECT");
  const code = view.batch.code;

  const send = async (move: Decision, password: string, comment?: string, reason?: string) => {
    try {
      const body = BatchEventSchema.parse({ move, revision: view.batch.revision, password, comment, reason });
      const result = await mutation.mutateAsync(body);
      void queryClient.invalidateQueries({ queryKey: reviewKey(view.batch.id) });
      setMessage({ tone: "success", text: `Batch ${code} is now ${STATE_WORDS[result.batch.state].toLowerCase()}. The signature is kept in its record.` });
    } catch (error) {
      const refusals = refusalsOf(error);
      if (refusals.length > 0 || isStaleRevision(error)) {
        // Close the dialog and show the server's reasons beside the buttons.
        if (isStaleRevision(error)) {
          onStale();
          setMessage({ tone: "info", title: "Someone else changed this batch", text: `${errorMessage(error)} The screen now shows the batch as it is; nothing was signed.` });
        } else setMessage({ tone: "error", title: `${move === "RELEASE" ? "Release" : "Rejection"} refused by the server`, text: "Nothing was signed. The server gave these reasons:", refusals });
        return;
      }
      throw error;
    }
  };

  const close = () => setOpen(null);
  const signing = open?.step === "sign" ? open : null;
  const closedRecord = view.batch.state === "released" || view.batch.state === "rejected";

  return (
    <div className="flex flex-col gap-4">
      <h3 className="text-xl font-bold">Decision</h3>
      <div aria-live="polite" className="empty:hidden">
        {message && (
          <Notice tone={message.tone} title={message.title}>
            <p>{message.text}</p>
            {message.refusals && <RefusalList refusals={message.refusals} />}
          </Notice>
        )}
      </div>
      {closedRecord && <p className="text-lg font-semibold">This batch is {STATE_WORDS[view.batch.state].toLowerCase()}; its record is closed.</p>}
      {release && (
        <div className="flex flex-col gap-2">
          {release.allowed ? (
            <Button className="min-h-14 self-start px-6 text-lg" busy={mutation.isPending} onClick={() => { setMessage(null); setOpen({ move: "RELEASE", step: "sign" }); }}>
              Release batch {code}
            </Button>
          ) : (
            <div className="rounded-md border-l-4 border-ink-300 bg-ink-50 px-3 py-2">
              <p className="font-semibold">Release is not possible yet, because:</p>
              <RefusalList refusals={release.refusals} />
            </div>
          )}
        </div>
      )}
      {reject && (
        <div className="flex flex-col gap-2">
          {reject.allowed ? (
            <Button variant="secondary" className="self-start" busy={mutation.isPending} onClick={() => { setMessage(null); setOpen({ move: "REJECT", step: "reason" }); }}>
              Reject batch {code}
            </Button>
          ) : (
            <div className="rounded-md border-l-4 border-ink-300 bg-ink-50 px-3 py-2">
              <p className="font-semibold">Rejection is not possible, because:</p>
              <RefusalList refusals={reject.refusals} />
            </div>
          )}
        </div>
      )}
      <ReasonDialog
        open={open?.step === "reason"}
        title={`Reject batch ${code}`}
        intro="Say why the batch is rejected. You then sign the rejection with your password; the material is not released."
        submitLabel="Continue to signature"
        danger
        onClose={close}
        onSubmit={async (reason) => setOpen({ move: "REJECT", step: "sign", reason })}
      />
      <SignatureDialog
        open={signing !== null}
        meaning={signing?.move === "REJECT" ? "rejected" : "released"}
        subject={signing ? `${signing.move === "REJECT" ? "Rejection" : "Release"} of batch ${code}${signing.reason ? ` (reason: ${signing.reason})` : ""}` : ""}
        sign={async ({ password, comment }) => {
          if (signing) await send(signing.move, password, comment, signing.reason);
        }}
        onSigned={close}
        onLocked={(text) => {
          close();
          setMessage({ tone: "error", title: "Not signed", text });
        }}
        onClose={close}
      />
    </div>
  );
}
