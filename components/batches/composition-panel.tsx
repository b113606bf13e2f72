import { TD, TDN, TH, THN } from "@/components/results/table";
import { Panel } from "@/components/ui/panel";
import { fmtMass, fmtPercent, fmtRatio } from "@/lib/format";
import type { BatchDto } from "./types";

interface CompositionPanelProps {
  batch: BatchDto;
}

/** The dry composite actually made, beside the target, once every line is weighed. */
export function CompositionPanel({ batch }: CompositionPanelProps) {
  const c = batch.composition;
  const res = batch.balanceResolutionGrams;
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
            <thead>
              <tr className="border-b border-rule">
                <th scope="col" className={TH}>
                  Figure
                </th>
                <th scope="col" className={THN}>
                  Target
                </th>
                <th scope="col" className={THN}>
                  Made
                </th>
              </tr>
            </thead>
            <tbody>
              {c.components.map((k) => (
                <tr key={k.materialId} className="border-b border-rule/60">
                  <th scope="row" className={`${TD} text-left font-normal`}>
                    {k.name} <span className="text-xs text-muted">weight fraction</span>
                  </th>
                  <td className={TDN}>{fmtPercent(k.targetWeightFraction, 2)}</td>
                  <td className={TDN}>{fmtPercent(k.actualWeightFraction, 2)}</td>
                </tr>
              ))}
              <tr className="border-b border-rule/60">
                <th scope="row" className={`${TD} text-left font-normal`}>
                  Dry composite mass
                </th>
                <td className={TDN}>{fmtMass(c.solidGrams.target, res)}</td>
                <td className={TDN}>{fmtMass(c.solidGrams.actual, res)}</td>
              </tr>
              <tr className="border-b border-rule/60">
                <th scope="row" className={`${TD} text-left font-normal`}>
                  Effective water ratio R <span className="text-xs text-muted">mol H₂O per mol network atom</span>
                </th>
                <td className={TDN}>{fmtRatio(c.effectiveR.target)}</td>
                <td className={TDN}>{fmtRatio(c.effectiveR.actual)}</td>
              </tr>
              <tr>
                <th scope="row" className={`${TD} text-left font-normal`}>
                  Effective water ratio h <span className="text-xs text-muted">mol H₂O per mol hydrolysable group</span>
                </th>
                <td className={TDN}>{fmtRatio(c.effectiveH.target)}</td>
                <td className={TDN}>{fmtRatio(c.effectiveH.actual)}</td>
              </tr>
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
