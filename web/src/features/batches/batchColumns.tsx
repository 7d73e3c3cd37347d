import { createColumnHelper } from "@tanstack/react-table";
import { Link } from "react-router";
import { BatchStateBadge } from "../../components/BatchStateBadge";
import { formatDateTime } from "../../lib/formatDateTime";
import { formatNumber } from "../vessels/quantityFormat";
import { STATE_WORDS } from "./batchStates";
import type { BatchListRow } from "./types";

const column = createColumnHelper<BatchListRow>();

/** Columns of the batches table. */
export const batchColumns = [
  column.accessor("code", {
    header: "Batch",
    cell: (info) => (
      <Link to={`/batches/${info.row.original.id}`} className="inline-flex min-h-11 items-center font-semibold whitespace-nowrap">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((b) => STATE_WORDS[b.state], { id: "state", header: "State", cell: (info) => <BatchStateBadge state={info.row.original.state} /> }),
  column.accessor("campaignCode", { header: "Campaign" }),
  column.accessor("vesselTag", { header: "Vessel" }),
  column.accessor("v0L", { header: "V0", cell: (info) => <span className="whitespace-nowrap">{formatNumber(info.getValue())} L</span> }),
  column.accessor("createdAt", { header: "Planned", cell: (info) => formatDateTime(info.getValue()) }),
];
