import { createColumnHelper } from "@tanstack/react-table";
import { StatusBadge } from "../../components/StatusBadge";
import type { VesselView } from "../../../../shared/schemas/vessels";
import { formatInUnit } from "./quantityFormat";

const column = createColumnHelper<VesselView>();

export type VesselAction = { kind: "edit" | "status"; vessel: VesselView };

const actionButton =
  "min-h-11 rounded-md border-2 border-ink-400 bg-white px-3 font-semibold whitespace-nowrap hover:bg-ink-100";

/** Columns of the vessel register, each value in the unit it was entered in. */
export function vesselColumns(onAction: (action: VesselAction) => void) {
  return [
    // Tag and description share a cell (and the filter text) to keep the row actions in view.
    column.accessor((v) => `${v.tag} ${v.description}`, {
      id: "tag",
      header: "Vessel",
      cell: (info) => (
        <>
          <span className="block font-semibold whitespace-nowrap">{info.row.original.tag}</span>
          <span className="block min-w-48 text-[0.9rem] text-ink-700">{info.row.original.description}</span>
        </>
      ),
    }),
    column.accessor("status", { header: "Status", cell: (info) => <StatusBadge status={info.getValue()} /> }),
    column.accessor("mawpPa", { header: "MAWP", cell: (info) => formatInUnit(info.getValue(), info.row.original.entered.pressureUnit) }),
    column.accessor("reliefSetPa", {
      header: "Relief set",
      cell: (info) => formatInUnit(info.getValue(), info.row.original.entered.pressureUnit),
    }),
    column.accessor("maxVolumeL", {
      header: "Rated working volume",
      cell: (info) => {
        const v = info.row.original;
        return (
          <span className="whitespace-nowrap">
            {formatInUnit(v.minVolumeL, v.entered.volumeUnit)} to {formatInUnit(v.maxVolumeL, v.entered.volumeUnit)}
          </span>
        );
      },
    }),
    column.accessor((v) => v.boreAreaM2 ?? -1, {
      id: "bore",
      header: "Bore area",
      cell: (info) => formatInUnit(info.row.original.boreAreaM2, info.row.original.entered.areaUnit),
    }),
    column.display({
      id: "actions",
      header: "Actions",
      cell: (info) => {
        const vessel = info.row.original;
        return (
          <div className="flex w-52 flex-wrap gap-2">
            {vessel.abilities.edit && (
              <button type="button" className={actionButton} onClick={() => onAction({ kind: "edit", vessel })}>
                Edit<span className="sr-only"> {vessel.tag}</span>
              </button>
            )}
            {vessel.abilities.changeStatus && (
              <button type="button" className={actionButton} onClick={() => onAction({ kind: "status", vessel })}>
                {vessel.status === "in-service" ? "Take out of service" : "Return to service"}
                <span className="sr-only"> {vessel.tag}</span>
              </button>
            )}
            {!vessel.abilities.edit && !vessel.abilities.changeStatus && <span className="text-ink-600">—</span>}
          </div>
        );
      },
    }),
  ];
}
