import { useQuery } from "@tanstack/react-query";
import { useEffect, useRef } from "react";
import { useLocation, useParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { QueryState } from "../components/QueryState";
import { ButtonLink } from "../components/ButtonLink";
import { PHASES } from "../../../shared/schemas/masterRecords";
import { AttachmentsPanel } from "../features/batches/AttachmentsPanel";
import { BatchHeader } from "../features/batches/BatchHeader";
import { currentPhase } from "../features/batches/batchStates";
import { DeviationsPanel } from "../features/batches/DeviationsPanel";
import { MoveBar } from "../features/batches/MoveBar";
import { CurrentPhase, FoldedPhase } from "../features/batches/PhaseSteps";
import { batchQueryOptions } from "../features/batches/queries";
import { SamplesPanel } from "../features/batches/SamplesPanel";
import { TracePanel } from "../features/batches/TracePanel";
import { VesselCaution } from "../features/batches/VesselCaution";
import type { BatchView } from "../features/batches/types";

const TRACE_STATES = ["running", "sampling", "review"];

/** The batch page (/batches/:id): the record being executed, its next moves, and everything logged against it. */
export default function BatchPage() {
  const { id = "" } = useParams();
  return <BatchScreen key={id} batchId={id} />;
}

function BatchScreen({ batchId }: { batchId: string }) {
  const query = useQuery(batchQueryOptions(batchId));
  const view = query.data;
  useScrollToHashOnce(Boolean(view));
  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/batches", label: "Batches" }, { label: view ? view.batch.code : "Batch" }]} />
      <QueryState isPending={query.isPending} error={query.error} onRetry={() => void query.refetch()} what="the batch">
        {view && <BatchRecord view={view} onStale={() => void query.refetch()} />}
      </QueryState>
    </div>
  );
}

/** A link to one step (…#step-key-title, from the work lists) scrolls there once the batch has loaded. */
function useScrollToHashOnce(ready: boolean) {
  const { hash } = useLocation();
  const done = useRef(false);
  useEffect(() => {
    if (!ready || done.current || !hash) return;
    done.current = true;
    document.getElementById(decodeURIComponent(hash.slice(1)))?.scrollIntoView({ block: "start" });
  }, [ready, hash]);
}

function BatchRecord({ view, onStale }: { view: BatchView; onStale: () => void }) {
  const { state, heldFrom } = view.batch;
  const phase = currentPhase(state, heldFrom);
  const showTrace = TRACE_STATES.includes(state) || view.traces.length > 0;
  return (
    <>
      <BatchHeader view={view} />
      <nav aria-label="Records of this batch" className="flex flex-wrap gap-3">
        {(state === "review" || state === "released" || state === "rejected") && <ButtonLink to={`/batches/${view.batch.id}/review`}>Open the review</ButtonLink>}
        <a className="inline-flex min-h-11 items-center rounded-md px-3 font-semibold text-fen-700 underline" href={`/api/batches/${view.batch.id}/record.pdf`}>
          Executed record (PDF)
        </a>
        <a className="inline-flex min-h-11 items-center rounded-md px-3 font-semibold text-fen-700 underline" href={`/api/batches/${view.batch.id}/record.json`}>
          Complete record (JSON)
        </a>
      </nav>
      {(state === "planned" || state === "charging") && <VesselCaution view={view} moment="charging" />}
      <MoveBar view={view} onStale={onStale} />
      <CurrentPhase view={view} phase={phase} />
      {PHASES.filter((p) => p !== phase).map((p) => (
        <FoldedPhase key={p} view={view} phase={p} />
      ))}
      {showTrace && <TracePanel view={view} />}
      <DeviationsPanel view={view} />
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <AttachmentsPanel view={view} />
        <SamplesPanel view={view} />
      </div>
    </>
  );
}
