import { createColumnHelper } from "@tanstack/react-table";
import { Link } from "react-router";
import { StatusBadge } from "../../components/StatusBadge";
import { formatDateTime } from "../../lib/formatDateTime";
import { PHASES, type MasterRecordVersionView } from "../../../../shared/schemas/masterRecords";

const column = createColumnHelper<MasterRecordVersionView>();

const stepCount = (v: MasterRecordVersionView) => PHASES.reduce((n, phase) => n + v.content.phases[phase].length, 0);
const criticalCount = (v: MasterRecordVersionView) => PHASES.reduce((n, phase) => n + v.content.phases[phase].filter((s) => s.critical).length, 0);

/** Columns of the master-record versions table. */
export const masterRecordColumns = [
  column.accessor((v) => `${v.code} ${v.title}`, {
    id: "record",
    header: "Master record",
    cell: (info) => (
      <>
        <span className="block font-semibold whitespace-nowrap">{info.row.original.code}</span>
        <span className="block min-w-56 text-[0.9rem] text-ink-700">{info.row.original.title}</span>
      </>
    ),
  }),
  column.accessor("version", {
    header: "Version",
    cell: (info) => (
      <Link to={`/master-records/versions/${info.row.original.id}`} className="font-semibold whitespace-nowrap">
        Version {info.getValue()}
        <span className="sr-only"> of {info.row.original.code}</span>
      </Link>
    ),
  }),
  column.accessor("status", { header: "Status", cell: (info) => <StatusBadge status={info.getValue()} /> }),
  column.accessor(stepCount, { id: "steps", header: "Steps" }),
  column.accessor(criticalCount, { id: "critical", header: "Critical steps" }),
  column.accessor((v) => v.createdBy.name, { id: "createdBy", header: "Drafted by" }),
  column.accessor((v) => v.approvedAt ?? "", { id: "approvedAt", header: "Approved", cell: (info) => formatDateTime(info.row.original.approvedAt) }),
];
