import { Dec, divideUnlessOne, timesFactor } from "./decimal";
import { requireMolarMass, solutionWaterMol, volumeOf, type IndexedMaterial } from "./material-index";

/** A reagent dosed per mol of network-forming atoms (decimal; units in field names). */
export interface DosedAmounts {
  /** mol of the active compound: ratio · Σa. */
  moles: Dec;
  /** g as supplied: n · M / assay. */
  massGrams: Dec;
  /** mL as supplied. */
  volumeMl: Dec;
  /** mol water carried by the stock: mass · waterFraction / 18.015. */
  carriedWaterMol: Dec;
  /** g solvent carried by the stock. */
  carriedSolventGrams: Dec;
}

/**
 * Amount of a catalyst stock or of a solvent dosed as mol per mol
 * network-forming atom (chemistry: "Catalyst", "Solvent 1."): active mass =
 * n · M_active, stock mass = active / stock concentration (assay); the rest of
 * an aqueous stock is carried water.
 *
 * @param entry - the catalyst or solvent material
 * @param ratio - mol active per mol network-forming atom
 * @param networkAtomMol - Σa, mol
 * @returns the amounts, decimal
 * @example
 * ```ts
 * // HCl 37 wt%, 0.01 mol/mol Si, 0.1 mol Si → 0.001 mol HCl = 0.036458 g active → 0.098535 g stock
 * dosePerNetworkAtom(hcl37, new Dec(0.01), new Dec(0.1)).massGrams.toNumber();
 * ```
 */
export function dosePerNetworkAtom(entry: IndexedMaterial, ratio: Dec, networkAtomMol: Dec): DosedAmounts {
  return doseMoles(entry, ratio.times(networkAtomMol));
}

/**
 * Amount of a reagent as supplied for `moles` mol of its active compound:
 * mass = n · M / assay, volume = mass / ρ, with the water and solvent the
 * stock carries.
 *
 * @example
 * ```ts
 * doseMoles(ethanol, new Dec(1)).massGrams.toNumber(); // 46.069
 * ```
 */
export function doseMoles(entry: IndexedMaterial, moles: Dec): DosedAmounts {
  const material = entry.material;
  const massGrams = divideUnlessOne(moles.times(requireMolarMass(entry)), material.assay);
  return {
    moles,
    massGrams,
    volumeMl: volumeOf(entry, massGrams),
    carriedWaterMol: solutionWaterMol(material, massGrams),
    carriedSolventGrams: timesFactor(massGrams, material.solventFraction),
  };
}
