import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtDensity, fmtMass, fmtPercent } from "@/lib/format";
import { CompositionChart } from "./composition-chart";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import { FigureRows } from "./table";
import { materialsById } from "./words";

interface CompositePanelProps {
  input: FormulationInput;
  result: FormulationResult;
  resolution: number;
}

/** The ideal dry composite: weight and volume fractions, density, porosity, shrinkage. */
export function CompositePanel({ input, result, resolution }: CompositePanelProps) {
  const c = result.composite;
  const byId = materialsById(input);
  const phases = c.phases.map((p) => {
    const m = byId.get(p.materialId);
    const name = m?.name ?? p.materialId;
    const label =
      m?.kind === "modifier"
        ? `Bonded ligand ${p.residueFormula ?? m.modifier?.bondedFormula ?? ""} from ${name}`
        : p.residueFormula
          ? `${p.residueFormula} from ${name}`
          : name;
    return { ...p, label };
  });
  return (
    <div className="@container flex flex-col gap-3">
      <div className="overflow-x-auto">
        <table className="w-full text-sm" data-testid="composite-table">
          <caption className="sr-only">Dry composite phases</caption>
          <TableHead columns={["Phase", { label: "Weight fraction", numeric: true }, { label: "Volume fraction", numeric: true }, { label: "Dry density", numeric: true }]} />
          <tbody>
            {phases.map((p) => (
              <tr key={p.materialId} className="border-b border-rule/60" data-phase-kind={byId.get(p.materialId)?.kind}>
                <td className={TD}>{p.label}</td>
                <td className={TDN}>{fmtPercent(p.weightFraction, 2)}</td>
                <td className={TDN}>{fmtPercent(p.volumeFraction, 2)}</td>
                <td className={TDN}>{fmtDensity(p.density)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="grid gap-4 @2xl:grid-cols-2">
        <FigureRows
          caption="Dry composite figures"
          rows={[
            { label: "Dry composite mass", value: fmtMass(c.massGrams, resolution) },
            { label: "Theoretical density", note: "rule of mixtures", value: <span data-testid="theoretical-density">{fmtDensity(c.theoreticalDensity)}</span> },
            { label: "Porosity", note: "from the bulk density", value: c.porosity === undefined ? "no bulk density given" : fmtPercent(c.porosity) },
            { label: "Shrinkage, sol → dense solid", value: `${fmtPercent(c.denseShrinkage.volumetric)} vol · ${fmtPercent(c.denseShrinkage.linear)} linear` },
            ...(c.dryGelShrinkage
              ? [{ label: "Shrinkage, sol → dry gel", value: `${fmtPercent(c.dryGelShrinkage.volumetric)} vol · ${fmtPercent(c.dryGelShrinkage.linear)} linear` }]
              : []),
          ]}
        />
        <CompositionChart phases={phases} />
      </div>
      <p className="text-xs text-muted">
        Ideal figures: complete hydrolysis and condensation, all solvent, water, alcohol and catalyst removed. Real gels keep OH groups, water and
        some alkoxy groups.
      </p>
    </div>
  );
}
