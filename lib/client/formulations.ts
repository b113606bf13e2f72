import type { SortingState } from "@tanstack/react-table";
import useSWR from "swr";
import { useServerList } from "@/components/ui/use-server-list";
import type {
  createFormulation as createFormulationQuery,
  diffFormulationRevisions,
  getFormulation,
  getRevision,
  listFormulations,
} from "@/db/queries/formulations";
import type { saveDraft as saveDraftQuery, startRevision as startRevisionQuery } from "@/db/queries/revisions";
import type { RevisionState } from "@/lib/enums";
import type { FormulationInput } from "@/lib/formulation";
import type { WorkflowAction } from "@/lib/workflow";
import { apiSend, fetcher } from "./fetcher";
import type { ApiData } from "./json";

/** One row of the formulation list, as GET /api/formulations sends it. */
export type FormulationRow = ApiData<typeof listFormulations>["rows"][number];
/** A revision in the list of a formulation's revisions. */
export type FormulationRevision = ApiData<typeof getFormulation>["revisions"][number];
/** A revision with its reviews, as GET /api/revisions/:id sends it. */
export type Revision = ApiData<typeof getRevision>;
/** What changed between two revisions of a formulation. */
export type RevisionDiff = ApiData<typeof diffFormulationRevisions>;
/** The answer to a saved draft: its new version and whether the engine could compute it. */
export type SavedDraft = ApiData<typeof saveDraftQuery>;

const revisionUrl = (id: string) => `/api/revisions/${id}`;

/** The team's formulations, searched, filtered by state, sorted and paged by the API. */
export function useFormulations(filter: { state?: RevisionState }, defaultSort: SortingState = [{ id: "updatedAt", desc: true }]) {
  return useServerList<FormulationRow>("/api/formulations", { state: filter.state }, defaultSort);
}

/** One revision, kept fresh; `initial` is the server-rendered copy shown until the first answer. */
export function useRevision(id: string, initial?: Revision) {
  return useSWR<Revision>(revisionUrl(id), fetcher, initial ? { fallbackData: initial } : undefined);
}

/** What changed from revision `from` to revision `to` of a formulation. */
export function useRevisionDiff(formulationId: string, from: number, to: number) {
  return useSWR<RevisionDiff>(`/api/formulations/${formulationId}/diff?from=${from}&to=${to}`, fetcher);
}

/** Reads a revision once (outside SWR), e.g. to reload a draft after a conflict. */
export function fetchRevision(id: string): Promise<Revision> {
  return fetcher<Revision>(revisionUrl(id));
}

/** Creates a formulation with its first draft revision. */
export function createFormulation(body: { name: string; project: string | null; description: string | null; input: FormulationInput }) {
  return apiSend<ApiData<typeof createFormulationQuery>>("POST", "/api/formulations", body);
}

/** Saves a draft read at `version` (409 when someone saved it since). */
export function saveDraft(revisionId: string, body: { version: number; input: FormulationInput }) {
  return apiSend<SavedDraft>("PUT", revisionUrl(revisionId), body);
}

/** Submits, approves, returns, releases or archives a revision; reviews carry a comment. */
export function transitionRevision(revisionId: string, action: WorkflowAction, comment?: string | null) {
  return apiSend("POST", `${revisionUrl(revisionId)}/${action}`, action === "approve" || action === "return" ? { comment: comment ?? null } : {});
}

/** Starts a new draft revision of a formulation from its latest one. */
export function startRevision(formulationId: string) {
  return apiSend<ApiData<typeof startRevisionQuery>>("POST", `/api/formulations/${formulationId}/revisions`);
}
