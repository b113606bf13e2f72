"use client";

/**
 * The browser's way to specifications and test results (issue 17): types as
 * the queries answer them, URLs in one place, hooks and changes.
 */
import useSWR from "swr";
import type { getSpecifications } from "@/db/queries/specifications";
import type { listResults } from "@/db/queries/results";
import type { Specification } from "@/lib/quality/specification";
import { apiSend, fetcher } from "./fetcher";
import type { ApiData } from "./json";

export type RevisionSpecifications = ApiData<typeof getSpecifications>;
export type BatchResults = ApiData<typeof listResults>;
export type BatchResult = BatchResults["results"][number];

export const qualityUrls = {
  specifications: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/specifications`,
  results: (batchId: string) => `/api/batches/${encodeURIComponent(batchId)}/results`,
  acknowledge: (batchId: string, resultId: string) =>
    `/api/batches/${encodeURIComponent(batchId)}/results/${encodeURIComponent(resultId)}/acknowledge`,
};

export function useSpecifications(revisionId: string) {
  return useSWR<RevisionSpecifications>(qualityUrls.specifications(revisionId), fetcher);
}

export function saveSpecifications(revisionId: string, specifications: Specification[], version: number) {
  return apiSend<{ version: number; specifications: Specification[] }>("PUT", qualityUrls.specifications(revisionId), { specifications, version });
}

export function useBatchResults(batchId: string) {
  return useSWR<BatchResults>(qualityUrls.results(batchId), fetcher);
}

export function enterResult(batchId: string, body: { specId: string; value: number | string; instrument?: string | null }) {
  return apiSend<{ id: string; outOfSpec: boolean }>("POST", qualityUrls.results(batchId), body);
}

export function acknowledgeResult(batchId: string, resultId: string, note: string) {
  return apiSend("POST", qualityUrls.acknowledge(batchId, resultId), { note });
}
