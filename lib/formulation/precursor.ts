import { Dec, dec, divideUnlessOne, per, timesFactor, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import { requireMolarMass, solutionWaterMol, volumeOf, type IndexedMaterial } from "./material-index";
import type { Material, PrecursorData } from "./material-schema";

/** Amounts for one precursor in the batch (decimal; units in field names). */
export interface PrecursorAmounts {
  /** g of residue in the dry composite: w · S. */
  residueGrams: Dec;
  /** mol of precursor: m_res / (k · M_res). */
  moles: Dec;
  /** g to weigh, as supplied: n · M / assay. */
  massGrams: Dec;
  /** mL to dispense: mass / ρ (as supplied). */
  volumeMl: Dec;
  /** mol network-forming atoms: atoms per molecule · n. */
  networkAtomMol: Dec;
  /** mol hydrolysable groups: groups per molecule · n. */
  hydrolysableGroupMol: Dec;
  /** mol water carried: mass · waterFraction / 18.015 + crystal water · n. */
  carriedWaterMol: Dec;
  /** g solvent carried: mass · solventFraction. */
  carriedSolventGrams: Dec;
  /** mol alcohol released on full hydrolysis (= hydrolysable groups). */
  alcoholMol: Dec;
}

/**
 * The precursor data of a material; throws "no_residue" on
 * materials.N.precursor when a precursor has none.
 *
 * @example
 * ```ts
 * requirePrecursorData(teosEntry).residueFormula; // "SiO2"
 * ```
 */
export function requirePrecursorData(entry: IndexedMaterial): PrecursorData {
  const data = entry.material.precursor;
  if (!data) {
    throw new FormulationError(
      "no_residue",
      `${entry.path}.precursor`,
      `${entry.material.name} has no residue data (residue formula, molar mass, density); it cannot be used as a precursor`,
    );
  }
  return data;
}

/**
 * Precursor amounts for a target residue weight fraction w in a dry
 * composite of mass S (chemistry: "Per precursor i").
 *
 * @param entry - the precursor material
 * @param weightFraction - w, residue mass fraction in the dry composite
 * @param solidMass - S, g
 * @returns the amounts, decimal
 * @example
 * ```ts
 * // TEOS, w = 1, S = 10 g → n = 10 / 60.083 mol SiO2, mass = n · 208.33 g
 * precursorAmounts(teos, new Dec(1), new Dec(10)).massGrams.toNumber(); // ≈ 34.67
 * ```
 */
export function precursorAmounts(entry: IndexedMaterial, weightFraction: Dec, solidMass: Dec): PrecursorAmounts {
  const data = requirePrecursorData(entry);
  const material = entry.material;
  const molarMass = requireMolarMass(entry);
  const residueGrams = weightFraction.times(solidMass);
  const moles =
    data.residuePerMolecule === 1
      ? per(residueGrams, data.residueMolarMass)
      : residueGrams.div(dec(data.residuePerMolecule).times(dec(data.residueMolarMass)));
  const massGrams = divideUnlessOne(moles.times(molarMass), material.assay);
  const hydrolysableGroupMol = timesFactor(moles, data.hydrolysableGroupsPerMolecule);
  const solutionWater = solutionWaterMol(material, massGrams);
  const crystalWaterMol = timesFactor(moles, material.crystalWaterPerFormula);
  return {
    residueGrams,
    moles,
    massGrams,
    volumeMl: volumeOf(entry, massGrams),
    networkAtomMol: timesFactor(moles, data.networkAtomsPerMolecule),
    hydrolysableGroupMol,
    carriedWaterMol: crystalWaterMol.isZero() ? solutionWater : solutionWater.plus(crystalWaterMol),
    carriedSolventGrams: timesFactor(massGrams, material.solventFraction),
    alcoholMol: data.leavingAlcohol ? hydrolysableGroupMol : ZERO,
  };
}

/**
 * Theoretical residue yield: mass fraction of the pure precursor that stays
 * in the dry solid, k · M_res / M (dimensionless).
 *
 * @param material - a precursor with molarMass and precursor data
 * @returns yield, e.g. 0.2884 for TEOS → SiO2
 * @example
 * ```ts
 * residueYield(teos); // 60.083 / 208.33 ≈ 0.2884
 * ```
 */
export function residueYield(material: Material): number {
  if (!material.precursor) {
    throw new FormulationError("no_residue", "precursor", `${material.name} has no residue data`);
  }
  if (material.molarMass === undefined) {
    throw new FormulationError("missing_molar_mass", "molarMass", `${material.name} has no molar mass`);
  }
  return new Dec(material.precursor.residuePerMolecule)
    .times(material.precursor.residueMolarMass)
    .div(material.molarMass)
    .toNumber();
}
