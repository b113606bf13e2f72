import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtMass, fmtMol, fmtRatio, fmtVolume } from "@/lib/format";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import { FigureRows } from "./table";
import { materialsById } from "./words";

interface WaterPanelProps {
  input: FormulationInput;
  result: FormulationResult;
  resolution: number;
}

/** Water accounting (target, carried, to add, effective ratios) and alcohol released. */
export function WaterPanel({ input, result, resolution }: WaterPanelProps) {
  const w = result.water;
  const byId = materialsById(input);
  const ref = input.water.referenceId ? (byId.get(input.water.referenceId)?.name ?? input.water.referenceId) : "the precursor";
  const ratioName = input.water.ratio === "perPrecursor" ? `H₂O : ${ref}` : input.water.ratio;
  const ratioWord =
    input.water.ratio === "R"
      ? "R (mol H₂O per mol network-forming atom)"
      : input.water.ratio === "h"
        ? "h (mol H₂O per mol hydrolysable group after ligand exchange)"
        : `mol H₂O per mol ${ref}`;
  const countCarried = input.water.countCarried !== false;
  return (
    <div className="@container"><div className="grid gap-4 @2xl:grid-cols-2">
      <FigureRows
        caption="Water accounting"
        rows={[
          { label: `Target water at ${ratioName} = ${fmtRatio(input.water.value)}`, note: ratioWord, value: fmtMol(w.targetMol) },
          {
            label: "Carried by other materials",
            note: countCarried ? "aqueous stocks, solutions, hydrates; counted toward the target" : "not counted: the whole target is added",
            value: fmtMol(w.carriedMol),
          },
          { label: "Water to add", value: <span className="font-semibold">{`${fmtMol(w.addMol)} · ${fmtMass(w.addGrams, resolution)} · ${fmtVolume(w.addMl)}`}</span> },
          ...(w.groupsReplacedMol !== undefined
            ? [{ label: "Alkoxy groups replaced by modifiers", note: "no longer hydrolysable", value: <span data-testid="groups-replaced">{fmtMol(w.groupsReplacedMol)}</span> }]
            : []),
          { label: "Full hydrolysis needs", value: fmtMol(w.hydrolysisMol) },
          { label: "Net for complete condensation", value: fmtMol(w.condensationMol) },
          { label: "Effective R", value: fmtRatio(w.effectiveR) },
          ...(w.effectiveH !== undefined ? [{ label: "Effective h", value: fmtRatio(w.effectiveH) }] : []),
        ]}
      />
      <div>
        <h3 className="mb-1 text-xs font-semibold text-muted">Alcohol released on full hydrolysis</h3>
        {result.alcohol.length === 0 ? (
          <p className="text-sm text-muted">None.</p>
        ) : (
          <table className="w-full text-sm">
            <caption className="sr-only">Alcohol released on full hydrolysis</caption>
            <TableHead columns={["Alcohol", { label: "Amount", numeric: true }, { label: "Mass", numeric: true }]} />
            <tbody>
              {result.alcohol.map((a) => (
                <tr key={a.name} className="border-b border-rule/60">
                  <td className={TD}>{a.name}</td>
                  <td className={TDN}>{fmtMol(a.mol)}</td>
                  <td className={TDN}>{fmtMass(a.grams, resolution)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
    </div>
    </div>
  );
}
