import { useId, useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { DataTable } from "../components/DataTable";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { SelectInput } from "../components/SelectInput";
import { deviationColumns } from "../features/deviations/deviationColumns";
import { deviationListQueryOptions } from "../features/deviations/queries";
import type { DeviationStatusFilter } from "../features/deviations/types";
import { useSession } from "../features/session/useSession";

const FILTERS: { value: DeviationStatusFilter; label: string }[] = [
  { value: "not-closed", label: "Not closed yet" },
  { value: "open", label: "Open (to investigate)" },
  { value: "investigated", label: "Investigated (to close)" },
  { value: "closed", label: "Closed" },
];

/** Deviations across batches: supervisors investigate open ones, quality closes investigated ones with a signature. */
export default function Deviations() {
  const filterId = useId();
  const { user } = useSession();
  const [status, setStatus] = useState<DeviationStatusFilter>("not-closed");
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const deviations = useQuery(deviationListQueryOptions(status));
  const roles = user?.roles;
  const columns = useMemo(() => deviationColumns(roles ?? [], (tone, text) => setMessage({ tone, text })), [roles]);
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Deviations">
        <p>Every departure from a batch's master record or its limits, raised by a person or by the safety checks. An open deviation stops the batch's release.</p>
      </PageIntro>
      <div aria-live="polite" className="empty:hidden">
        {message && <Notice tone={message.tone}>{message.text}</Notice>}
      </div>
      <div className="flex flex-col gap-1 self-start">
        <label htmlFor={filterId} className="font-semibold">
          Show
        </label>
        <SelectInput id={filterId} value={status} onChange={(e) => setStatus(e.target.value as DeviationStatusFilter)}>
          {FILTERS.map((f) => (
            <option key={f.value} value={f.value}>
              {f.label}
            </option>
          ))}
        </SelectInput>
      </div>
      <QueryState isPending={deviations.isPending} error={deviations.error} onRetry={() => void deviations.refetch()} what="the deviations">
        <DataTable
          caption="Deviations"
          data={deviations.data ?? []}
          columns={columns}
          getRowId={(d) => d.id}
          emptyMessage="No deviations to show."
          filterLabel="Filter deviations"
        />
      </QueryState>
    </div>
  );
}
