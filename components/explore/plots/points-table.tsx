"use client";

import { useMemo, useState } from "react";
import type { PaginationState, SortingState } from "@tanstack/react-table";
import { DataTable, type ServerColumn } from "@/components/ui/data-table";
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import { pointColumns, sortedPoints, tableCaption } from "./points-columns";

export interface PointsTableProps {
  run: ExplorationRun;
  outputs: OutputInfo[];
}

/** One table row: the point's index in the grid's order. */
interface PointRow {
  p: number;
}

const PAGE_SIZES = [25, 50, 100, 250];

/**
 * The run's points as a table (for screen readers and for reading figures
 * exactly): the variables, each figure with its unit and the thermal verdict
 * in words, sortable by any column and paged, so 10,000 points stay light
 * (only the shown page's rows are built).
 */
export function PointsTable({ run, outputs }: PointsTableProps) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 25 });
  const specs = useMemo(() => pointColumns(run, outputs), [run, outputs]);
  const order = useMemo(() => sortedPoints(run.plan.count, specs, sorting), [run.plan.count, specs, sorting]);
  const columns = useMemo<ServerColumn<PointRow>[]>(
    () =>
      specs.map((c) => ({
        id: c.id,
        header: c.header,
        accessorFn: (row: PointRow) => c.sortValue(row.p),
        enableHiding: c.id !== "point",
        cell: ({ row }) => <span className={c.numeric ? "num block text-right whitespace-nowrap" : "whitespace-nowrap"}>{c.text(row.original.p)}</span>,
      })),
    [specs],
  );
  const start = pagination.pageIndex * pagination.pageSize;
  const rows = useMemo(() => Array.from(order.subarray(start, start + pagination.pageSize), (p) => ({ p })), [order, start, pagination.pageSize]);
  return (
    <div data-testid="points-table" data-points={run.plan.count}>
      <DataTable<PointRow>
        caption={tableCaption(run, outputs)}
        columns={columns}
        rows={rows}
        total={run.plan.count}
        sorting={sorting}
        onSortingChange={(next) => {
          setSorting(next);
          setPagination((prev) => ({ ...prev, pageIndex: 0 }));
        }}
        pagination={pagination}
        onPaginationChange={setPagination}
        empty="This exploration has no points."
        getRowId={(row) => String(row.p)}
        pageSizes={PAGE_SIZES}
      />
    </div>
  );
}
