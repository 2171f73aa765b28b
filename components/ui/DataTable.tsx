"use client";

import { useMemo, useState } from "react";
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  tableFeatures,
  useTable,
  type RowData,
  type SortingState,
} from "@tanstack/react-table";

export interface DataColumn<Row extends RowData> {
  id: string;
  header: string;
  /** What sorting compares; also what the cell shows when `cell` is absent. */
  value: (row: Row) => string | number | null;
  cell?: (row: Row) => React.ReactNode;
  align?: "left" | "right";
  sortable?: boolean;
}

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric },
});

/** A sortable table of plain rows; the caller states columns in plain terms. */
export function DataTable<Row extends RowData>({
  rows,
  columns,
  caption,
  rowKey,
  rowClassName,
  emptyText = "Nothing to show.",
}: {
  rows: Row[];
  columns: DataColumn<Row>[];
  caption?: string;
  rowKey: (row: Row) => string;
  rowClassName?: (row: Row) => string;
  emptyText?: string;
}) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const tableColumns = useMemo(() => {
    const helper = createColumnHelper<typeof features, Row>();
    return helper.columns(
      columns.map((column) =>
        helper.accessor((row: Row) => column.value(row) ?? undefined, {
          id: column.id,
          header: column.header,
          enableSorting: column.sortable !== false,
          sortUndefined: "last",
          cell: (context) => (column.cell ? column.cell(context.row.original) : String(column.value(context.row.original) ?? "–")),
        }),
      ),
    );
  }, [columns]);
  const table = useTable({ features, columns: tableColumns, data: rows, state: { sorting }, onSortingChange: setSorting, getRowId: (row: Row) => rowKey(row) });

  return (
    <div className="overflow-x-auto rounded border border-soil-200 bg-white">
      <table className="w-full text-sm">
        {caption && <caption className="px-3 py-2 text-left text-sm text-soil-700">{caption}</caption>}
        <thead className="bg-soil-100 text-soil-700">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const column = columns.find((entry) => entry.id === header.column.id);
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                    className={`px-3 py-2 font-medium ${column?.align === "right" ? "text-right" : "text-left"}`}
                  >
                    {header.column.getCanSort() ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:underline">
                        <table.FlexRender header={header} />
                        <span aria-hidden>{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.length === 0 && (
            <tr>
              <td colSpan={columns.length} className="px-3 py-4 text-soil-700">
                {emptyText}
              </td>
            </tr>
          )}
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={`border-t border-soil-100 ${rowClassName?.(row.original) ?? ""}`}>
              {row.getAllCells().map((cell) => {
                const column = columns.find((entry) => entry.id === cell.column.id);
                return (
                  <td key={cell.id} className={`px-3 py-1.5 ${column?.align === "right" ? "text-right tabular-nums" : ""}`}>
                    <table.FlexRender cell={cell} />
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
