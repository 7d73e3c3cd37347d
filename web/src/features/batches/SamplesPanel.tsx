import { useId, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "../../components/Button";
import { describedBy } from "../../components/Field";
import { Notice } from "../../components/Notice";
import { QuantityInput } from "../../components/QuantityInput";
import { SchemaField } from "../../components/SchemaField";
import { Sha256Line } from "../../components/Sha256Line";
import { TextInput } from "../../components/TextInput";
import { UploadProgressBar } from "../../components/UploadProgressBar";
import { VOLUME_UNITS } from "../../../../shared/units";
import { errorMessage } from "../../lib/serverFieldErrors";
import { formatLocal, formatUtc } from "../signatures/signatureTime";
import { formatNumber } from "../vessels/quantityFormat";
import { isoToLocalInput } from "./entryValues";
import { FilePicker } from "./FilePicker";
import { useRecordSampleMutation } from "./mutations";
import { sampleResolver, toSampleBody, type SampleFormValues } from "./sampleForm";
import { ACCEPT_ATTACHMENT } from "./uploadCheck";
import { useFileUpload } from "./useFileUpload";
import type { BatchView } from "./types";

function SampleForm({ view }: { view: BatchView }) {
  const ids = { at: useId(), volume: useId(), lab: useId(), file: useId() };
  const fileRef = useRef<HTMLInputElement>(null);
  const { upload, progress, uploaded } = useFileUpload("attachment");
  const record = useRecordSampleMutation(view.batch.id);
  const [done, setDone] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SampleFormValues>({ resolver: sampleResolver, defaultValues: { sampledAt: "", volumeValue: "", volumeUnit: "mL", labResult: "" } });

  const onSubmit = handleSubmit(async (form) => {
    setDone(null);
    try {
      const file = fileRef.current?.files?.[0];
      const stored = file ? await upload(file) : null;
      const body = toSampleBody(form);
      await record.mutateAsync({ ...body, volume: { value: body.volume.value ?? Number.NaN, unit: body.volume.unit }, fileId: stored?.id });
      setDone("The sample is recorded.");
      reset();
      if (fileRef.current) fileRef.current.value = "";
    } catch (error) {
      setError("root.server", { type: "server", message: errorMessage(error) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-md border-2 border-ink-200 p-4">
      <h3 className="text-lg font-bold">Record a sample</h3>
      <div aria-live="assertive">{errors.root?.server && <Notice tone="error">{errors.root.server.message}</Notice>}</div>
      <SchemaField id={ids.at} label="Sampled at" hint="Local time on this tablet." error={errors.sampledAt?.message}>
        <div className="flex flex-wrap items-center gap-2">
          <TextInput id={ids.at} type="datetime-local" className="max-w-72" invalid={Boolean(errors.sampledAt)} aria-describedby={describedBy(ids.at, "hint", errors.sampledAt?.message)} {...register("sampledAt")} />
          <Button variant="secondary" onClick={() => setValue("sampledAt", isoToLocalInput(new Date().toISOString()), { shouldValidate: true })}>
            Now<span className="sr-only"> for the sample time</span>
          </Button>
        </div>
      </SchemaField>
      <QuantityInput id={ids.volume} label="Sample volume" error={errors.volumeValue?.message ?? errors.volumeUnit?.message} units={VOLUME_UNITS} value={register("volumeValue")} unit={register("volumeUnit")} />
      <SchemaField id={ids.lab} label="Lab result (optional)" error={errors.labResult?.message}>
        <TextInput id={ids.lab} {...register("labResult")} />
      </SchemaField>
      <SchemaField id={ids.file} label="Lab report or photo (optional)">
        <FilePicker id={ids.file} ref={fileRef} accept={ACCEPT_ATTACHMENT} />
      </SchemaField>
      {progress && <UploadProgressBar sent={progress.sent} total={progress.total} label="Uploading" />}
      <div aria-live="polite">
        {done && (
          <Notice tone="success">
            <p>{done}</p>
            {uploaded && <Sha256Line sha256={uploaded.sha256} />}
          </Notice>
        )}
      </div>
      <Button type="submit" busy={isSubmitting} className="self-start">
        Record the sample
      </Button>
    </form>
  );
}

/** Samples taken during the run or sampling, and the form to record one. */
export function SamplesPanel({ view }: { view: BatchView }) {
  const canRecord = (view.batch.state === "running" || view.batch.state === "sampling") && view.facts.roles.some((r) => r === "operator" || r === "supervisor");
  return (
    <section aria-labelledby="samples-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="samples-title" className="text-xl font-bold">
        Samples
      </h2>
      {view.samples.length === 0 ? (
        <p className="text-ink-600">No samples recorded.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {view.samples.map((s) => (
            <li key={s.id} className="rounded-md border border-ink-200 px-3 py-2">
              <p className="font-semibold">
                {formatUtc(s.sampledAt)} ({formatLocal(s.sampledAt)}) — {formatNumber(s.volumeL * 1000, 4)} mL
              </p>
              {s.labResult && <p>Lab result: {s.labResult}</p>}
              <p className="text-[0.95rem] text-ink-700">
                Taken by {s.takenBy?.name ?? "unknown"}
                {s.fileId && (
                  <>
                    {" "}
                    — <a href={`/api/files/${s.fileId}`} download>file</a>
                  </>
                )}
              </p>
            </li>
          ))}
        </ul>
      )}
      {canRecord && <SampleForm view={view} />}
    </section>
  );
}
