import { HazardCodes } from "@/components/ui/hazards";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtMass, fmtMol, fmtVolume } from "@/lib/format";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import { materialsById, LINE_ROLE_LABELS } from "./words";

interface RecipeTableProps {
  input: FormulationInput;
  result: FormulationResult;
  resolution: number;
}

/** The dispensing recipe in order of addition: mass and volume as supplied. */
export function RecipeTable({ input, result, resolution }: RecipeTableProps) {
  const byId = materialsById(input);
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="recipe-table">
        <caption className="sr-only">Dispensing recipe, in order of addition</caption>
        <TableHead columns={[{ label: "#", numeric: true }, "Material", "Role", { label: "Mass as supplied", numeric: true }, { label: "Volume", numeric: true }, { label: "Amount", numeric: true }]} />
        <tbody>
          {result.lines.map((line, i) => {
            const m = byId.get(line.materialId);
            return (
              <tr key={`${line.materialId}-${line.role}`} className="border-b border-rule/60">
                <td className={TDN}>{i + 1}</td>
                <td className={TD}>
                  <span className="font-medium">{m?.name ?? line.materialId}</span>
                  {m?.hazards?.length ? (
                    <span className="mt-0.5 block">
                      <HazardCodes codes={m.hazards} />
                    </span>
                  ) : null}
                  {line.carriedSolventGrams ? (
                    <span className="block text-xs text-muted">brings {fmtMass(line.carriedSolventGrams, resolution)} solvent</span>
                  ) : null}
                  {line.carriedWaterMol ? <span className="block text-xs text-muted">brings {fmtMol(line.carriedWaterMol)} water</span> : null}
                </td>
                <td className={`${TD} text-muted`}>{LINE_ROLE_LABELS[line.role]}</td>
                <td className={`${TDN} font-medium`} data-testid={`mass-${i}`}>
                  {fmtMass(line.massGrams, resolution)}
                </td>
                <td className={TDN}>{fmtVolume(line.volumeMl)}</td>
                <td className={TDN}>{line.moles !== undefined ? fmtMol(line.moles) : "–"}</td>
              </tr>
            );
          })}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" colSpan={3} className="px-2 py-1 text-left text-xs font-semibold text-muted">
              Sol total
            </th>
            <td className={`${TDN} font-semibold`} data-testid="sol-mass">
              {fmtMass(result.sol.massGrams, resolution)}
            </td>
            <td className={TDN}>≈ {fmtVolume(result.sol.volumeMl)}</td>
            <td />
          </tr>
        </tfoot>
      </table>
    </div>
  );
}
