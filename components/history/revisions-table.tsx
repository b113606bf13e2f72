import { TextLink } from "@/components/ui/text-link";
import { StateBadge } from "@/components/ui/status";
import { TableHead, TD } from "@/components/ui/table-head";
import type { FormulationRevision } from "@/lib/client/formulations";
import { fmtDateTime } from "@/lib/format";

/** A revision in a formulation's list, as the server page reads it (dates as Date) or as JSON. */
export type RevisionRowView = Omit<FormulationRevision, "createdAt" | "updatedAt"> & { createdAt: Date | string; updatedAt: Date | string };

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
        <TableHead columns={["Revision", "State", "Author", "Created", "Last change", { label: "Links", srOnly: true }]} />
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-rule/60">
              <td className={`${TD} num font-medium`}>{r.number}</td>
              <td className={TD}>
                <StateBadge state={r.state} />
              </td>
              <td className={TD}>{r.authorName ?? "–"}</td>
              <td className={`${TD} num whitespace-nowrap text-muted`}>{fmtDateTime(r.createdAt)}</td>
              <td className={`${TD} num whitespace-nowrap text-muted`}>{fmtDateTime(r.updatedAt)}</td>
              <td className={`${TD} whitespace-nowrap`}>
                <TextLink href={`/revisions/${r.id}`}>
                  Open revision {r.number}
                </TextLink>
                {r.state === "draft" && canEdit ? (
                  <>
                    {" · "}
                    <TextLink href={`/revisions/${r.id}/edit`}>
                      Edit
                    </TextLink>
                  </>
                ) : null}
                {r.state === "released" ? (
                  <>
                    {" · "}
                    <TextLink href={`/revisions/${r.id}/batch-sheet`}>
                      Batch sheet
                    </TextLink>
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
