import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router";
import { QueryState } from "../../components/QueryState";
import { StatusBadge } from "../../components/StatusBadge";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { formatDateTime } from "../../lib/formatDateTime";
import { rateModelListQueryOptions } from "./queries";

function Panel({ id, title, empty, versions, detail }: { id: string; title: string; empty: string; versions: RateModelVersionView[]; detail: (v: RateModelVersionView) => string }) {
  return (
    <section aria-labelledby={id} className="rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id={id} className="text-xl font-bold">
        {title}
      </h2>
      {versions.length === 0 ? (
        <p className="mt-1 text-ink-700">{empty}</p>
      ) : (
        <ul className="mt-2 flex flex-col gap-1">
          {versions.map((v) => (
            <li key={v.id} className="flex flex-wrap items-center gap-x-3">
              <Link to={`/rate-models/versions/${v.id}`} className="inline-flex min-h-11 items-center font-semibold">
                {v.code} version {v.version}
              </Link>
              <StatusBadge status={v.status} />
              <span className="text-ink-700">{detail(v)}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The engineer's home panels: rate models in use, and drafts still waiting for approval. */
export function EngineerModelPanels() {
  const versions = useQuery(rateModelListQueryOptions());
  const all = versions.data ?? [];
  return (
    <QueryState isPending={versions.isPending} error={versions.error} onRetry={() => void versions.refetch()} what="the rate models">
      <div className="grid gap-4 lg:grid-cols-2">
        <Panel
          id="engineer-approved-title"
          title="Approved rate models"
          empty="No rate model is approved yet."
          versions={all.filter((v) => v.status === "approved")}
          detail={(v) => `approved ${formatDateTime(v.approvedAt)}${v.signatures.length ? ` by ${v.signatures[v.signatures.length - 1].signerName}` : ""}`}
        />
        <Panel
          id="engineer-drafts-title"
          title="Drafts"
          empty="No drafts open."
          versions={all.filter((v) => v.status === "draft")}
          detail={(v) => `drafted by ${v.createdBy.name}, waiting for approval`}
        />
      </div>
    </QueryState>
  );
}
