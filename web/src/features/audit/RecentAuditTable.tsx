import { useQuery } from "@tanstack/react-query";
import { createColumnHelper } from "@tanstack/react-table";
import type { AuditEvent } from "../../api/types";
import { DataTable } from "../../components/DataTable";
import { QueryState } from "../../components/QueryState";
import { formatDateTime } from "../../lib/formatDateTime";
import { auditEventsQueryOptions } from "./queries";

const column = createColumnHelper<AuditEvent>();

const columns = [
  column.accessor("seq", { header: "Entry" }),
  column.accessor("occurredAt", { header: "When", cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor((event) => event.actorName ?? "System", { id: "actor", header: "Who" }),
  column.accessor("action", { header: "Action" }),
  column.accessor((event) => `${event.entityType} ${event.entityId}`, { id: "entity", header: "Record" }),
  column.accessor((event) => event.reason ?? "", {
    id: "reason",
    header: "Reason",
    cell: (info) => info.getValue() || "—",
  }),
];

/** The latest audit trail entries: who did what, when, and why. */
export function RecentAuditTable({ limit = 50 }: { limit?: number }) {
  const events = useQuery(auditEventsQueryOptions({ limit }));
  return (
    <section aria-labelledby="recent-audit-title" className="flex flex-col gap-3">
      <h2 id="recent-audit-title" className="text-xl font-bold">
        Latest audit trail entries
      </h2>
      <QueryState
        isPending={events.isPending}
        error={events.error}
        onRetry={() => void events.refetch()}
        what="the audit trail"
      >
        <DataTable
          caption="Latest audit trail entries"
          data={events.data ?? []}
          columns={columns}
          getRowId={(event) => String(event.seq)}
          emptyMessage="The audit trail has no entries yet."
          filterLabel="Filter entries"
          initialSorting={[{ id: "seq", desc: true }]}
        />
      </QueryState>
    </section>
  );
}
