import { useQuery } from "@tanstack/react-query";
import { QueryState } from "../../components/QueryState";
import { TraceChart } from "../../components/TraceChart";
import { rateConstantUnit } from "../../../../shared/schemas/rateModels";
import { formatNumber } from "../vessels/quantityFormat";
import { batchTraceQueryOptions } from "./queries";
import { TraceUploadForm } from "./TraceUploadForm";
import type { BatchView } from "./types";

const UPLOADERS = ["operator", "supervisor", "engineer"];

/** The logged trace against the model, the conversion so far and the forecast; adds logger files while running or sampling. */
export function TracePanel({ view }: { view: BatchView }) {
  const trace = useQuery(batchTraceQueryOptions(view.batch.id));
  const canUpload = (view.batch.state === "running" || view.batch.state === "sampling") && view.facts.roles.some((r) => UPLOADERS.includes(r));
  const data = trace.data;
  const kUnit = rateConstantUnit(view.rateModel.content.order);
  return (
    <section aria-labelledby="trace-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="trace-title" className="text-xl font-bold">
        Trace against the model
      </h2>
      <QueryState isPending={trace.isPending} error={trace.error} onRetry={() => void trace.refetch()} what="the trace">
        {data && data.trace.t.length === 0 && <p className="text-ink-600">No logger file has been added yet.</p>}
        {data && data.trace.t.length > 0 && (
          <>
            <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
              <dt className="font-semibold">Conversion now</dt>
              <dd className="text-lg font-bold">{formatNumber(data.forecast.currentConversion, 3)}</dd>
              <dt className="font-semibold">Forecast</dt>
              <dd className="font-semibold">{data.forecast.message}</dd>
              <dt className="font-semibold">k</dt>
              <dd>
                {formatNumber(data.forecast.k, 4)} {kUnit} {data.forecast.basis === "trace" ? "from the trace so far" : "from the model"}; the model gives {formatNumber(data.kModel, 4)} {kUnit}
              </dd>
              <dt className="font-semibold">Readings</dt>
              <dd>
                {data.trace.t.length} from {data.trace.files} file{data.trace.files === 1 ? "" : "s"}
              </dd>
            </dl>
            <TraceChart t={data.trace.t} V={data.trace.V} predicted={data.predicted} label={`Logged volume of batch ${view.batch.code} against the model's prediction`} />
          </>
        )}
      </QueryState>
      {canUpload && <TraceUploadForm batchId={view.batch.id} />}
    </section>
  );
}
