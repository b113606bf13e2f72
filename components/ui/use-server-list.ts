"use client";

import type { PaginationState, SortingState } from "@tanstack/react-table";
import { useState } from "react";
import useSWR from "swr";
import { fetcher, query } from "@/lib/client/fetcher";
import { useDebounced } from "./use-debounced";

/**
 * State of a list searched, filtered, sorted and paged by the API: the search
 * text (debounced), sorting and paging, and the SWR request for the page.
 * Changing the search, a filter or the sort goes back to the first page.
 */
export function useServerList<Row>(path: string, filters: Record<string, string | undefined>, defaultSort: SortingState) {
  const [q, setQText] = useState("");
  const [sorting, setSortingState] = useState<SortingState>(defaultSort);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 25 });
  const search = useDebounced(q);
  const toFirstPage = () => setPagination((p) => ({ ...p, pageIndex: 0 }));
  const sort = sorting[0];
  const key = `${path}${query({
    ...filters,
    q: search.trim() || undefined,
    sort: sort?.id,
    dir: sort ? (sort.desc ? "desc" : "asc") : undefined,
    page: pagination.pageIndex + 1,
    pageSize: pagination.pageSize,
  })}`;

  const swr = useSWR<{ rows: Row[]; total: number }>(key, fetcher, { keepPreviousData: true });
  return {
    ...swr,
    q,
    setQ: (value: string) => {
      setQText(value);
      toFirstPage();
    },
    sorting,
    setSorting: (value: SortingState) => {
      setSortingState(value);
      toFirstPage();
    },
    pagination,
    setPagination,
    toFirstPage,
  };
}

/** What `useServerList` returns, for components that render it. */
export type ServerList<Row> = ReturnType<typeof useServerList<Row>>;
