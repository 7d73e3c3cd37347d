import { useId, useRef, useState } from "react";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { TextArea } from "../../components/TextInput";
import type { ParsedTrace } from "../../../../shared/kinetics/traceCsvParser";
import type { TraceCsvProblem } from "../../../../shared/kinetics/traceProblemList";
import { demoTraceCsv } from "./demoTrace";
import { ProgressBar } from "./ProgressBar";
import { readTraceFile } from "./readTraceFile";
import { TraceProblems } from "./TraceProblems";

/** A trace read in the browser, with the bytes it came from (sent as-is to the server). */
export interface LoadedTrace {
  trace: ParsedTrace;
  rows: number;
  file: Blob;
  fileName: string;
}

const FORMAT_HINT =
  "A CSV with a header row naming each column and its unit, e.g. time (s), volume (L), temperature (°C), pressure (bar(a)). Commas, semicolons or tabs.";

/** Choose or paste a trace CSV; it is read here in chunks, with progress, by the shared parser. */
export function TraceInput({ loaded, onLoaded }: { loaded: LoadedTrace | null; onLoaded: (trace: LoadedTrace | null) => void }) {
  const fileId = useId();
  const pasteId = useId();
  const [progress, setProgress] = useState<number | null>(null);
  const [problems, setProblems] = useState<{ list: TraceCsvProblem[]; total: number } | null>(null);
  const [pasted, setPasted] = useState("");
  const abort = useRef<AbortController | null>(null);

  async function read(file: Blob, fileName: string) {
    abort.current?.abort();
    const controller = new AbortController();
    abort.current = controller;
    setProblems(null);
    onLoaded(null);
    try {
      const result = await readTraceFile(file, setProgress, {}, controller.signal);
      if (result.ok) onLoaded({ trace: result.trace, rows: result.rows, file, fileName });
      else setProblems({ list: result.errors, total: result.totalErrors });
    } catch (error) {
      if (!(error instanceof DOMException && error.name === "AbortError")) throw error;
    } finally {
      if (abort.current === controller) setProgress(null);
    }
  }

  return (
    <section aria-labelledby="trace-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="trace-title" className="text-xl font-bold">
        1. Volume trace
      </h2>
      <p id={`${fileId}-hint`} className="text-[0.9rem] text-ink-600">
        {FORMAT_HINT}
      </p>
      <div className="flex flex-col gap-1">
        <label htmlFor={fileId} className="font-semibold">
          Trace file
        </label>
        <input
          id={fileId}
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/plain"
          aria-describedby={`${fileId}-hint`}
          className="min-h-11 rounded-md border-2 border-ink-400 bg-white px-3 py-1.5 file:mr-3 file:min-h-9 file:rounded-md file:border-2 file:border-ink-400 file:bg-ink-100 file:px-3 file:font-semibold"
          onChange={(event) => {
            const file = event.target.files?.[0];
            if (file) void read(file, file.name);
          }}
        />
      </div>
      <details className="rounded-md border-2 border-ink-200 px-4 py-2">
        <summary className="flex min-h-11 cursor-pointer items-center font-semibold">Paste the trace instead</summary>
        <div className="flex flex-col gap-2 pb-2">
          <label htmlFor={pasteId} className="font-semibold">
            Trace text
          </label>
          <TextArea id={pasteId} rows={6} value={pasted} onChange={(event) => setPasted(event.target.value)} className="font-mono text-[0.9rem]" spellCheck={false} />
          <Button variant="secondary" className="self-start" disabled={pasted.trim() === ""} onClick={() => void read(new Blob([pasted], { type: "text/csv" }), "pasted-trace.csv")}>
            Read the pasted trace
          </Button>
        </div>
      </details>
      <div className="flex flex-wrap gap-2">
        <Button variant="quiet" onClick={() => void read(demoTraceCsv(), "hf-24-demo-trace.csv")}>
          Use the invented HF-24 demo trace (100 000 points)
        </Button>
        <Button variant="quiet" onClick={() => void read(demoTraceCsv(100_000, 1.3), "hf-24-demo-fast-batch.csv")}>
          …or a demo batch that ran 30 % fast
        </Button>
      </div>
      <div aria-live="polite" className="flex flex-col gap-2">
        {progress !== null && <ProgressBar label="Reading the trace" fraction={progress} />}
        {loaded && progress === null && (
          <Notice tone="success">
            Read {loaded.rows.toLocaleString("en-GB")} rows from {loaded.fileName}
            {loaded.trace.T ? ", with temperature" : ", no temperature column"}
            {loaded.trace.P ? " and pressure." : " and no pressure column."}
          </Notice>
        )}
      </div>
      {problems && <TraceProblems problems={problems.list} total={problems.total} />}
    </section>
  );
}
