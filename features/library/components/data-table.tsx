"use client";

import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo, useState, type ReactNode } from "react";
import { buttonStyles } from "@/features/ui/button-styles";

// The Stockroom's table: sortable headers, a text filter over every column, an origin filter and
// paging, all in the browser (a library is hundreds of rows, not millions).
export type OriginFilter = "all" | "builtin" | "organization" | "hidden";

interface Props<T extends { id: string; origin: string; hidden: boolean }> {
  label: string;
  rows: T[];
  // TanStack's documented column type: each column's value type differs.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<T, any>[];
  showHidden: boolean;
  pageSize?: number;
  toolbar?: ReactNode;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- shared by every row type
const containsText: FilterFn<any> = (row, _columnId, value: string) => {
  const needle = value.trim().toLowerCase();
  if (!needle) return true;
  return row.getAllCells().some((c) =>
    String(c.getValue() ?? "")
      .toLowerCase()
      .includes(needle),
  );
};

export function DataTable<T extends { id: string; origin: string; hidden: boolean }>({
  label,
  rows,
  columns,
  showHidden,
  pageSize = 15,
  toolbar,
}: Props<T>) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const [origin, setOrigin] = useState<OriginFilter>("all");
  const data = useMemo(
    () =>
      rows.filter((r) =>
        origin === "all"
          ? showHidden || !r.hidden
          : origin === "hidden"
            ? r.hidden
            : r.origin === origin && (showHidden || !r.hidden),
      ),
    [rows, origin, showHidden],
  );
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: containsText,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize } },
    getRowId: (r) => r.id,
    autoResetPageIndex: true,
    // Every column sorts ascending on the first click (TanStack starts numbers descending by default).
    sortDescFirst: false,
  });
  const { pageIndex } = table.getState().pagination;
  const count = table.getFilteredRowModel().rows.length;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-table text-ink-700">
          Filter
          <input
            type="search"
            value={globalFilter}
            onChange={(e) => setGlobalFilter(e.target.value)}
            placeholder="Any column…"
            className="w-64 rounded-plate border border-ink-200 bg-white px-3 py-1.5 text-body"
            aria-label={`Filter ${label}`}
          />
        </label>
        <label className="flex flex-col gap-1 text-table text-ink-700">
          Rows
          <select
            value={origin}
            onChange={(e) => setOrigin(e.target.value as OriginFilter)}
            className="rounded-plate border border-ink-200 bg-white px-2 py-1.5 text-body"
          >
            <option value="all">All</option>
            <option value="organization">Ours</option>
            <option value="builtin">Built-in</option>
            {showHidden ? <option value="hidden">Hidden built-in</option> : null}
          </select>
        </label>
        <div className="ml-auto flex flex-wrap gap-2">{toolbar}</div>
      </div>
      <div className="overflow-x-auto rounded-plate border border-ink-100 bg-white shadow-plate">
        <table className="w-full text-table" aria-label={label}>
          <thead className="bg-steel-50 text-left text-ink-700">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      aria-sort={
                        sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined
                      }
                      className="whitespace-nowrap px-3 py-2 font-medium"
                    >
                      {h.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={h.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 hover:text-ink-900"
                        >
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden className="text-micro text-ink-400">
                            {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                          </span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                className={`border-t border-ink-100 ${row.original.hidden ? "text-ink-400" : ""}`}
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-1.5 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {count === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-500">
                  No rows match.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <div className="flex items-center gap-3 text-table text-ink-700">
        <span>
          {count} row{count === 1 ? "" : "s"}
        </span>
        <span className="ml-auto">
          Page {count === 0 ? 0 : pageIndex + 1} of {table.getPageCount()}
        </span>
        <button
          type="button"
          className={buttonStyles.quiet}
          onClick={() => table.previousPage()}
          disabled={!table.getCanPreviousPage()}
        >
          Previous
        </button>
        <button
          type="button"
          className={buttonStyles.quiet}
          onClick={() => table.nextPage()}
          disabled={!table.getCanNextPage()}
        >
          Next
        </button>
      </div>
    </div>
  );
}
