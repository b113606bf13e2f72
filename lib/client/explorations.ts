/**
 * Saved design explorations in the browser: the list of a formulation's (or
 * one revision's) explorations, one exploration, saving and deleting one, and
 * opening a candidate as a new draft revision. Each URL is written here once.
 */
import useSWR from "swr";
import type { createExploration, getExploration, listExplorations } from "@/db/queries/explorations";
import type { startRevision as startRevisionQuery } from "@/db/queries/revisions";
import type { ExplorationBody } from "@/lib/explore/spec";
import type { FormulationInput } from "@/lib/formulation";
import { apiSend, fetcher, query } from "./fetcher";
import type { ApiData } from "./json";

/** One saved exploration as the lists send it. */
export type ExplorationSummary = ApiData<typeof listExplorations>[number];
/** One saved exploration as GET /api/explorations/:id sends it. */
export type Exploration = ApiData<typeof getExploration>;

/** GET /api/formulations/:id/explorations(?revision=…). */
export function explorationsUrl(formulationId: string, revisionId?: string): string {
  return `/api/formulations/${formulationId}/explorations${query({ revision: revisionId })}`;
}

const explorationUrl = (id: string) => `/api/explorations/${id}`;

/** A formulation's saved explorations, newest first (one revision's when `revisionId` is given). */
export function useExplorations(formulationId: string, revisionId?: string) {
  return useSWR<{ rows: ExplorationSummary[] }>(explorationsUrl(formulationId, revisionId), fetcher);
}

/** One saved exploration (null key while `id` is unknown). */
export function useExploration(id: string | null | undefined) {
  return useSWR<Exploration>(id ? explorationUrl(id) : null, fetcher);
}

/** Saves an exploration of a revision of the formulation; answers its id. */
export function saveExploration(formulationId: string, body: ExplorationBody) {
  return apiSend<ApiData<typeof createExploration>>("POST", explorationsUrl(formulationId), body);
}

/** Deletes a saved exploration (the revision it explored is untouched). */
export function deleteExploration(id: string) {
  return apiSend<null>("DELETE", explorationUrl(id));
}

/**
 * Opens a candidate as a new draft revision of the formulation, computed by
 * the full engine; 409 while a draft or review is open.
 */
export function openCandidateAsDraft(formulationId: string, input: FormulationInput, fromExploration?: { explorationId?: string; point: number }) {
  return apiSend<ApiData<typeof startRevisionQuery>>("POST", `/api/formulations/${formulationId}/revisions`, { input, fromExploration });
}
