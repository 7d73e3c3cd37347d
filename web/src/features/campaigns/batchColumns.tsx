import { createColumnHelper } from "@tanstack/react-table";
import { formatNumber } from "../vessels/quantityFormat";
import type { PlannedBatchView } from "./types";

const column = createColumnHelper<PlannedBatchView>();
const entered = (q: { value: number; unit: string } | undefined) => (q ? `${formatNumber(q.value)} ${q.unit}` : "—");

/** Columns of a campaign's planned batches, with the operating point as it was typed. */
export const batchColumns = [
  column.accessor("code", { header: "Batch", cell: (info) => <span className="font-semibold whitespace-nowrap">{info.getValue()}</span> }),
  column.accessor("vesselTag", { header: "Vessel" }),
  column.accessor("state", { header: "State" }),
  column.accessor("v0L", { header: "V0", cell: (info) => entered(info.row.original.entered?.v0) }),
  column.accessor((b) => b.plan?.finalVolumeL ?? 0, { id: "finalVolume", header: "Final volume", cell: (info) => `${formatNumber(info.getValue(), 4)} L` }),
  column.accessor("temperatureK", { header: "Temperature", cell: (info) => entered(info.row.original.entered?.temperature) }),
  column.accessor("pressurePa", { header: "Pressure", cell: (info) => entered(info.row.original.entered?.pressure) }),
  column.accessor((b) => b.plan?.cA0MolPerL ?? 0, { id: "cA0", header: "CA0", cell: (info) => `${formatNumber(info.getValue(), 4)} mol/L` }),
];
