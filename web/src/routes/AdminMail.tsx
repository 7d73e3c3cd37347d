import { useQuery } from "@tanstack/react-query";
import { createColumnHelper } from "@tanstack/react-table";
import { Link } from "react-router";
import type { OutboxMessage, ReceivedMessage } from "../api/types";
import { Button } from "../components/Button";
import { DataTable } from "../components/DataTable";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { outboxQueryOptions, receivedMailQueryOptions } from "../features/mail/queries";
import { formatDateTime } from "../lib/formatDateTime";

const outboxColumn = createColumnHelper<OutboxMessage>();
const outboxColumns = [
  outboxColumn.accessor("to", { header: "To" }),
  outboxColumn.accessor("subject", { header: "Subject" }),
  outboxColumn.accessor("status", {
    header: "Status",
    cell: (info) => (info.getValue() === "sent" ? "Sent" : "Queued"),
  }),
  outboxColumn.accessor("attempts", { header: "Attempts" }),
  outboxColumn.accessor((message) => message.lastError ?? "", {
    id: "lastError",
    header: "Last error",
    cell: (info) => info.getValue() || "—",
  }),
  outboxColumn.accessor((message) => message.nextAttemptAt ?? "", {
    id: "nextAttemptAt",
    header: "Next attempt",
    cell: (info) => formatDateTime(info.row.original.nextAttemptAt),
  }),
  outboxColumn.accessor("createdAt", { header: "Queued at", cell: (info) => formatDateTime(info.getValue()) }),
  outboxColumn.accessor((message) => message.sentAt ?? "", {
    id: "sentAt",
    header: "Sent at",
    cell: (info) => formatDateTime(info.row.original.sentAt),
  }),
];

const receivedColumn = createColumnHelper<ReceivedMessage>();
const receivedColumns = [
  receivedColumn.accessor("date", { header: "Received", cell: (info) => formatDateTime(info.getValue()) }),
  receivedColumn.accessor("from", { header: "From" }),
  receivedColumn.accessor("to", { header: "To" }),
  receivedColumn.accessor("subject", { header: "Subject" }),
  receivedColumn.accessor("text", {
    header: "Message",
    enableSorting: false,
    cell: (info) => (
      <details>
        <summary className="flex min-h-11 cursor-pointer items-center font-semibold text-fen-700">
          Show text
        </summary>
        <pre className="mt-1 max-w-xl font-sans whitespace-pre-wrap">{info.getValue()}</pre>
      </details>
    ),
  }),
];

/** The administrator's mail screen: Isobatch's outbox and what the mail catcher received. */
export default function AdminMail() {
  const outbox = useQuery(outboxQueryOptions());
  const received = useQuery(receivedMailQueryOptions());

  return (
    <div className="flex flex-col gap-8">
      <p>
        <Link to="/admin">Administrator</Link> <span aria-hidden="true">›</span> Mail
      </p>
      <PageIntro title="Mail">
        <p>Messages Isobatch has queued or sent, and what the local mail catcher has received. Both lists refresh every 15 seconds.</p>
      </PageIntro>

      <section aria-labelledby="outbox-title" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h2 id="outbox-title" className="text-2xl font-bold">Outbox</h2>
          <Button variant="secondary" busy={outbox.isFetching} onClick={() => void outbox.refetch()}>
            Refresh outbox
          </Button>
        </div>
        <QueryState isPending={outbox.isPending} error={outbox.error} onRetry={() => void outbox.refetch()} what="the outbox">
          <DataTable
            caption="Outbox"
            data={outbox.data ?? []}
            columns={outboxColumns}
            getRowId={(message) => message.id}
            emptyMessage="Nothing has been queued yet."
            filterLabel="Filter the outbox"
            initialSorting={[{ id: "createdAt", desc: true }]}
          />
        </QueryState>
      </section>

      <section aria-labelledby="received-title" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h2 id="received-title" className="text-2xl font-bold">Received by the mail catcher</h2>
          <Button variant="secondary" busy={received.isFetching} onClick={() => void received.refetch()}>
            Refresh received mail
          </Button>
        </div>
        <QueryState isPending={received.isPending} error={received.error} onRetry={() => void received.refetch()} what="the received mail">
          <DataTable
            caption="Received by the mail catcher"
            data={received.data ?? []}
            columns={receivedColumns}
            getRowId={(message) => message.id}
            emptyMessage="The mail catcher has received nothing yet."
            filterLabel="Filter received mail"
            initialSorting={[{ id: "date", desc: true }]}
          />
        </QueryState>
      </section>
    </div>
  );
}
