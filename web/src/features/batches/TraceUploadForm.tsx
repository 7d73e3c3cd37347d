import { useId, useRef, useState, type FormEvent } from "react";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField } from "../../components/SchemaField";
import { Sha256Line } from "../../components/Sha256Line";
import { UploadProgressBar } from "../../components/UploadProgressBar";
import { TraceAddSchema } from "../../../../shared/schemas/batches";
import { errorMessage } from "../../lib/serverFieldErrors";
import { FilePicker } from "./FilePicker";
import { useAddTraceMutation } from "./mutations";
import { traceProblemsOf, type TraceProblem } from "./traceErrors";
import { ACCEPT_TRACE } from "./uploadCheck";
import { useFileUpload } from "./useFileUpload";
import type { TraceAdded, UploadedFile } from "./types";

const DEVIATION_WORDS: Record<string, string> = {
  "relief-pressure": "Pressure above the vessel's relief set pressure",
  "rated-volume": "Volume outside the vessel's rated range",
};

type Outcome = { added: TraceAdded; file: UploadedFile } | { error: string; problems: TraceProblem[]; total: number };

function TraceOutcome({ outcome }: { outcome: Outcome }) {
  if ("error" in outcome) {
    return (
      <Notice tone="error" title="The trace was not added">
        <p>{outcome.error}</p>
        {outcome.problems.length > 0 && (
          <>
            <ul className="ml-5 list-disc">
              {outcome.problems.map((p) => (
                <li key={`${p.line}-${p.message}`}>{p.message}</li>
              ))}
            </ul>
            {outcome.total > outcome.problems.length && <p>…and {outcome.total - outcome.problems.length} more problems.</p>}
          </>
        )}
      </Notice>
    );
  }
  const { added, file } = outcome;
  return (
    <div className="flex flex-col gap-3">
      {added.deviationsRaised.length > 0 && (
        <Notice tone="error" title="Deviation raised by the safety checks">
          <ul className="ml-5 list-disc">
            {added.deviationsRaised.map((code) => (
              <li key={code}>{DEVIATION_WORDS[code] ?? code}</li>
            ))}
          </ul>
          <p>Critical deviations are open on this batch. Check the vessel before going on; the supervisors have been told.</p>
        </Notice>
      )}
      {added.outsideModel ? (
        <Notice tone="error" title="The trace so far is OUTSIDE the approved rate model">
          <ul className="ml-5 list-disc">
            {added.reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
          <p>The campaign's engineer has been told by mail.</p>
        </Notice>
      ) : (
        <Notice tone="success" title="Trace added: within the model so far">
          <p>
            {added.points} readings from {file.originalName}.
          </p>
        </Notice>
      )}
      <Sha256Line sha256={file.sha256} />
    </div>
  );
}

/** Uploads a logger CSV (with progress) and adds it to the batch's trace; says what the checks found. */
export function TraceUploadForm({ batchId }: { batchId: string }) {
  const id = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const { upload, progress } = useFileUpload("trace");
  const addTrace = useAddTraceMutation(batchId);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const hint = "A CSV with a header row: time and volume (or piston travel) with units in brackets, e.g. t (s), V (L); temperature and pressure columns are read too.";

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setOutcome(null);
    const file = fileRef.current?.files?.[0];
    if (!file) return setOutcome({ error: "Choose the logger file first.", problems: [], total: 0 });
    try {
      const stored = await upload(file);
      const result = await addTrace.mutateAsync(TraceAddSchema.parse({ fileId: stored.id }));
      setOutcome({ added: result.trace, file: stored });
      if (fileRef.current) fileRef.current.value = "";
    } catch (error) {
      setOutcome({ error: errorMessage(error), ...traceProblemsOf(error) });
    }
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-md border-2 border-ink-200 p-4">
      <h3 className="text-lg font-bold">Add a logger file</h3>
      <SchemaField id={id} label="Trace file (CSV)" hint={hint}>
        <FilePicker id={id} ref={fileRef} accept={ACCEPT_TRACE} aria-describedby={describedBy(id, hint)} />
      </SchemaField>
      {progress && <UploadProgressBar sent={progress.sent} total={progress.total} label="Uploading the trace" />}
      <Button type="submit" busy={progress !== null || addTrace.isPending} className="self-start">
        Upload and check the trace
      </Button>
      <div aria-live="polite">{outcome && <TraceOutcome outcome={outcome} />}</div>
    </form>
  );
}
