import "server-only";
import { listAuditEvents } from "@/db/queries/audit";
import { EventList } from "./event-list";

interface FormulationEventsProps {
  teamId: string;
  formulationId: string;
  revisionIds: string[];
}

/** Audit events of a formulation and of each of its revisions, newest first. */
export async function FormulationEvents({ teamId, formulationId, revisionIds }: FormulationEventsProps) {
  const lists = await Promise.all([formulationId, ...revisionIds].map((entityId) => listAuditEvents(teamId, { entityId, pageSize: 200 })));
  const events = lists
    .flatMap((l) => l.rows)
    .sort((a, b) => new Date(b.createdAt).getTime() - new Date(a.createdAt).getTime());
  return <EventList events={events} empty="No events recorded for this formulation." />;
}
