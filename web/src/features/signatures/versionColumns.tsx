import { createColumnHelper, type ColumnDef } from "@tanstack/react-table";
import { Link } from "react-router";
import { StatusBadge } from "../../components/StatusBadge";
import { formatDateTime } from "../../lib/formatDateTime";

/** What every versioned document's row has (rate models, master records). */
export interface VersionRow {
  id: string;
  code: string;
  title: string;
  version: number;
  status: "draft" | "approved" | "superseded";
  createdBy: { name: string };
  approvedAt: string | null;
}

/** The columns every versions table shares, with the document's own columns after the status. */
export function versionColumns<T extends VersionRow>(documentLabel: string, versionsPath: string, own: ColumnDef<T, any>[]): ColumnDef<T, any>[] {
  const column = createColumnHelper<T>();
  return [
    column.accessor((v) => `${v.code} ${v.title}`, {
      id: "document",
      header: documentLabel,
      cell: (info) => (
        <>
          <span className="block font-semibold whitespace-nowrap">{info.row.original.code}</span>
          <span className="block min-w-56 text-[0.9rem] text-ink-700">{info.row.original.title}</span>
        </>
      ),
    }),
    column.accessor((v) => v.version, {
      id: "version",
      header: "Version",
      cell: (info) => (
        <Link to={`${versionsPath}/${info.row.original.id}`} className="font-semibold whitespace-nowrap">
          Version {info.getValue()}
          <span className="sr-only"> of {info.row.original.code}</span>
        </Link>
      ),
    }),
    column.accessor((v) => v.status, { id: "status", header: "Status", cell: (info) => <StatusBadge status={info.getValue()} /> }),
    ...own,
    column.accessor((v) => v.createdBy.name, { id: "createdBy", header: "Drafted by" }),
    column.accessor((v) => v.approvedAt ?? "", { id: "approvedAt", header: "Approved", cell: (info) => formatDateTime(info.row.original.approvedAt) }),
  ];
}
