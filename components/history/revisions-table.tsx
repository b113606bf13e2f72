import Link from "next/link";
import { StateBadge } from "@/components/ui/status";
import { fmtDateTime } from "@/lib/format";
import type { RevisionState } from "@/lib/workflow";

export interface RevisionRowView {
  id: string;
  number: number;
  state: RevisionState;
  authorName: string | null;
  createdAt: Date | string;
  updatedAt: Date | string;
}

interface RevisionsTableProps {
  rows: RevisionRowView[];
  canEdit: boolean;
}

/** Revisions of a formulation, newest first, with links to open, edit or print them. */
export function RevisionsTable({ rows, canEdit }: RevisionsTableProps) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Revisions</caption>
        <thead>
          <tr className="border-b border-rule text-left text-xs text-muted">
            <th scope="col" className="px-2 py-1">
              Revision
            </th>
            <th scope="col" className="px-2 py-1">
              State
            </th>
            <th scope="col" className="px-2 py-1">
              Author
            </th>
            <th scope="col" className="px-2 py-1">
              Created
            </th>
            <th scope="col" className="px-2 py-1">
              Last change
            </th>
            <th scope="col" className="px-2 py-1">
              <span className="sr-only">Links</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-rule/60">
              <td className="num px-2 py-1.5 font-medium">{r.number}</td>
              <td className="px-2 py-1.5">
                <StateBadge state={r.state} />
              </td>
              <td className="px-2 py-1.5">{r.authorName ?? "–"}</td>
              <td className="num px-2 py-1.5 whitespace-nowrap text-muted">{fmtDateTime(r.createdAt)}</td>
              <td className="num px-2 py-1.5 whitespace-nowrap text-muted">{fmtDateTime(r.updatedAt)}</td>
              <td className="px-2 py-1.5 whitespace-nowrap">
                <Link href={`/revisions/${r.id}`} className="text-accent underline underline-offset-2 decoration-rule hover:decoration-accent">
                  Open revision {r.number}
                </Link>
                {r.state === "draft" && canEdit ? (
                  <>
                    {" · "}
                    <Link href={`/revisions/${r.id}/edit`} className="text-accent underline underline-offset-2 decoration-rule hover:decoration-accent">
                      Edit
                    </Link>
                  </>
                ) : null}
                {r.state === "released" ? (
                  <>
                    {" · "}
                    <Link href={`/revisions/${r.id}/batch-sheet`} className="text-accent underline underline-offset-2 decoration-rule hover:decoration-accent">
                      Batch sheet
                    </Link>
                  </>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
