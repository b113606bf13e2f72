import { TextLink } from "@/components/ui/text-link";
import { fmtDateTime } from "@/lib/format";
import { actionWords, eventHref, summaryWords, type AuditEventView } from "./audit-words";

interface EventListProps {
  events: AuditEventView[];
  /** Link each event to its record. */
  links?: boolean;
  empty?: string;
}

/** Audit events, newest first: who did what, when. */
export function EventList({ events, links = true, empty = "Nothing recorded yet." }: EventListProps) {
  if (events.length === 0) return <p className="text-sm text-muted">{empty}</p>;
  return (
    <ol className="divide-y divide-rule">
      {events.map((e, i) => {
        const href = links ? eventHref(e) : null;
        const detail = summaryWords(e.summary);
        return (
          <li key={e.id ?? i} className="flex flex-col gap-0.5 py-1.5 text-sm sm:flex-row sm:items-baseline sm:gap-3">
            <time className="num shrink-0 text-xs text-muted sm:w-44" dateTime={new Date(e.createdAt).toISOString()}>
              {fmtDateTime(e.createdAt)}
            </time>
            <span className="min-w-0">
              <span className="font-medium">{e.actorName ?? "Someone"}</span> {actionWords(e.action)}
              {detail ? <span className="text-muted"> — {detail}</span> : null}
              {href ? (
                <>
                  {" "}
                  <TextLink href={href}>
                    open
                  </TextLink>
                </>
              ) : null}
            </span>
          </li>
        );
      })}
    </ol>
  );
}
