"use client";

import type { ColumnVisibilityState } from "@tanstack/react-table";
import type { ReactNode } from "react";
import { DataTable, type ServerColumn } from "./data-table";
import { ErrorPanel } from "./error-panel";
import type { ServerList } from "./use-server-list";

const NO_ROWS: never[] = [];

/**
 * The table of a list kept by `useServerList`: the current page of rows with
 * its sorting and paging wired to the list, and the error (with a retry)
 * above it when the page could not be loaded.
 */
export function ServerListTable<Row extends { id: string }>({
  list,
  caption,
  columns,
  initialVisibility,
  empty,
}: {
  list: ServerList<Row>;
  caption: string;
  columns: ServerColumn<Row>[];
  initialVisibility?: ColumnVisibilityState;
  /** Shown when the page has no rows. */
  empty: ReactNode;
}) {
  return (
    <>
      {list.error ? <ErrorPanel message={(list.error as Error).message} onRetry={() => list.mutate()} /> : null}
      <DataTable
        caption={caption}
        columns={columns}
        rows={list.data?.rows ?? NO_ROWS}
        total={list.data?.total ?? 0}
        sorting={list.sorting}
        onSortingChange={list.setSorting}
        pagination={list.pagination}
        onPaginationChange={list.setPagination}
        initialVisibility={initialVisibility}
        loading={list.isLoading}
        getRowId={(row) => row.id}
        empty={empty}
      />
    </>
  );
}
