import { createColumnHelper } from "@tanstack/react-table";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { formatNumber } from "../vessels/quantityFormat";
import { versionColumns } from "../signatures/versionColumns";

const column = createColumnHelper<RateModelVersionView>();

/** Columns of the rate-model versions table. */
export const rateModelColumns = versionColumns<RateModelVersionView>("Model", "/rate-models/versions", [
  column.accessor((v) => v.derived.epsilonA, { id: "epsilonA", header: "εA", cell: (info) => formatNumber(info.getValue(), 4) }),
  column.accessor((v) => v.content.kRef, {
    id: "kRef",
    header: "k at T ref",
    cell: (info) => <span className="whitespace-nowrap">{`${formatNumber(info.getValue(), 4)} ${info.row.original.derived.kUnit}`}</span>,
  }),
]);
