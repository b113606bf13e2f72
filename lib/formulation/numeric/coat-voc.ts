/**
 * Volatile organic compounds of the sol in plain float64: the numeric twin
 * of voc.ts (vocFigures), figures only, no notices; the same refusals
 * (code and field) where voc.ts throws.
 */
import { ML_PER_L, WATER_MOLAR_MASS_G_PER_MOL } from "../constants";
import type { Material } from "../material-schema";
import type { NumericLine } from "./context";
import type { NumericFailure } from "./figures";
import { coatMaterialData, materialPath } from "./coat-material";

/** The VOC figures. */
export interface NumericVoc {
  /** g of VOC in the batch */
  vocMassGrams: number;
  /** g per litre of sol */
  vocGramsPerLitre: number;
  /** g per litre of sol less water */
  vocGramsPerLitreLessWater: number;
}

/** What the VOC figures need from the rest of the computation (plain numbers). */
export interface NumericVocInputs {
  lines: readonly NumericLine[];
  byId: ReadonlyMap<string, Material>;
  /** Alcohol released on full hydrolysis. */
  alcohols: readonly { mol: number; molarMass: number }[];
  /** Water in the sol, added and carried, mol. */
  waterMol: number;
  waterMaterial: Material;
  /** Sol volume, mL (ideal mixing). */
  solVolumeMl: number;
}

/**
 * VOC by EU Directive 2004/42/EC (organic, boiling point ≤ 250 °C; a
 * solvent or catalyst without one assumed volatile): the active part of
 * every volatile solvent and catalyst line (mass × assay), the solvent a
 * line carries (counted when it names no material), and the alcohol
 * released on full hydrolysis; per litre of sol and per litre less water
 * (ASTM D3960, US EPA Method 24), V_water = (added + carried water) · M / ρ_water.
 * Refuses, as voc.ts does, water without a density ("missing_density") and
 * water that takes up the whole sol volume ("invalid_input"), both on
 * materials.N.density of the water.
 *
 * @returns the VOC figures, or the refusal
 * @example
 * ```ts
 * const voc = numericVoc({ lines, byId, alcohols, waterMol: 0.6657, waterMaterial: water, solVolumeMl: 88.07 });
 * if (!("ok" in voc)) voc.vocGramsPerLitre; // g/L
 * ```
 */
export function numericVoc(inputs: NumericVocInputs): NumericVoc | NumericFailure {
  const { lines, byId } = inputs;
  let grams = 0;
  for (const line of lines) {
    const material = byId.get(line.materialId);
    if (!material) continue;
    if (line.role === "solvent" || line.role === "catalyst") {
      const data = coatMaterialData(material);
      if (data.volatile) grams += data.assayFactor === 1 ? line.massGrams : line.massGrams * data.assayFactor;
    }
    if (line.carriedSolventGrams !== 0) {
      const carried = material.solventId === undefined ? undefined : byId.get(material.solventId);
      if (!carried || coatMaterialData(carried).volatile) grams += line.carriedSolventGrams;
    }
  }
  for (const alcohol of inputs.alcohols) grams += alcohol.mol * alcohol.molarMass;

  const water = inputs.waterMaterial;
  let waterMl = 0;
  if (inputs.waterMol !== 0) {
    if (water.density === undefined) return { ok: false, code: "missing_density", field: `${materialPath(byId, water.id)}.density` };
    waterMl = (inputs.waterMol * (water.molarMass ?? WATER_MOLAR_MASS_G_PER_MOL)) / water.density;
  }
  const lessWaterMl = inputs.solVolumeMl - waterMl;
  if (!(lessWaterMl > 0)) return { ok: false, code: "invalid_input", field: `${materialPath(byId, water.id)}.density` };
  const gramsTimesMlPerL = grams * ML_PER_L;
  return {
    vocMassGrams: grams,
    vocGramsPerLitre: gramsTimesMlPerL / inputs.solVolumeMl,
    vocGramsPerLitreLessWater: gramsTimesMlPerL / lessWaterMl,
  };
}
