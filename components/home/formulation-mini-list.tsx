import Link from "next/link";
import { StateBadge } from "@/components/ui/status";
import { fmtDate } from "@/lib/format";
import type { listFormulations } from "@/db/queries/formulations";

/** A formulation as the list query returns it (the home page reads it on the server). */
type MiniRow = Awaited<ReturnType<typeof listFormulations>>["rows"][number];

interface FormulationMiniListProps {
  rows: MiniRow[];
  empty: string;
}

/** A short list of formulations with state and date. */
export function FormulationMiniList({ rows, empty }: FormulationMiniListProps) {
  if (rows.length === 0) return <p className="text-sm text-muted">{empty}</p>;
  return (
    <ul className="divide-y divide-rule">
      {rows.map((r) => (
        <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5">
          <span className="min-w-0">
            <Link href={`/formulations/${r.id}`} className="font-medium text-ink underline-offset-2 hover:text-accent hover:underline">
              {r.name}
            </Link>
            <span className="block truncate text-xs text-muted">
              {r.project ?? "No project"} · revision {r.latestRevision} · {fmtDate(r.updatedAt)}
            </span>
          </span>
          <StateBadge state={r.latestState} />
        </li>
      ))}
    </ul>
  );
}
