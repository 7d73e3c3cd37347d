import { createColumnHelper } from "@tanstack/react-table";
import { PHASES, type MasterRecordVersionView } from "../../../../shared/schemas/masterRecords";
import { versionColumns } from "../signatures/versionColumns";

const column = createColumnHelper<MasterRecordVersionView>();

const stepCount = (v: MasterRecordVersionView) => PHASES.reduce((n, phase) => n + v.content.phases[phase].length, 0);
const criticalCount = (v: MasterRecordVersionView) => PHASES.reduce((n, phase) => n + v.content.phases[phase].filter((s) => s.critical).length, 0);

/** Columns of the master-record versions table. */
export const masterRecordColumns = versionColumns<MasterRecordVersionView>("Master record", "/master-records/versions", [
  column.accessor(stepCount, { id: "steps", header: "Steps" }),
  column.accessor(criticalCount, { id: "critical", header: "Critical steps" }),
]);
