import { createColumnHelper } from "@tanstack/react-table";
import { Link } from "react-router";
import { StatusBadge } from "../../components/StatusBadge";
import { formatDateTime } from "../../lib/formatDateTime";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { formatNumber } from "../vessels/quantityFormat";

const column = createColumnHelper<RateModelVersionView>();

/** Columns of the rate-model versions table. */
export const rateModelColumns = [
  column.accessor((v) => `${v.code} ${v.title}`, {
    id: "model",
    header: "Model",
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
      <Link to={`/rate-models/versions/${info.row.original.id}`} className="font-semibold whitespace-nowrap">
        Version {info.getValue()}
        <span className="sr-only"> of {info.row.original.code}</span>
      </Link>
    ),
  }),
  column.accessor("status", { header: "Status", cell: (info) => <StatusBadge status={info.getValue()} /> }),
  column.accessor((v) => v.derived.epsilonA, { id: "epsilonA", header: "εA", cell: (info) => formatNumber(info.getValue(), 4) }),
  column.accessor((v) => v.content.kRef, {
    id: "kRef",
    header: "k at T ref",
    cell: (info) => <span className="whitespace-nowrap">{`${formatNumber(info.getValue(), 4)} ${info.row.original.derived.kUnit}`}</span>,
  }),
  column.accessor((v) => v.createdBy.name, { id: "createdBy", header: "Drafted by" }),
  column.accessor((v) => v.approvedAt ?? "", { id: "approvedAt", header: "Approved", cell: (info) => formatDateTime(info.row.original.approvedAt) }),
];
