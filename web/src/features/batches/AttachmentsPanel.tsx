import { useId, useRef, useState, type FormEvent } from "react";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { SchemaField } from "../../components/SchemaField";
import { SelectInput } from "../../components/SelectInput";
import { Sha256Line } from "../../components/Sha256Line";
import { TextInput } from "../../components/TextInput";
import { UploadProgressBar } from "../../components/UploadProgressBar";
import { AttachmentAddSchema } from "../../../../shared/schemas/batches";
import { errorMessage } from "../../lib/serverFieldErrors";
import { formatLocal, formatUtc } from "../signatures/signatureTime";
import { FilePicker } from "./FilePicker";
import { useAttachFileMutation } from "./mutations";
import { ACCEPT_ATTACHMENT, formatBytes } from "./uploadCheck";
import { useFileUpload } from "./useFileUpload";
import type { BatchView } from "./types";

const CLOSED = ["released", "rejected"];
const ATTACHERS = ["operator", "supervisor", "quality", "engineer"];

function AttachForm({ view }: { view: BatchView }) {
  const ids = { file: useId(), step: useId(), note: useId() };
  const fileRef = useRef<HTMLInputElement>(null);
  const { upload, progress, uploaded } = useFileUpload("attachment");
  const attach = useAttachFileMutation(view.batch.id);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [stepKey, setStepKey] = useState("");
  const [note, setNote] = useState("");

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    setDone(null);
    const file = fileRef.current?.files?.[0];
    if (!file) return setError("Choose a file first.");
    try {
      const stored = await upload(file);
      const body = AttachmentAddSchema.parse({ fileId: stored.id, stepKey: stepKey || undefined, note: note.trim() || undefined });
      await attach.mutateAsync(body);
      setDone(`${stored.originalName} is attached.`);
      setNote("");
      if (fileRef.current) fileRef.current.value = "";
    } catch (e) {
      setError(errorMessage(e));
    }
  };

  const busy = progress !== null || attach.isPending;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-md border-2 border-ink-200 p-4">
      <h3 className="text-lg font-bold">Attach a file</h3>
      <div aria-live="assertive">{error && <Notice tone="error">{error}</Notice>}</div>
      <SchemaField id={ids.file} label="File" hint="PNG or JPEG photos, PDF printouts, CSV or plain-text logger files.">
        <FilePicker id={ids.file} ref={fileRef} accept={ACCEPT_ATTACHMENT} aria-describedby={describedBy(ids.file, "hint")} />
      </SchemaField>
      <SchemaField id={ids.step} label="Step (optional)">
        <SelectInput id={ids.step} value={stepKey} onChange={(e) => setStepKey(e.target.value)} className="w-full max-w-xl">
          <option value="">The batch as a whole</option>
          {view.steps.map((s) => (
            <option key={s.key} value={s.key}>
              {s.title}
            </option>
          ))}
        </SelectInput>
      </SchemaField>
      <SchemaField id={ids.note} label="Note (optional)">
        <TextInput id={ids.note} value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} />
      </SchemaField>
      {progress && <UploadProgressBar sent={progress.sent} total={progress.total} label="Uploading" />}
      <div aria-live="polite">
        {done && uploaded && (
          <Notice tone="success">
            <p>{done}</p>
            <Sha256Line sha256={uploaded.sha256} />
          </Notice>
        )}
      </div>
      <Button type="submit" busy={busy} className="self-start">
        Upload and attach
      </Button>
    </form>
  );
}

/** Files attached to the batch (with their SHA-256), and a form to attach another. */
export function AttachmentsPanel({ view }: { view: BatchView }) {
  const stepTitle = (key: string | null) => (key ? (view.steps.find((s) => s.key === key)?.title ?? key) : "The batch");
  const canAttach = !CLOSED.includes(view.batch.state) && view.facts.roles.some((r) => ATTACHERS.includes(r));
  return (
    <section aria-labelledby="attachments-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="attachments-title" className="text-xl font-bold">
        Attachments
      </h2>
      {view.attachments.length === 0 ? (
        <p className="text-ink-600">No files attached yet.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {view.attachments.map((a) => (
            <li key={a.id} className="rounded-md border border-ink-200 px-3 py-2">
              <p className="flex flex-wrap items-baseline gap-x-3">
                <a href={`/api/files/${a.file.id}`} download className="inline-flex min-h-11 items-center font-semibold">
                  {a.file.name}
                </a>
                <span className="text-ink-700">
                  {a.file.contentType}, {formatBytes(a.file.sizeBytes)} — {stepTitle(a.stepKey)}
                </span>
              </p>
              {a.note && <p>Note: {a.note}</p>}
              <p className="text-[0.95rem] text-ink-700">
                Added by {a.addedBy?.name ?? "unknown"}, {formatUtc(a.addedAt)} ({formatLocal(a.addedAt)})
              </p>
              <Sha256Line sha256={a.file.sha256} />
            </li>
          ))}
        </ul>
      )}
      {canAttach && <AttachForm view={view} />}
    </section>
  );
}
