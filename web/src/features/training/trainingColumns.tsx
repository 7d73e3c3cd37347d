import { createColumnHelper, type ColumnDef } from "@tanstack/react-table";
import { Button } from "../../components/Button";
import { formatDateTime } from "../../lib/formatDateTime";
import type { TrainingRecordView } from "../../../../shared/schemas/training";
import { TRAINING_STATUS_WORDS, TrainingStatusBadge } from "./TrainingStatusBadge";

const column = createColumnHelper<TrainingRecordView>();

export interface TrainingColumnOptions {
  /** False on a person's own list, where every row is theirs. */
  showPerson: boolean;
  /** Set for admins and supervisors: opens the withdrawal of a record. */
  onWithdraw?: (record: TrainingRecordView) => void;
}

/** Columns of the training table; the last offers withdrawal to those who may. */
export function trainingColumns({ showPerson, onWithdraw }: TrainingColumnOptions) {
  const columns: ColumnDef<TrainingRecordView, any>[] = [];
  if (showPerson) columns.push(column.accessor((r) => r.person.name, { id: "person", header: "Person", cell: (info) => <span className="font-semibold">{info.getValue()}</span> }));
  columns.push(
    column.accessor((r) => `${r.masterRecord.code} version ${r.masterRecord.version}`, {
      id: "masterRecord",
      header: "Master record",
      cell: (info) => (
        <>
          <span className="block font-semibold whitespace-nowrap">{info.getValue()}</span>
          <span className="block text-[0.9rem] text-ink-700">{info.row.original.masterRecord.title}</span>
        </>
      ),
    }),
    column.accessor("trainedOn", { header: "Trained on", cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span> }),
    column.accessor("validUntil", { header: "Valid until", cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span> }),
    column.accessor((r) => TRAINING_STATUS_WORDS[r.status], {
      id: "status",
      header: "Status",
      cell: (info) => {
        const r = info.row.original;
        return (
          <>
            <TrainingStatusBadge status={r.status} />
            {r.withdrawReason && (
              <span className="mt-1 block min-w-48 text-[0.9rem]">
                {r.withdrawnBy?.name}, {formatDateTime(r.withdrawnAt)}: {r.withdrawReason}
              </span>
            )}
          </>
        );
      },
    }),
    column.accessor((r) => r.recordedBy.name, {
      id: "recordedBy",
      header: "Recorded by",
      cell: (info) => (
        <>
          <span className="block">{info.getValue()}</span>
          <span className="block text-[0.9rem] whitespace-nowrap text-ink-700">{formatDateTime(info.row.original.recordedAt)}</span>
        </>
      ),
    }),
    column.accessor((r) => r.note ?? "", { id: "note", header: "Note", cell: (info) => <span className="block min-w-40 whitespace-pre-wrap">{info.getValue() || "—"}</span> }),
  );
  if (onWithdraw) {
    columns.push(
      column.display({
        id: "actions",
        header: "Your action",
        cell: (info) =>
          info.row.original.status === "withdrawn" ? null : (
            <Button variant="secondary" onClick={() => onWithdraw(info.row.original)}>
              Withdraw<span className="sr-only"> the training of {info.row.original.person.name} on {info.row.original.masterRecord.code} version {info.row.original.masterRecord.version}</span>
            </Button>
          ),
      }),
    );
  }
  return columns;
}
