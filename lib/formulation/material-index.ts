import { dec, type Dec, per, WATER_MOL_PER_GRAM, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import type { Material } from "./material-schema";

/** A material with its position in `input.materials` (for error fields). */
export interface IndexedMaterial {
  readonly material: Material;
  readonly index: number;
  /** "materials.N" */
  readonly path: string;
}

/**
 * Indexes materials by id. The input schema has already rejected duplicate
 * and unknown ids, so lookups through `materialById` cannot miss.
 *
 * @example
 * ```ts
 * const byId = indexMaterials(input.materials);
 * materialById(byId, "teos").path; // "materials.0"
 * ```
 */
export function indexMaterials(materials: readonly Material[]): Map<string, IndexedMaterial> {
  const byId = new Map<string, IndexedMaterial>();
  materials.forEach((material, index) => {
    if (!byId.has(material.id)) byId.set(material.id, { material, index, path: `materials.${index}` });
  });
  return byId;
}

/**
 * Looks a material up by id; throws "unknown_material" on `field` if absent.
 *
 * @example
 * ```ts
 * materialById(byId, "ethanol", "solvent.materialId");
 * ```
 */
export function materialById(byId: Map<string, IndexedMaterial>, id: string, field = "materials"): IndexedMaterial {
  const entry = byId.get(id);
  if (!entry) throw new FormulationError("unknown_material", field, "the chosen material is not in the materials list");
  return entry;
}

/**
 * Density as supplied, g/cm³; throws "missing_density" on materials.N.density.
 *
 * @example
 * ```ts
 * requireDensity(teos).toNumber(); // 0.933
 * ```
 */
export function requireDensity(entry: IndexedMaterial): Dec {
  const { density, name } = entry.material;
  if (density === undefined) {
    throw new FormulationError("missing_density", `${entry.path}.density`, `${name} has no density; it is needed to give a volume`);
  }
  return dec(density);
}

/**
 * Molar mass of the active compound, g/mol; throws "missing_molar_mass" on materials.N.molarMass.
 *
 * @example
 * ```ts
 * requireMolarMass(teos).toNumber(); // 208.33
 * ```
 */
export function requireMolarMass(entry: IndexedMaterial): Dec {
  const { molarMass, name } = entry.material;
  if (molarMass === undefined) {
    throw new FormulationError("missing_molar_mass", `${entry.path}.molarMass`, `${name} has no molar mass; it is needed to count moles`);
  }
  return dec(molarMass);
}

/**
 * Carried water mass fraction of a material as supplied, default 0.
 *
 * @example
 * ```ts
 * waterFractionOf(hcl37).toNumber(); // 0.63
 * ```
 */
export function waterFractionOf(material: Material): Dec {
  return material.waterFraction === undefined ? ZERO : dec(material.waterFraction);
}

/**
 * mL of a mass of the material as supplied: mass / density, as a product
 * with the density's memoised reciprocal. Throws like `requireDensity`.
 *
 * @param entry - the material
 * @param massGrams - g as supplied
 * @example
 * ```ts
 * volumeOf(ethanolEntry, new Dec(78.93)).toNumber(); // ≈ 100 mL at 0.7893 g/cm³
 * ```
 */
export function volumeOf(entry: IndexedMaterial, massGrams: Dec): Dec {
  const { density, name } = entry.material;
  if (density === undefined) {
    throw new FormulationError("missing_density", `${entry.path}.density`, `${name} has no density; it is needed to give a volume`);
  }
  return per(massGrams, density);
}

/**
 * mol of water carried in a mass of the material as supplied (its
 * waterFraction, e.g. the water of 37 % hydrochloric acid); 0 without one.
 *
 * @param material - the material as supplied
 * @param massGrams - g as supplied
 * @example
 * ```ts
 * solutionWaterMol(hcl37, new Dec(100)).toNumber(); // 63 g / 18.015 g/mol ≈ 3.497 mol
 * ```
 */
export function solutionWaterMol(material: Material, massGrams: Dec): Dec {
  return material.waterFraction ? massGrams.times(dec(material.waterFraction)).times(WATER_MOL_PER_GRAM) : ZERO;
}
