import { LINE_ROLE_LABELS } from "@/components/results/words";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import type { Batch } from "@/lib/client/batches";
import { fmtDateTime, fmtMass } from "@/lib/format";
import { deviationWords } from "./batch-deviation";
import { ToleranceBadge } from "./batch-words";
import { lineName } from "./line-draft";

const COLUMNS = [
  "#",
  "Material",
  { label: "Target mass", numeric: true },
  { label: "Actual mass", numeric: true },
  { label: "Deviation", numeric: true },
  "Tolerance",
  "Lot number",
  "Weighed",
];

interface RecordLinesProps {
  batch: Batch;
}

/** The weighings of a record as a table: target, actual, deviation and tolerance check, lot, when and by whom. */
export function RecordLines({ batch }: RecordLinesProps) {
  const res = batch.balanceResolutionGrams;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="record-lines">
        <caption className="sr-only">Weighings of this batch, in order of addition</caption>
        <TableHead columns={COLUMNS} />
        <tbody>
          {batch.lines.map((l) => (
            <tr key={l.index} className={`border-b border-rule/60 last:border-0 ${l.deviation?.outside ? "bg-fail-soft/40" : ""}`}>
              <td className={`${TD} num`}>{l.index + 1}</td>
              <td className={TD}>
                <span className="font-medium">{lineName(l)}</span>
                <span className="block text-xs text-muted">{l.role ? LINE_ROLE_LABELS[l.role] : ""}</span>
              </td>
              <td className={TDN}>{fmtMass(l.targetGrams, res)}</td>
              <td className={`${TDN} font-semibold`}>{fmtMass(l.actualGrams, res)}</td>
              <td className={TDN}>{l.deviation ? deviationWords(l.deviation, res) : "–"}</td>
              <td className={TD}>
                <ToleranceBadge deviation={l.deviation} toleranceFraction={batch.toleranceFraction} resolution={res} />
              </td>
              <td className={`${TD} font-mono text-xs`}>{l.lotNumber ?? (l.role === "water" ? "not needed" : "–")}</td>
              <td className={`${TD} num text-xs whitespace-nowrap text-muted`}>
                {l.at ? fmtDateTime(l.at) : "–"}
                {l.initials ? ` · ${l.initials}` : ""}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
