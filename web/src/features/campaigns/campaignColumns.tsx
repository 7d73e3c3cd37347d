import { createColumnHelper } from "@tanstack/react-table";
import { Link } from "react-router";
import { formatDateTime } from "../../lib/formatDateTime";
import { formatNumber } from "../vessels/quantityFormat";
import type { CampaignView } from "./types";

const column = createColumnHelper<CampaignView>();

/** Columns of the campaigns table. */
export const campaignColumns = [
  column.accessor((c) => `${c.code} ${c.process}`, {
    id: "campaign",
    header: "Campaign",
    cell: (info) => (
      <>
        <Link to={`/campaigns/${info.row.original.id}`} className="block font-semibold whitespace-nowrap">
          {info.row.original.code}
        </Link>
        <span className="block min-w-56 text-[0.9rem] text-ink-700">{info.row.original.process}</span>
      </>
    ),
  }),
  column.accessor((c) => (c.rateModel ? `${c.rateModel.code} v${c.rateModel.version}` : ""), {
    id: "rateModel",
    header: "Rate model",
    cell: (info) => {
      const m = info.row.original.rateModel;
      return m ? (
        <span className="whitespace-nowrap">
          {m.code} version {m.version} (εA {formatNumber(m.epsilonA, 4)})
        </span>
      ) : (
        "—"
      );
    },
  }),
  column.accessor((c) => (c.masterRecord ? `${c.masterRecord.code} v${c.masterRecord.version}` : ""), {
    id: "masterRecord",
    header: "Master record",
    cell: (info) => {
      const r = info.row.original.masterRecord;
      return r ? <span className="whitespace-nowrap">{`${r.code} version ${r.version}`}</span> : "—";
    },
  }),
  column.accessor((c) => c.batches.length, { id: "batches", header: "Planned batches" }),
  column.accessor("createdAt", { header: "Opened", cell: (info) => formatDateTime(info.getValue()) }),
];
