import { useRef, useState } from "react";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { SignatureDialog } from "../../components/SignatureDialog";
import { MOVE_LABELS, type BatchMove } from "../../../../shared/machines/batchMoves";
import { BatchEventSchema, MOVES_WITH_REASON, type BatchEventInput } from "../../../../shared/schemas/batches";
import type { SignatureMeaning } from "../../../../shared/schemas/common";
import { errorMessage } from "../../lib/serverFieldErrors";
import { STATE_WORDS } from "./batchStates";
import { isStaleRevision, refusalsOf } from "./moveErrors";
import { useBatchMoveMutation } from "./mutations";
import { ReasonDialog } from "./ReasonDialog";
import type { BatchView } from "./types";
import { useBatchMoves, type OfferedMove } from "./useBatchMoves";

const SIGNED: Partial<Record<BatchMove, SignatureMeaning>> = { RESUME: "resumed", RELEASE: "released", REJECT: "rejected" };
const DANGER: BatchMove[] = ["HOLD", "REJECT"];

const REASON_DIALOG: Partial<Record<BatchMove, { title: (code: string) => string; intro: string }>> = {
  HOLD: { title: (code) => `Put batch ${code} on hold`, intro: "Say why the batch is held. Work stops until a supervisor resumes it with a signature; the supervisors are told by mail." },
  RESUME: { title: (code) => `Resume batch ${code}`, intro: "Say what was done about the cause of the hold. You then sign the resumption with your password." },
  REJECT: { title: (code) => `Reject batch ${code}`, intro: "Say why the batch is rejected. You then sign the rejection with your password." },
};

type Message = { tone: "success" | "error" | "info"; title?: string; text: string; reasons?: string[] };
type Open = { move: BatchMove; step: "reason" | "sign"; reason?: string } | null;

/** The batch's next moves as buttons; moves not possible now are listed with the reasons in words. */
export function MoveBar({ view, onStale }: { view: BatchView; onStale: () => void }) {
  const mutation = useBatchMoveMutation(view.batch.id);
  const inFlight = useRef(false);
  const [message, setMessage] = useState<Message | null>(null);
  const [open, setOpen] = useState<Open>(null);
  const { batch } = view;

  /** Sends one move; a second press while it is on its way sends nothing. */
  const send = async (input: Omit<BatchEventInput, "revision">): Promise<"done" | "stale"> => {
    if (inFlight.current) return "done";
    inFlight.current = true;
    try {
      const body = BatchEventSchema.parse({ ...input, revision: batch.revision });
      const result = await mutation.mutateAsync(body);
      setMessage({ tone: "success", text: `${MOVE_LABELS[input.move]}: done. The batch is now ${STATE_WORDS[result.batch.state].toLowerCase()}.` });
      return "done";
    } catch (error) {
      if (isStaleRevision(error)) {
        setMessage({ tone: "info", title: "Someone else moved this batch", text: `${errorMessage(error)} The page now shows the batch as it is; nothing was changed by you.` });
        onStale();
        return "stale";
      }
      throw error;
    } finally {
      inFlight.current = false;
    }
  };

  const press = (m: OfferedMove) => {
    setMessage(null);
    if (MOVES_WITH_REASON.includes(m.move)) return setOpen({ move: m.move, step: "reason" });
    if (SIGNED[m.move]) return setOpen({ move: m.move, step: "sign" });
    send({ move: m.move }).catch((error) => {
      const reasons = refusalsOf(error).map((r) => r.message);
      setMessage({ tone: "error", title: `${m.label}: refused`, text: reasons.length ? "The server refused the move:" : errorMessage(error), reasons });
    });
  };

  const closeDialog = () => setOpen(null);
  const signing = open?.step === "sign" ? open : null;
  const meaning = signing ? SIGNED[signing.move] : undefined;

  return (
    <section aria-labelledby="move-bar-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="move-bar-title" className="text-xl font-bold">
        Next for this batch
      </h2>
      <div aria-live="polite" className="empty:hidden">
        {message && (
          <Notice tone={message.tone} title={message.title}>
            <p>{message.text}</p>
            {message.reasons && message.reasons.length > 0 && (
              <ul className="ml-5 list-disc">
                {message.reasons.map((r) => (
                  <li key={r}>{r}</li>
                ))}
              </ul>
            )}
          </Notice>
        )}
      </div>
      {/* Keyed by state: the machine's actor starts from the state the batch is in. */}
      <MoveChoices key={`${batch.state}:${batch.heldFrom ?? ""}`} view={view} busy={mutation.isPending} onPress={press} />
      <ReasonDialog
        open={open?.step === "reason"}
        title={open ? REASON_DIALOG[open.move]?.title(batch.code) ?? "" : ""}
        intro={open ? REASON_DIALOG[open.move]?.intro ?? "" : ""}
        submitLabel={open?.move === "HOLD" ? "Put on hold" : "Continue to signature"}
        danger={open?.move !== "RESUME"}
        onClose={closeDialog}
        onSubmit={async (reason) => {
          if (open && open.move !== "HOLD") return setOpen({ move: open.move, step: "sign", reason });
          await send({ move: "HOLD", reason });
          closeDialog();
        }}
      />
      <SignatureDialog
        open={Boolean(signing && meaning)}
        meaning={meaning ?? "resumed"}
        subject={signing ? `${MOVE_LABELS[signing.move]} — batch ${batch.code}${signing.reason ? ` (reason: ${signing.reason})` : ""}` : ""}
        sign={async ({ password, comment }) => {
          if (!signing) return;
          await send({ move: signing.move, password, comment, reason: signing.reason });
        }}
        onSigned={closeDialog}
        onLocked={(text) => {
          closeDialog();
          setMessage({ tone: "error", title: "Not signed", text });
        }}
        onClose={closeDialog}
      />
    </section>
  );
}

/** The buttons for the allowed moves, and the refused ones with their reasons. */
function MoveChoices({ view, busy, onPress }: { view: BatchView; busy: boolean; onPress: (m: OfferedMove) => void }) {
  const offered = useBatchMoves(view);
  const allowed = offered.filter((m) => m.allowed);
  const refused = offered.filter((m) => !m.allowed);
  return (
    <>
      {offered.length === 0 ? (
        <p>This batch is {STATE_WORDS[view.batch.state].toLowerCase()}; its record is closed and takes no further moves.</p>
      ) : allowed.length === 0 ? (
        <p className="font-semibold">Nothing you can move on just now.</p>
      ) : (
        <div className="flex flex-wrap gap-3">
          {allowed.map((m) => (
            <Button key={m.move} variant={DANGER.includes(m.move) ? "secondary" : "primary"} busy={busy} onClick={() => onPress(m)} className="min-h-14 px-6 text-lg">
              {m.label}
            </Button>
          ))}
        </div>
      )}
      {refused.length > 0 && (
        <div>
          <p className="font-semibold">Not possible yet</p>
          <ul className="flex flex-col gap-2">
            {refused.map((m) => (
              <li key={m.move} className="rounded-md border-l-4 border-ink-300 bg-ink-50 px-3 py-2">
                <span className="font-semibold">{m.label}</span>
                <span className="sr-only">: refused because</span>
                <ul className="ml-5 list-disc">
                  {m.refusals.map((r) => (
                    <li key={r.code + r.message}>{r.message}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        </div>
      )}
    </>
  );
}
