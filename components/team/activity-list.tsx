"use client";

import { useState } from "react";
import { ACTION_LABELS } from "@/components/history/audit-words";
import { EventList } from "@/components/history/event-list";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { inputClass } from "@/components/ui/field";
import { TableSkeleton } from "@/components/ui/skeleton";
import { useAuditEvents } from "@/lib/client/audit";
import { useMembers } from "@/lib/client/team";
import { AUDIT_ACTIONS, type AuditAction } from "@/lib/enums";

const PAGE_SIZE = 50;

/** The team's audit trail, filterable by action and person. */
export function ActivityList() {
  const [action, setAction] = useState<AuditAction | "">("");
  const [actorId, setActorId] = useState("");
  const [page, setPage] = useState(1);
  const members = useMembers();
  const { data, error, isLoading, mutate } = useAuditEvents({ action: action || undefined, actorId: actorId || undefined, page, pageSize: PAGE_SIZE });
  const pages = Math.max(1, Math.ceil((data?.total ?? 0) / PAGE_SIZE));
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-3">
        <label className="flex flex-col gap-1 text-[13px] font-medium">
          What
          <select className={inputClass()} value={action} onChange={(e) => { setAction(e.target.value as AuditAction | ""); setPage(1); }}>
            <option value="">Everything</option>
            {AUDIT_ACTIONS.filter((a) => a !== "revision.seeded").map((a) => (
              <option key={a} value={a}>
                {ACTION_LABELS[a]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-[13px] font-medium">
          Who
          <select className={inputClass()} value={actorId} onChange={(e) => { setActorId(e.target.value); setPage(1); }}>
            <option value="">Anyone</option>
            {(members.data?.rows ?? []).map((m) => (
              <option key={m.userId} value={m.userId}>
                {m.name}
              </option>
            ))}
          </select>
        </label>
      </div>
      {error ? <ErrorPanel message={error.message} onRetry={() => mutate()} /> : null}
      {isLoading && !data ? <TableSkeleton rows={8} label="Loading activity" /> : <EventList events={data?.rows ?? []} />}
      <div className="flex items-center gap-2 text-sm">
        <Button onClick={() => setPage((p) => p - 1)} disabled={page <= 1}>
          Newer
        </Button>
        <span className="num text-muted">
          Page {page} of {pages}
        </span>
        <Button onClick={() => setPage((p) => p + 1)} disabled={page >= pages}>
          Older
        </Button>
      </div>
    </div>
  );
}
