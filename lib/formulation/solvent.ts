import { add, Dec, per, positive, quotient, ZERO } from "./decimal";
import { doseMoles, type DosedAmounts } from "./dosing";
import type { DecLine } from "./composition";
import { requireMolarMass, type IndexedMaterial } from "./material-index";
import type { Notice } from "./result-types";

/**
 * Grams of a solvent carried into the sol by the lines so far: the
 * solventFraction of every material that names it as its `solventId`
 * (1-propanol in a zirconium propoxide solution, say).
 *
 * @example
 * ```ts
 * carriedSolventGrams(lines, byId, "1-propanol").toNumber(); // 0.3 · mass of the 70 % solution
 * ```
 */
export function carriedSolventGrams(lines: readonly DecLine[], byId: Map<string, IndexedMaterial>, solventId: string): Dec {
  let grams = ZERO;
  for (const line of lines) {
    if (line.carriedSolventGrams && byId.get(line.materialId)?.material.solventId === solventId) {
      grams = add(grams, line.carriedSolventGrams);
    }
  }
  return grams;
}

/** The solvent to add for a molar ratio, with the carried share and its notice. */
export interface RatioSolvent {
  /** The added line's amounts, or undefined when the carried solvent already reaches the ratio. */
  added?: DosedAmounts;
  addedMol: Dec;
  carriedMol: Dec;
  notices: Notice[];
}

/**
 * Solvent by molar ratio (chemistry: "Solvent 1."): target n = ratio · Σa;
 * solvent carried by precursor solutions counts toward it, so the added
 * amount is n − carried, not below 0, with a notice when the carried amount
 * alone exceeds the ratio.
 *
 * @param entry - the solvent
 * @param ratio - mol solvent per mol network-forming atom
 * @param networkAtomMol - Σa, mol
 * @param carriedGrams - g of the same solvent carried by other materials
 * @example
 * ```ts
 * // 1-propanol 2 mol/mol Zr on 0.1 mol Zr, 3.6 g (0.0599 mol) carried → 0.1401 mol added
 * solventByRatio(propanol, new Dec(2), new Dec(0.1), new Dec(3.6)).addedMol.toNumber();
 * ```
 */
export function solventByRatio(entry: IndexedMaterial, ratio: Dec, networkAtomMol: Dec, carriedGrams: Dec): RatioSolvent {
  const target = ratio.times(networkAtomMol);
  const carriedMol = carriedGrams.isZero() ? ZERO : quotient(carriedGrams, requireMolarMass(entry));
  const addMol = target.minus(carriedMol);
  if (!positive(addMol)) {
    const notices: Notice[] = carriedMol.isZero()
      ? []
      : [
          {
            level: "caution",
            code: "carried_solvent_exceeds_ratio",
            field: "solvent.value",
            message:
              `The precursor solutions already bring ${show(carriedMol)} mol ${entry.material.name}, ` +
              `${show(quotient(carriedMol, networkAtomMol))} mol per mol network atom, at least the ${show(ratio)} asked for: none is added.`,
          },
        ];
    return { addedMol: ZERO, carriedMol, notices };
  }
  return { added: doseMoles(entry, addMol), addedMol: addMol, carriedMol, notices: [] };
}

function show(value: Dec): string {
  return String(Number(new Dec(value).toPrecision(4)));
}

/** Moles of a solvent in `grams` of it (its assay ignored: a carried solvent is the pure compound). */
export function solventMol(entry: IndexedMaterial, grams: Dec): Dec | undefined {
  const molarMass = entry.material.molarMass;
  return molarMass === undefined ? undefined : per(grams, molarMass);
}
