import { KIND_LABELS } from "@/components/results/words";
import { TableHead, TD } from "@/components/ui/table-head";
import type { ImportProposal } from "@/lib/client/imports";

interface ProposalsTableProps {
  materials: readonly ImportProposal[];
}

/** What saving does with each material of the file: link it to the library's, or add it. */
export function ProposalsTable({ materials }: ProposalsTableProps) {
  return (
    <div className="mt-1 overflow-x-auto">
      <table className="w-full text-sm" data-testid="import-materials">
        <caption className="sr-only">Materials in the file and what happens to each</caption>
        <TableHead rowClassName="bg-paper" columns={["Material", "Kind", "Row", "On saving"]} />
        <tbody>
          {materials.map((m) => (
            <tr key={`${m.id}-${m.name}`} className="border-b border-rule/60 last:border-0">
              <td className={TD}>{m.name}</td>
              <td className={TD}>{KIND_LABELS[m.kind]}</td>
              <td className={`${TD} num`}>{m.row ?? "–"}</td>
              <td className={TD}>
                {m.action === "link"
                  ? `Uses the library's “${m.libraryName ?? m.name}” (same ${m.matchedBy === "casNumber" ? "CAS number" : "name"})`
                  : "Added to the library"}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
