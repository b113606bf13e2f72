/**
 * Solvent fill to a sol mass (solids-content basis) or a mould volume
 * (gel-body basis), plain float64: the same equations as solveFill in
 * lib/formulation/solvent-fill.ts, with the water the solvent carries
 * counted toward the water still needed.
 */
import { MIN_LINE_GRAMS } from "../constants";
import { refuse } from "./refusal";
import type { TableMaterial } from "./material-table";

/** g of solvent to add and mol of water still to add. */
export interface NumericFill {
  solventGrams: number;
  addWaterMol: number;
}

/**
 * Solves the fill: solvent grams so that the sol reaches the target mass or
 * volume once the water still needed is added.
 *
 * @param p.volume - true for a mould volume (mL), false for a sol mass (g)
 * @param p.amount - the target, g or mL
 * @param p.otherGrams - g of the lines so far
 * @param p.otherMl - mL of the lines so far
 * @param p.waterNeededMol - mol of water still needed (≤ 0: none)
 * @param p.waterMolarMass - g/mol of the water material
 * @returns the solvent and water amounts; refuses like the engine when the reagents alone exceed the target
 * @example
 * ```ts
 * numericFill({ volume: false, amount: 100, otherGrams: 40, otherMl: 45, waterNeededMol: 1, waterMolarMass: 18.015, solvent: ethanolRow, water: waterRow });
 * // { solventGrams: 41.985, addWaterMol: 1 }
 * ```
 */
export function numericFill(p: {
  volume: boolean;
  amount: number;
  otherGrams: number;
  otherMl: number;
  waterNeededMol: number;
  waterMolarMass: number;
  solvent: TableMaterial;
  water: TableMaterial;
}): NumericFill {
  const needMol = p.waterNeededMol > 0 ? p.waterNeededMol : 0;
  if (p.volume && Number.isNaN(p.solvent.perDensity)) refuse("missing_density", `${p.solvent.path}.density`);
  const solventCost = p.volume ? p.solvent.perDensity : 1;
  let waterCost = 0;
  if (needMol !== 0) {
    if (p.volume && Number.isNaN(p.water.perDensity)) refuse("missing_density", `${p.water.path}.density`);
    waterCost = p.volume ? p.waterMolarMass / p.water.density : p.waterMolarMass;
  }
  const carriedPerGram = p.solvent.waterMolPerGram;
  const available = p.amount - (p.volume ? p.otherMl : p.otherGrams);

  let solventGrams: number;
  let addWaterMol: number;
  if (needMol === 0) {
    solventGrams = available / solventCost;
    addWaterMol = 0;
  } else {
    const coefficient = solventCost - carriedPerGram * waterCost;
    if (!(coefficient > 0)) refuse("invalid_input", `${p.solvent.path}.waterFraction`);
    solventGrams = (available - needMol * waterCost) / coefficient;
    addWaterMol = needMol - solventGrams * carriedPerGram;
    if (addWaterMol < 0) {
      solventGrams = available / solventCost;
      addWaterMol = 0;
    }
  }
  if (Math.abs(solventGrams) < MIN_LINE_GRAMS) solventGrams = 0;
  if (solventGrams < 0) {
    if (p.volume) refuse("mould_too_small", "basis.volumeMl");
    refuse("solids_content_too_high", "basis.solidsFraction");
  }
  return { solventGrams, addWaterMol };
}
