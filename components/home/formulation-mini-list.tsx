import Link from "next/link";
import { StateBadge } from "@/components/ui/status";
import { fmtDate } from "@/lib/format";
import type { RevisionState } from "@/lib/workflow";

export interface MiniRow {
  id: string;
  name: string;
  project: string | null;
  latestState: RevisionState;
  latestRevision: number;
  updatedAt: Date | string;
}

interface FormulationMiniListProps {
  rows: MiniRow[];
  empty: string;
  /** Where a row links: the formulation page by default. */
  hrefOf?: (row: MiniRow) => string;
}

/** A short list of formulations with state and date. */
export function FormulationMiniList({ rows, empty, hrefOf = (r) => `/formulations/${r.id}` }: FormulationMiniListProps) {
  if (rows.length === 0) return <p className="text-sm text-muted">{empty}</p>;
  return (
    <ul className="divide-y divide-rule">
      {rows.map((r) => (
        <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5">
          <span className="min-w-0">
            <Link href={hrefOf(r)} className="font-medium text-ink underline-offset-2 hover:text-accent hover:underline">
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
