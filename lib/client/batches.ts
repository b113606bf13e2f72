"use client";

/**
 * The browser's way to batch records: their types (the queries' own return
 * types, as JSON), their URLs in one place, the hooks that read them and the
 * functions that change them. Components never write an /api/batches URL.
 */
import useSWR, { type SWRConfiguration } from "swr";
import type { z } from "zod";
import type { getBatch, listBatches } from "@/db/queries/batches";
import type { batchNotesSchema, recordLineSchema, startBatchSchema } from "@/lib/validations/batches";
import { apiSend, fetcher, query } from "./fetcher";
import type { ApiData } from "./json";

/** A batch record as GET /api/batches/:id answers (and every change to it). */
export type Batch = ApiData<typeof getBatch>;
/** One weighed line of a batch record, with its deviation once it has a mass. */
export type BatchLine = Batch["lines"][number];
/** A line's deviation from target, as the server works it out. */
export type LineDeviation = NonNullable<BatchLine["deviation"]>;
/** A row of GET /api/batches. */
export type BatchListRow = ApiData<typeof listBatches>["rows"][number];
/** The filters GET /api/batches takes. */
export type BatchListQuery = NonNullable<Parameters<typeof listBatches>[1]>;

/** Every URL of the batch API. */
export const batchUrls = {
  list: (filter: BatchListQuery = {}) => `/api/batches${query(filter)}`,
  one: (id: string) => `/api/batches/${encodeURIComponent(id)}`,
  line: (id: string, index: number) => `/api/batches/${encodeURIComponent(id)}/lines/${index}`,
  close: (id: string) => `/api/batches/${encodeURIComponent(id)}/close`,
  /** The record as a workbook (.xlsx). */
  export: (id: string) => `/api/batches/${encodeURIComponent(id)}/export`,
};

/** One batch record; `initial` is the copy the page was rendered with, shown until the first answer. */
export function useBatch(id: string, { initial, ...options }: { initial?: Batch } & Pick<SWRConfiguration, "revalidateOnFocus"> = {}) {
  return useSWR<Batch>(batchUrls.one(id), fetcher, { fallbackData: initial, ...options });
}

/** The team's batch records, newest first, filtered by formulation, revision or state. */
export function useBatches(filter: BatchListQuery = {}) {
  return useSWR<{ rows: BatchListRow[] }>(batchUrls.list(filter), fetcher);
}

/** Starts a batch record from a released revision; answers the new record. */
export function startBatch(body: z.input<typeof startBatchSchema>): Promise<Batch> {
  return apiSend<Batch>("POST", batchUrls.list(), body);
}

/** Records one line (0-based index): actual mass, lot number, initials. Answers the whole record. */
export function recordLine(id: string, index: number, body: z.input<typeof recordLineSchema>): Promise<Batch> {
  return apiSend<Batch>("PATCH", batchUrls.line(id, index), body);
}

/** Changes the notes of an open record. Answers the whole record. */
export function saveBatchNotes(id: string, notes: z.input<typeof batchNotesSchema>["notes"]): Promise<Batch> {
  return apiSend<Batch>("PATCH", batchUrls.one(id), { notes });
}

/** Closes a record for good (422 naming the incomplete lines). */
export function closeBatch(id: string): Promise<Batch> {
  return apiSend<Batch>("POST", batchUrls.close(id));
}
