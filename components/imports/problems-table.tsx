import { TableHead, TD } from "@/components/ui/table-head";
import { ToneBadge } from "@/components/ui/tone-badge";
import type { ImportPreviewProblem } from "@/lib/client/imports";

interface ProblemsTableProps {
  /** Errors first, then warnings. */
  problems: readonly ImportPreviewProblem[];
}

/** Every problem of a file with its level, sheet, row and column, and what to do about it. */
export function ProblemsTable({ problems }: ProblemsTableProps) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="import-problems">
        <caption className="mb-1 text-left text-sm font-semibold">Problems, by where they are in the file</caption>
        <TableHead rowClassName="bg-paper" columns={["Level", "Sheet", "Row", "Column", "What to do"]} />
        <tbody>
          {problems.map((p, i) => (
            <tr key={i} className="border-b border-rule/60 last:border-0">
              <td className={TD}>
                {p.level === "error" ? (
                  <ToneBadge tone="fail" mark="✕">
                    Error
                  </ToneBadge>
                ) : (
                  <ToneBadge tone="caution" mark="!">
                    Warning
                  </ToneBadge>
                )}
              </td>
              <td className={`${TD} whitespace-nowrap`}>{p.sheet}</td>
              <td className={`${TD} num`}>{p.row ?? "–"}</td>
              <td className={TD}>
                {p.column ? (
                  <>
                    <span className="num font-mono">{p.columnLetter}</span> <span className="text-muted">{p.column}</span>
                  </>
                ) : (
                  "–"
                )}
              </td>
              <td className={TD}>{p.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
