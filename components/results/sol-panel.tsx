import type { FormulationResult } from "@/lib/formulation";
import { fmtMass, fmtPercent, fmtQuantity, fmtVolume } from "@/lib/format";
import { FigureRows } from "./table";

interface SolPanelProps {
  result: FormulationResult;
  resolution: number;
}

/** Figures of the sol as dispensed. */
export function SolPanel({ result, resolution }: SolPanelProps) {
  const s = result.sol;
  return (
    <FigureRows
      caption="Sol figures"
      rows={[
        { label: "Sol mass", value: fmtMass(s.massGrams, resolution) },
        { label: "Sol volume", note: "ideal mixing: an approximation", value: `≈ ${fmtVolume(s.volumeMl)}` },
        { label: "Solids content", note: "dry composite mass / sol mass", value: <span data-testid="solids-content">{fmtPercent(s.solidsFraction, 2)}</span> },
        { label: "Residue concentration", value: fmtQuantity(s.residueGramsPerL, "g/L") },
        { label: "Network-forming atoms", value: fmtQuantity(s.networkAtomMolarity, "mol/L") },
      ]}
    />
  );
}
