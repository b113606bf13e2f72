import type { ReactNode } from "react";
import { Panel } from "@/components/ui/panel";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import type { Batch } from "@/lib/client/batches";
import { fmtMass, fmtPercent, fmtRatio } from "@/lib/format";

interface CompositionPanelProps {
  batch: Batch;
}

/** The dry composite actually made, beside the target, once every line is weighed. */
export function CompositionPanel({ batch }: CompositionPanelProps) {
  const c = batch.composition;
  const res = batch.balanceResolutionGrams;
  const rows: { key: string; figure: ReactNode; target: string; made: string }[] = c
    ? [
        ...c.components.map((k) => ({
          key: `m-${k.materialId}`,
          figure: (
            <>
              {k.name} <span className="text-xs text-muted">weight fraction</span>
            </>
          ),
          target: fmtPercent(k.targetWeightFraction, 2),
          made: fmtPercent(k.actualWeightFraction, 2),
        })),
        { key: "solid", figure: "Dry composite mass", target: fmtMass(c.solidGrams.target, res), made: fmtMass(c.solidGrams.actual, res) },
        {
          key: "R",
          figure: (
            <>
              Effective water ratio R <span className="text-xs text-muted">mol H₂O per mol network atom</span>
            </>
          ),
          target: fmtRatio(c.effectiveR.target),
          made: fmtRatio(c.effectiveR.actual),
        },
        // h is absent when the sol has no alkoxy groups (colloidal silica alone).
        ...(c.effectiveH
          ? [
              {
                key: "h",
                figure: (
                  <>
                    Effective water ratio h <span className="text-xs text-muted">mol H₂O per mol hydrolysable group</span>
                  </>
                ),
                target: fmtRatio(c.effectiveH.target),
                made: fmtRatio(c.effectiveH.actual),
              },
            ]
          : []),
      ]
    : [];
  return (
    <Panel title="Composition made" id="composition">
      {!c ? (
        <p className="text-sm text-muted">
          Shown once every line has an actual mass ({batch.summary.weighed} of {batch.summary.lines} weighed).
        </p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="composition-made">
            <caption className="sr-only">Composition made compared with the target</caption>
            <TableHead columns={["Figure", { label: "Target", numeric: true }, { label: "Made", numeric: true }]} />
            <tbody>
              {rows.map((r) => (
                <tr key={r.key} className="border-b border-rule/60 last:border-0">
                  <th scope="row" className={`${TD} text-left font-normal`}>
                    {r.figure}
                  </th>
                  <td className={TDN}>{r.target}</td>
                  <td className={TDN}>{r.made}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
