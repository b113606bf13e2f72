import { Panel } from "@/components/ui/panel";
import { TD, TDN, TH, THN } from "@/components/ui/table-head";
import { ADJUSTMENT_REASON_LABELS } from "@/lib/labels";
import type { LotAdjustmentsView } from "@/db/queries/lot-adjustments";

interface LotAdjustmentHistoryProps {
  adjustments: LotAdjustmentsView;
}

/** An amount in the lot's unit, to 6 significant figures (as the rest of the lot page). */
const qty = (n: number, unit: string) => `${Number(n.toPrecision(6))} ${unit}`;

/** When, in UTC, to the minute. */
const when = (d: Date | string) => `${new Date(d).toISOString().slice(0, 16).replace("T", " ")} UTC`;

/** A lot's stock adjustments, newest first: when, who, on hand before → after (with units), reason and note. */
export function LotAdjustmentHistory({ adjustments }: LotAdjustmentHistoryProps) {
  const { rows, unit } = adjustments;
  return (
    <Panel title="Stock adjustments" id="adjustments">
      {rows.length === 0 ? (
        <p className="text-sm text-muted">The quantity on hand has not been adjusted by hand; it changes only through releases.</p>
      ) : (
        <table className="w-full text-sm" data-testid="lot-adjustments">
          <thead>
            <tr>
              <th className={TH}>Date</th>
              <th className={TH}>By</th>
              <th className={THN}>On hand before → after</th>
              <th className={TH}>Reason</th>
              <th className={TH}>Note</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-t border-rule">
                <td className={`${TD} num whitespace-nowrap`}>{when(r.adjustedAt)}</td>
                <td className={TD}>{r.adjustedByName ?? "a former member"}</td>
                <td className={TDN}>
                  {qty(r.quantityBefore, unit)} → {qty(r.quantityAfter, unit)}
                </td>
                <td className={TD}>{ADJUSTMENT_REASON_LABELS[r.reason]}</td>
                <td className={`${TD} whitespace-pre-wrap`}>{r.note ?? ""}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Panel>
  );
}
