import { Dec, dec, divideUnlessOne, ONE, reciprocal, timesFactor, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import { requireDensity, requireMolarMass, solutionWaterMol, volumeOf, type IndexedMaterial } from "./material-index";
import type { Material, PrecursorData } from "./material-schema";
import { ValueKeyedCache } from "./value-cache";

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

/** Amounts of a precursor line per g of residue (decimal; the units of PrecursorAmounts per g residue). */
type PrecursorFactors = Omit<PrecursorAmounts, "residueGrams" | "alcoholMol">;

const factorCache = new ValueKeyedCache<PrecursorFactors>();

/** −1 for an absent constant (no valid material carries a negative one). */
function keyOf(value: number | undefined): number {
  return value === undefined ? -1 : value;
}

/**
 * The amounts of a precursor line per g of its residue, each a 20-digit
 * decimal folded from the material's constants: mol = 1 / (k · M_res),
 * g = mol · M / assay, mL = g / ρ, atoms and groups = mol × per molecule,
 * carried water = g · waterFraction / 18.015 + mol · crystal water,
 * carried solvent = g · solventFraction. Memoised by those numbers (they
 * recur on every call), so a line costs one multiplication per figure.
 * Throws "missing_density" (materials.N.density) when the density is absent.
 *
 * @param entry - a precursor with its precursor data and molar mass checked
 * @example
 * ```ts
 * precursorFactors(teos, teosData, 208.33).massGrams.toNumber(); // 208.33 / 60.083 g TEOS per g SiO2
 * ```
 */
export function precursorFactors(entry: IndexedMaterial, data: PrecursorData, molarMass: number): PrecursorFactors {
  const material = entry.material;
  if (material.density === undefined) requireDensity(entry);
  const key = [
    data.residuePerMolecule,
    data.residueMolarMass,
    molarMass,
    keyOf(material.assay),
    keyOf(material.density),
    keyOf(data.networkAtomsPerMolecule),
    keyOf(data.hydrolysableGroupsPerMolecule),
    keyOf(material.waterFraction),
    keyOf(material.crystalWaterPerFormula),
    keyOf(material.solventFraction),
  ];
  return factorCache.get(key, () => {
    const moles =
      data.residuePerMolecule === 1
        ? reciprocal(data.residueMolarMass)
        : ONE.div(dec(data.residuePerMolecule).times(dec(data.residueMolarMass)));
    const massGrams = divideUnlessOne(moles.times(dec(molarMass)), material.assay);
    const solutionWater = solutionWaterMol(material, massGrams);
    const crystalWater = timesFactor(moles, material.crystalWaterPerFormula);
    return {
      moles,
      massGrams,
      volumeMl: volumeOf(entry, massGrams),
      networkAtomMol: timesFactor(moles, data.networkAtomsPerMolecule),
      hydrolysableGroupMol: timesFactor(moles, data.hydrolysableGroupsPerMolecule),
      carriedWaterMol: crystalWater.isZero() ? solutionWater : solutionWater.plus(crystalWater),
      carriedSolventGrams: timesFactor(massGrams, material.solventFraction),
    };
  });
}

/**
 * Precursor amounts for a target residue weight fraction w in a dry
 * composite of mass S (chemistry: "Per precursor i"): the residue grams
 * w · S times each of the material's folded factors (see `precursorFactors`).
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
  // requireMolarMass throws when there is none
  const molarMass = entry.material.molarMass ?? requireMolarMass(entry).toNumber();
  const f = precursorFactors(entry, data, molarMass);
  const residueGrams = weightFraction.times(solidMass);
  const moles = residueGrams.times(f.moles);
  // a factor of 0 gives 0; one equal to the mol factor (one atom or group per molecule) gives the moles
  const scale = (factor: Dec): Dec => (factor === f.moles ? moles : factor.isZero() ? ZERO : residueGrams.times(factor));
  const hydrolysableGroupMol = scale(f.hydrolysableGroupMol);
  return {
    residueGrams,
    moles,
    massGrams: residueGrams.times(f.massGrams),
    volumeMl: residueGrams.times(f.volumeMl),
    networkAtomMol: scale(f.networkAtomMol),
    hydrolysableGroupMol,
    carriedWaterMol: scale(f.carriedWaterMol),
    carriedSolventGrams: scale(f.carriedSolventGrams),
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
