import { useId, useState } from "react";
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from "@tanstack/react-table";

export interface DataTableProps<Row> {
  /** Describes the table for screen readers and as its visible title. */
  caption: string;
  data: Row[];
  // Column value types differ per column, so the list is typed loosely by design.
  columns: ColumnDef<Row, any>[];
  getRowId: (row: Row) => string;
  emptyMessage: string;
  filterLabel?: string;
  initialSorting?: SortingState;
}

function sortLabel(direction: false | "asc" | "desc"): "ascending" | "descending" | "none" {
  if (direction === "asc") return "ascending";
  if (direction === "desc") return "descending";
  return "none";
}

/** A sortable table with one text filter across all columns. */
export function DataTable<Row>({
  caption,
  data,
  columns,
  getRowId,
  emptyMessage,
  filterLabel = "Filter",
  initialSorting = [],
}: DataTableProps<Row>) {
  const filterId = useId();
  const countId = useId();
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const [globalFilter, setGlobalFilter] = useState("");

  const table = useReactTable({
    data,
    columns,
    getRowId,
    state: { sorting, globalFilter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const rows = table.getRowModel().rows;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-64 flex-col gap-1">
          <label htmlFor={filterId} className="font-semibold">
            {filterLabel}
          </label>
          <input
            id={filterId}
            type="search"
            value={globalFilter}
            onChange={(event) => setGlobalFilter(event.target.value)}
            aria-describedby={countId}
            className="min-h-11 rounded-md border-2 border-ink-400 bg-white px-3 py-1.5"
          />
        </div>
        <p id={countId} aria-live="polite" className="pb-2 text-ink-600">
          {rows.length === data.length
            ? `${data.length} ${data.length === 1 ? "row" : "rows"}`
            : `${rows.length} of ${data.length} rows match`}
        </p>
      </div>
      {/* relative: keeps visually hidden (absolutely placed) labels inside the scroll box. */}
      <div className="relative overflow-x-auto rounded-md border-2 border-ink-200 bg-white">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-ink-100">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const canSort = header.column.getCanSort();
                  const direction = header.column.getIsSorted();
                  const label = flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={canSort ? sortLabel(direction) : undefined}
                      className="border-b-2 border-ink-300 px-3 py-1 align-middle font-semibold whitespace-nowrap"
                    >
                      {header.isPlaceholder ? null : canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex min-h-11 items-center gap-1 rounded-sm font-semibold hover:text-fen-700"
                        >
                          {label}
                          <span aria-hidden="true" className="w-4 text-fen-700">
                            {direction === "asc" ? "▲" : direction === "desc" ? "▼" : "↕"}
                          </span>
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-4 text-ink-600">
                  {data.length === 0 ? emptyMessage : "No rows match the filter."}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr key={row.id} className="border-b border-ink-200 last:border-b-0 even:bg-ink-50">
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="px-3 py-2 align-top">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
