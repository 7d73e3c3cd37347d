import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { QueryState } from "../../components/QueryState";
import { errorMessage } from "../../lib/serverFieldErrors";
import { batchTraceQueryOptions } from "../batches/queries";
import type { BatchTraceView, BatchView } from "../batches/types";
import { AnalysisCharts } from "../kinetics/AnalysisCharts";
import { CheckFigures } from "./CheckFigures";
import { checkOutcome, traceForCharts } from "./checkOutcome";
import { useRerunCheckMutation } from "./mutations";
import type { ReviewCheckView } from "./types";

const RERUN_ROLES = ["quality", "engineer"];
const RERUN_STATES = ["running", "sampling", "review"];

/** The kinetics check on the current traces: verdict and reasons, the three charts, and a re-run. */
export function KineticsCheckPanel({ view, check }: { view: BatchView; check: ReviewCheckView | null }) {
  const trace = useQuery(batchTraceQueryOptions(view.batch.id));
  const rerun = useRerunCheckMutation(view.batch.id);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const canRerun = RERUN_STATES.includes(view.batch.state) && view.facts.roles.some((r) => RERUN_ROLES.includes(r));

  const run = async () => {
    setMessage(null);
    try {
      const { check: fresh } = await rerun.mutateAsync();
      setMessage({ tone: "success", text: `The check ran again on ${fresh.traceHashes.length} trace file${fresh.traceHashes.length === 1 ? "" : "s"}: ${fresh.verdict === "within" ? "within" : "outside"} the model.` });
    } catch (error) {
      setMessage({ tone: "error", text: errorMessage(error) });
    }
  };

  return (
    <section aria-labelledby="check-title" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="check-title" className="text-2xl font-bold">
          Kinetics check
        </h2>
        {canRerun && (
          <Button variant="secondary" busy={rerun.isPending} onClick={() => void run()}>
            Run the check again
          </Button>
        )}
      </div>
      <div aria-live="polite" className="empty:hidden">
        {message && <Notice tone={message.tone}>{message.text}</Notice>}
      </div>
      {!check && (
        <Notice tone="error" title="Not run on the current traces">
          <p>
            The check has not run on the traces this batch holds now (none yet, or a trace was added after it ran). Release waits for it.
            {canRerun ? " Run it again above." : ""}
          </p>
        </Notice>
      )}
      {check && (
        <QueryState isPending={trace.isPending} error={trace.error} onRetry={() => void trace.refetch()} what="the trace">
          {trace.data && <CheckBody view={view} check={check} trace={trace.data} />}
        </QueryState>
      )}
    </section>
  );
}

function CheckBody({ view, check, trace }: { view: BatchView; check: ReviewCheckView; trace: BatchTraceView }) {
  const outcome = useMemo(() => checkOutcome(check, view, trace), [check, view, trace]);
  const points = useMemo(() => traceForCharts(trace.trace), [trace]);
  return (
    <div className="flex flex-col gap-4">
      <CheckFigures check={check} outcome={outcome} />
      {points.t.length > 0 ? <AnalysisCharts trace={points} outcome={outcome} order={view.rateModel.content.order} /> : <p>No trace points to draw.</p>}
    </div>
  );
}
