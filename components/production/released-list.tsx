import "server-only";
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { getFormulation, listFormulations } from "@/db/queries/formulations";
import { fmtDateTime } from "@/lib/format";

interface ReleasedListProps {
  teamId: string;
  q?: string;
}

/** Formulations with a released revision, each with its batch sheet. */
export async function ReleasedList({ teamId, q }: ReleasedListProps) {
  const { rows, total } = await listFormulations(teamId, { releasedOnly: true, q, sort: "name", dir: "asc", pageSize: 100 });
  const withRevision = await Promise.all(
    rows.map(async (r) => {
      const f = await getFormulation(teamId, r.id, { releasedOnly: true });
      return { ...r, released: f?.revisions[0] ?? null };
    }),
  );
  if (withRevision.length === 0) return <p className="text-sm text-muted">{q ? "Nothing released matches." : "Nothing has been released to production yet."}</p>;
  return (
    <div className="flex flex-col gap-2">
      <ul className="divide-y divide-rule rounded border border-rule bg-panel" data-testid="released-list">
        {withRevision.map((r) => (
          <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
            <span className="min-w-0">
              <span className="block font-medium">{r.name}</span>
              <span className="block text-xs text-muted">
                {r.project ?? "No project"}
                {r.released ? ` · revision ${r.released.number} released, last change ${fmtDateTime(r.released.updatedAt)}` : ""}
              </span>
            </span>
            {r.released ? (
              <Link
                href={`/revisions/${r.released.id}/batch-sheet`}
                className={buttonClass("primary")}
                aria-label={`Batch sheet of ${r.name}, revision ${r.released.number}`}
              >
                Batch sheet
              </Link>
            ) : null}
          </li>
        ))}
      </ul>
      {total > rows.length ? <p className="text-xs text-muted">Showing the first {rows.length} of {total}; search to narrow.</p> : null}
    </div>
  );
}
