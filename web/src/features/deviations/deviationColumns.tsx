import { createColumnHelper } from "@tanstack/react-table";
import { Link } from "react-router";
import type { Role } from "../../../../shared/schemas/roles";
import { formatDateTime } from "../../lib/formatDateTime";
import { DeviationActions } from "./DeviationActions";
import { DeviationStatusBadge, SeverityLabel } from "./DeviationStatusBadge";
import { DEVIATION_STATUS_WORDS, SEVERITY_WORDS, sourceWords } from "./deviationWords";
import type { DeviationListRow } from "./types";

const column = createColumnHelper<DeviationListRow>();

/** Columns of the deviations table; the last offers investigate or close to those who may. */
export function deviationColumns(roles: readonly Role[], onMessage: (tone: "success" | "error", text: string) => void) {
  return [
    column.accessor("batchCode", {
      header: "Batch",
      cell: (info) => (
        <Link to={`/batches/${info.row.original.batchId}`} className="inline-flex min-h-11 items-center font-semibold whitespace-nowrap">
          {info.getValue()}
        </Link>
      ),
    }),
    column.accessor((d) => `${d.title} ${d.description}`, {
      id: "what",
      header: "Deviation",
      cell: (info) => {
        const d = info.row.original;
        return (
          <>
            <span className="block font-semibold">{d.title}</span>
            <span className="block min-w-64 text-[0.95rem] whitespace-pre-wrap">{d.description}</span>
            <span className="block text-[0.9rem] text-ink-700">{sourceWords(d.source)}</span>
            {d.rootCause && <span className="block text-[0.95rem]">Root cause: {d.rootCause}</span>}
            {d.action && <span className="block text-[0.95rem]">Action: {d.action}</span>}
          </>
        );
      },
    }),
    column.accessor((d) => SEVERITY_WORDS[d.severity], { id: "severity", header: "Severity", cell: (info) => <SeverityLabel severity={info.row.original.severity} /> }),
    column.accessor((d) => DEVIATION_STATUS_WORDS[d.status], { id: "status", header: "Status", cell: (info) => <DeviationStatusBadge status={info.row.original.status} /> }),
    column.accessor("raisedAt", { header: "Raised", cell: (info) => <span className="whitespace-nowrap">{formatDateTime(info.getValue())}</span> }),
    column.display({
      id: "actions",
      header: "Your action",
      cell: (info) => (
        <div className="flex flex-col gap-2">
          <DeviationActions deviation={info.row.original} roles={roles} batchCode={info.row.original.batchCode} onMessage={onMessage} />
        </div>
      ),
    }),
  ];
}
