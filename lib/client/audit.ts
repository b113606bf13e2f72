import useSWR from "swr";
import type { listAuditEvents } from "@/db/queries/audit";
import type { AuditAction } from "@/lib/enums";
import { fetcher, query } from "./fetcher";
import type { ApiData } from "./json";

/** A page of the audit trail, as GET /api/audit sends it. */
export type AuditPage = ApiData<typeof listAuditEvents>;
/** One event of the audit trail. */
export type AuditEvent = AuditPage["rows"][number];

/** Which events to list: one record's, one person's, one action's; a page of them. */
export interface AuditQuery {
  entityId?: string;
  entityType?: string;
  actorId?: string;
  action?: AuditAction;
  page?: number;
  pageSize?: number;
}

/** The team's audit trail, newest first, filtered and paged by the API. */
export function useAuditEvents(filter: AuditQuery) {
  return useSWR<AuditPage>(`/api/audit${query({ ...filter })}`, fetcher, { keepPreviousData: true });
}
