"use client";

import { useEffect, useState } from "react";
import {
  FlexRender,
  columnFilteringFeature,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
} from "@tanstack/react-table";

/** One feature set for every table in the product: sort by header, search, pages. */
export const dataTableFeatures = tableFeatures({
  columnFilteringFeature,
  globalFilteringFeature,
  rowSortingFeature,
  rowPaginationFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  paginatedRowModel: createPaginatedRowModel(),
  filterFns: { includesString: filterFn_includesString },
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, basic: sortFn_basic, datetime: sortFn_datetime },
});

export type DataColumn<T extends RowData> = ColumnDef<typeof dataTableFeatures, T>;

type Props<T extends RowData> = {
  data: T[];
  columns: DataColumn<T>[];
  /** What the search box looks through, said in its label, e.g. "name or e-mail". */
  searchLabel: string;
  pageSize?: number;
  rowId: (row: T) => string;
  empty: string;
  /** Told how many rows the search leaves, so a count beside the table can follow it. */
  onShownChange?: (shown: number) => void;
};

export function DataTable<T extends RowData>({
  data,
  columns,
  searchLabel,
  pageSize = 25,
  rowId,
  empty,
  onShownChange,
}: Props<T>) {
  const [query, setQuery] = useState("");
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId: (row) => rowId(row),
    globalFilterFn: "includesString",
    state: { globalFilter: query },
    onGlobalFilterChange: (updater) =>
      setQuery((q) => String(typeof updater === "function" ? updater(q) : (updater ?? ""))),
    initialState: { pagination: { pageIndex: 0, pageSize } },
  });
  const rows = table.getRowModel().rows;
  const total = table.getFilteredRowModel().rows.length;
  const pageCount = Math.max(1, table.getPageCount());
  const pageIndex = table.state.pagination.pageIndex;
  useEffect(() => onShownChange?.(total), [onShownChange, total]);

  return (
    <div className="space-y-3">
      <label className="block max-w-sm">
        <span className="label">Search {searchLabel}</span>
        <input type="search" className="field" value={query} onChange={(e) => setQuery(e.target.value)} />
      </label>
      <div className="relative overflow-x-auto rounded-lg border border-rack-light bg-paper-raised">
        <table className="w-full border-collapse text-left">
          <thead className="bg-paper-sunk">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
                      className="px-3 py-2 font-semibold"
                    >
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="flex min-h-tap items-center gap-1 font-semibold"
                        >
                          <FlexRender header={header} />
                          <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                        </button>
                      ) : (
                        <FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="border-t border-rack-light">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2 align-middle">
                    <FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-soft">
                  {query ? `Nothing matches “${query}”.` : empty}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span>
          {total} {total === 1 ? "row" : "rows"} · page {pageIndex + 1} of {pageCount}
        </span>
        <button
          type="button"
          className="btn-quiet"
          onClick={() => table.previousPage()}
          disabled={!table.getCanPreviousPage()}
        >
          Previous page
        </button>
        <button type="button" className="btn-quiet" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Next page
        </button>
      </div>
    </div>
  );
}
