"use client";

import { ErrorPanel } from "@/components/ui/error-panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { ApiRequestError } from "@/lib/client/fetcher";
import { useMailbox } from "@/lib/client/team";
import { fmtDateTime } from "@/lib/format";

/** Mail about this team's own business captured by the local fake mail server (never account mail). */
export function MailboxList() {
  const { data, error, isLoading, mutate } = useMailbox();
  if (error instanceof ApiRequestError && error.status === 404) {
    return <p className="text-sm text-muted">{error.message}</p>;
  }
  if (error) return <ErrorPanel message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={4} label="Loading captured mail" />;
  if (data.rows.length === 0) return <p className="text-sm text-muted">No mail captured yet.</p>;
  return (
    <ul className="flex flex-col gap-2" data-testid="mailbox">
      {data.rows.map((m) => (
        <li key={m.id} className="rounded border border-rule bg-panel">
          <details>
            <summary className="flex cursor-pointer flex-wrap justify-between gap-2 px-3 py-2 text-sm">
              <span>
                <span className="font-medium">{m.subject}</span> <span className="text-muted">to {m.to.join(", ")}</span>
              </span>
              <span className="num text-xs text-muted">{fmtDateTime(m.receivedAt)}</span>
            </summary>
            <pre className="overflow-x-auto border-t border-rule px-3 py-2 font-mono text-xs whitespace-pre-wrap">{m.text}</pre>
          </details>
        </li>
      ))}
    </ul>
  );
}
