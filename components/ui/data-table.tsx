"use client";

import {
  columnVisibilityFeature,
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type ColumnDef,
  type ColumnVisibilityState,
  type PaginationState,
  type RowData,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useId, useState, type ReactNode } from "react";
import { Button } from "./button";
import { TableSkeleton } from "./skeleton";

/** Sorting, paging and column choice; rows are sorted, filtered and paged on the server. */
const serverTableFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature, columnVisibilityFeature });
type ServerTableFeatures = typeof serverTableFeatures;
export type ServerColumn<T extends RowData> = ColumnDef<ServerTableFeatures, T>;

/** The always-shown "Name" column of a list, linking each row to its own page. */
export function nameLinkColumn<T extends { id: string; name: string }>(hrefOf: (row: T) => string): ServerColumn<T> {
  return {
    id: "name",
    accessorKey: "name",
    header: "Name",
    enableHiding: false,
    cell: ({ row }) => (
      <Link href={hrefOf(row.original)} className="font-medium text-ink underline-offset-2 hover:text-accent hover:underline">
        {row.original.name}
      </Link>
    ),
  };
}

interface DataTableProps<T extends RowData> {
  caption: string;
  columns: ServerColumn<T>[];
  rows: T[];
  total: number;
  sorting: SortingState;
  onSortingChange: (next: SortingState) => void;
  pagination: PaginationState;
  onPaginationChange: (next: PaginationState) => void;
  initialVisibility?: ColumnVisibilityState;
  loading?: boolean;
  /** Shown when there are no rows. */
  empty: ReactNode;
  getRowId: (row: T) => string;
  /** Page sizes offered. */
  pageSizes?: number[];
}

/** A dense, keyboard-usable table whose sorting and paging are done by the API. */
export function DataTable<T extends RowData>({
  caption,
  columns,
  rows,
  total,
  sorting,
  onSortingChange,
  pagination,
  onPaginationChange,
  initialVisibility = {},
  loading = false,
  empty,
  getRowId,
  pageSizes = [10, 25, 50, 100],
}: DataTableProps<T>) {
  const [columnVisibility, setColumnVisibility] = useState<ColumnVisibilityState>(initialVisibility);
  const pickerId = useId();
  const table = useTable({
    features: serverTableFeatures,
    columns,
    data: rows,
    getRowId,
    manualSorting: true,
    manualPagination: true,
    rowCount: total,
    state: { sorting, pagination, columnVisibility },
    onSortingChange: (updater) => onSortingChange(typeof updater === "function" ? updater(sorting) : updater),
    onPaginationChange: (updater) => onPaginationChange(typeof updater === "function" ? updater(pagination) : updater),
    onColumnVisibilityChange: (updater) =>
      setColumnVisibility((prev) => (typeof updater === "function" ? updater(prev) : updater)),
  });

  const pageCount = Math.max(1, Math.ceil(total / pagination.pageSize));
  const first = total === 0 ? 0 : pagination.pageIndex * pagination.pageSize + 1;
  const last = Math.min(total, (pagination.pageIndex + 1) * pagination.pageSize);

  return (
    <div className="flex flex-col gap-2">
      <details className="relative self-end text-sm">
        <summary className="cursor-pointer rounded border border-rule bg-panel px-2 py-1 text-ink">Columns</summary>
        <fieldset className="absolute right-0 z-10 mt-1 flex flex-col gap-1 rounded border border-rule bg-panel p-2 shadow-sm" aria-describedby={pickerId}>
          <legend id={pickerId} className="sr-only">
            Columns to show
          </legend>
          {table.getAllLeafColumns().map((column) => (
            <label key={column.id} className="flex items-center gap-2 whitespace-nowrap">
              <input type="checkbox" checked={column.getIsVisible()} disabled={!column.getCanHide()} onChange={column.getToggleVisibilityHandler()} />
              {typeof column.columnDef.header === "string" ? column.columnDef.header : column.id}
            </label>
          ))}
        </fieldset>
      </details>
      <div className="overflow-x-auto rounded border border-rule bg-panel">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} className="border-b border-rule bg-paper text-left">
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : canSort ? "none" : undefined}
                      className="px-2.5 py-1.5 text-xs font-semibold whitespace-nowrap text-muted"
                    >
                      {header.isPlaceholder ? null : canSort ? (
                        <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:text-ink">
                          <table.FlexRender header={header} />
                          <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
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
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-rule/70 last:border-0 hover:bg-paper/60">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2.5 py-1.5 align-top">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {loading && rows.length === 0 ? (
          <div className="px-3">
            <TableSkeleton rows={5} />
          </div>
        ) : null}
        {!loading && rows.length === 0 ? <div className="px-3 py-4 text-sm text-muted">{empty}</div> : null}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <p className="num text-muted" aria-live="polite">
          {loading ? "Loading…" : `${first}–${last} of ${total}`}
        </p>
        <div className="flex items-center gap-2">
          <label className="flex items-center gap-1 text-muted">
            Rows
            <select
              className="rounded border border-rule bg-panel px-1 py-0.5 text-ink"
              value={pagination.pageSize}
              onChange={(e) => onPaginationChange({ pageIndex: 0, pageSize: Number(e.target.value) })}
            >
              {pageSizes.map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </select>
          </label>
          <Button onClick={() => table.previousPage()} disabled={pagination.pageIndex === 0}>
            Previous
          </Button>
          <span className="num text-muted">
            Page {pagination.pageIndex + 1} of {pageCount}
          </span>
          <Button onClick={() => table.nextPage()} disabled={pagination.pageIndex + 1 >= pageCount}>
            Next
          </Button>
        </div>
      </div>
    </div>
  );
}
