import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtMass, fmtMol, fmtRatio, fmtTemp } from "@/lib/format";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import { FigureRows } from "./table";
import { materialsById } from "./words";

interface LigandsPanelProps {
  input: FormulationInput;
  result: FormulationResult;
  resolution: number;
}

/** The modifiers (ligand, groups replaced, bonded mass, burnt out or kept) and the solvent, added and carried. */
export function LigandsPanel({ input, result, resolution }: LigandsPanelProps) {
  const byId = materialsById(input);
  const name = (id: string) => byId.get(id)?.name ?? id;
  const mods = result.modifiers ?? [];
  const s = result.solvent;
  return (
    <div className="@container"><div className="grid gap-4 @2xl:grid-cols-2">
      {mods.length > 0 ? (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Modifiers">
          <h3 className="mb-1 text-xs font-semibold text-muted">Modifiers</h3>
          <table className="w-full text-sm" data-testid="modifiers-table">
            <caption className="sr-only">Modifiers and the precursors they modify</caption>
            <TableHead
              columns={[
                "Modifier",
                "On",
                { label: "mol/mol metal", numeric: true },
                { label: "Ligand", numeric: true },
                { label: "Groups replaced", numeric: true },
                { label: "Bonded in the dry composite", numeric: true },
              ]}
            />
            <tbody>
              {mods.map((m, i) => {
                const removal = byId.get(m.materialId)?.modifier?.removalTemperatureC;
                return (
                  <tr key={`${m.materialId}-${m.precursorId}-${i}`} className="border-b border-rule/60">
                    <td className={TD}>{name(m.materialId)}</td>
                    <td className={TD}>{name(m.precursorId)}</td>
                    <td className={TDN}>{fmtRatio(m.molPerMetal)}</td>
                    <td className={TDN}>{fmtMol(m.ligandMol)}</td>
                    <td className={TDN}>{fmtMol(m.groupsReplacedMol)}</td>
                    <td className={TDN}>
                      {m.removedInStep ? (
                        <span data-testid={`ligand-removed-${i}`}>
                          burnt out in “{m.removedInStep}”{removal !== undefined ? ` (≥ ${fmtTemp(removal)})` : ""}
                        </span>
                      ) : (
                        fmtMass(m.bondedGrams, resolution)
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
      {s ? (
        <FigureRows
          caption="Solvent, added and carried"
          rows={[
            { label: `Added ${name(s.materialId)}`, value: `${fmtMass(s.addedGrams, resolution)}${s.addedMol !== undefined ? ` · ${fmtMol(s.addedMol)}` : ""}` },
            {
              label: "Carried in by precursor solutions",
              note: "the solvent a supplied solution already contains",
              value: <span data-testid="solvent-carried">{`${fmtMass(s.carriedGrams, resolution)}${s.carriedMol !== undefined ? ` · ${fmtMol(s.carriedMol)}` : ""}`}</span>,
            },
            ...(s.molPerNetworkAtom !== undefined
              ? [{ label: "Solvent ratio, added and carried", note: "mol per mol network-forming atom", value: fmtRatio(s.molPerNetworkAtom) }]
              : []),
          ]}
        />
      ) : null}
    </div></div>
  );
}
