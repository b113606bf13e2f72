import useSWR from "swr";
import type { getBatchSettings } from "@/db/queries/batches";
import { apiSend, fetcher } from "./fetcher";
import type { ApiData } from "./json";

/** The team's weighing tolerance and balance resolution, as GET /api/batches/settings sends them. */
export type BatchSettings = ApiData<typeof getBatchSettings>;

/** The team's batch settings. */
export function useBatchSettings() {
  return useSWR<BatchSettings>("/api/batches/settings", fetcher);
}

/** Saves the team's batch settings (admins only; batches started afterwards use them). */
export function saveBatchSettings(body: { toleranceFraction: number; balanceResolutionGrams: number }) {
  return apiSend("PUT", "/api/batches/settings", body);
}
