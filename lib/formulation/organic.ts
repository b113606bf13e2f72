import { Dec, divideUnlessOne, per, timesFactor } from "./decimal";
import { FormulationError } from "./errors";
import { requireDensity, solutionWaterMol, volumeOf, type IndexedMaterial } from "./material-index";

/** Amounts for one organic phase in the batch (decimal; units in field names). */
export interface OrganicAmounts {
  /** g of dry organic phase in the composite: w · S. */
  residueGrams: Dec;
  /** mol, when the material has a molar mass: dry mass / M. */
  moles?: Dec;
  /** g to weigh, as supplied: w · S / assay. */
  massGrams: Dec;
  /** mL to dispense: mass / ρ (as supplied). */
  volumeMl: Dec;
  /** mol water carried: mass · waterFraction / 18.015. */
  carriedWaterMol: Dec;
  /** g solvent carried: mass · solventFraction. */
  carriedSolventGrams: Dec;
  /** g/cm³ of the dry organic phase. */
  phaseDensity: number;
}

/**
 * Density of the dry organic phase, g/cm³: phaseDensity, or the density as
 * supplied when the assay is 1. Throws "missing_density" on
 * materials.N.phaseDensity (solution without a dry-phase density) or
 * materials.N.density.
 *
 * @example
 * ```ts
 * organicPhaseDensity(pva10Aq); // 1.27 (dry PVA), not the solution's 1.02
 * ```
 */
export function organicPhaseDensity(entry: IndexedMaterial): number {
  const material = entry.material;
  if (material.phaseDensity !== undefined) return material.phaseDensity;
  // the density as given (requireDensity throws when there is none)
  if ((material.assay ?? 1) === 1) return material.density ?? requireDensity(entry).toNumber();
  throw new FormulationError(
    "missing_density",
    `${entry.path}.phaseDensity`,
    `${material.name} is supplied at an assay below 1, so the density of its dry phase must be given`,
  );
}

/**
 * Organic-phase amounts for a dry weight fraction w in a dry composite of
 * mass S: mass as supplied = w · S / assay; the water it carries counts
 * toward the water ratio.
 *
 * @param entry - the organic material
 * @param weightFraction - w, dry mass fraction in the composite
 * @param solidMass - S, g
 * @returns the amounts, decimal
 * @example
 * ```ts
 * // PVA 10 wt% in water, w = 0.2, S = 10 g → 2 g PVA in 20 g solution carrying 18 g water
 * organicAmounts(pva10Aq, new Dec(0.2), new Dec(10)).massGrams.toNumber(); // 20
 * ```
 */
export function organicAmounts(entry: IndexedMaterial, weightFraction: Dec, solidMass: Dec): OrganicAmounts {
  const material = entry.material;
  const residueGrams = weightFraction.times(solidMass);
  const massGrams = divideUnlessOne(residueGrams, material.assay);
  return {
    residueGrams,
    moles: material.molarMass === undefined ? undefined : per(residueGrams, material.molarMass),
    massGrams,
    volumeMl: volumeOf(entry, massGrams),
    carriedWaterMol: solutionWaterMol(material, massGrams),
    carriedSolventGrams: timesFactor(massGrams, material.solventFraction),
    phaseDensity: organicPhaseDensity(entry),
  };
}
