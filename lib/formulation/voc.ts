import type { DecLine } from "./composition";
import { ML_PER_L, VOC_BOILING_POINT_MAX_C, WATER_MOLAR_MASS_G_PER_MOL } from "./constants";
import { add, type Dec, dec, positive, quotient, timesFactor, toNumber, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import { volumeOf, type IndexedMaterial } from "./material-index";
import type { Material } from "./material-schema";
import type { Notice, VocResult } from "./result-types";

/** Carbon in a formula: a "C" not followed by a lower-case letter (not Ca, Cl, Cr, Cu …). */
const CARBON = /C(?![a-z])/;

/** How a material counts toward VOC: "yes", "no", or "assumed" (a solvent or catalyst without a boiling point). */
export type VocVerdict = "yes" | "no" | "assumed";

/**
 * Whether a material is a volatile organic compound in the sense of EU
 * Directive 2004/42/EC: organic (carbon in its formula) with an initial
 * boiling point ≤ 250 °C at 101.3 kPa. A solvent or catalyst whose boiling
 * point (or formula, for a solvent) is not known is assumed volatile
 * ("assumed"): the sol-gel solvents all are, and a VOC figure must not be
 * understated; other materials without one are not counted.
 *
 * @example
 * ```ts
 * vocVerdict(ethanol); // "yes" (C2H5OH, 78.3 °C)
 * vocVerdict(hcl37);   // "no" (no carbon)
 * ```
 */
export function vocVerdict(material: Material): VocVerdict {
  if (material.formula === undefined) return material.kind === "solvent" ? "assumed" : "no";
  if (!CARBON.test(material.formula)) return "no";
  if (material.boilingPointC !== undefined) return material.boilingPointC <= VOC_BOILING_POINT_MAX_C ? "yes" : "no";
  return material.kind === "solvent" || material.kind === "catalyst" ? "assumed" : "no";
}

/** What the VOC figure needs from the rest of the computation. */
export interface VocInputs {
  lines: readonly DecLine[];
  byId: Map<string, IndexedMaterial>;
  /** Alcohol released on full hydrolysis, g of each alcohol. */
  alcohols: Iterable<{ grams: Dec }>;
  /** Water in the sol, added and carried, mol. */
  waterMol: Dec;
  /** The water material (its molar mass and density give the water volume). */
  waterEntry: IndexedMaterial;
  /** Sol volume, mL (ideal mixing). */
  solVolumeMl: Dec;
  /** 1000 / sol volume in mL (1 / L), when the caller has it: g per litre is then one product. */
  perLitre?: Dec;
}

/**
 * Volatile organic compounds of the sol (chemistry: "What the coat will
 * be"; EU 2004/42/EC definition): the active part of every solvent and
 * catalyst line that is a VOC (acetic acid yes, hydrochloric acid no), the
 * solvent carried by any line (1-propanol of a zirconium propoxide
 * solution; a carried solvent that names no material is counted), and the
 * alcohol released on full hydrolysis, always (it leaves in drying and cure).
 * Modifier lines add nothing: in this model every ligand is bonded (the
 * engine refuses more ligand than a precursor has alkoxy groups), its
 * exchange alcohol is already in the hydrolysis alcohol, and a ligand burnt
 * out above its removal temperature leaves as combustion products, not as a
 * solvent. Precursors and organic phases stay in the dry solid.
 * g per litre of sol and g per litre of sol less water (ASTM D3960, US EPA
 * Method 24): m / (V_sol − V_water), V_water = (added + carried water) / ρ_water.
 *
 * @returns the VOC figures and an info notice naming materials assumed volatile
 * @example
 * ```ts
 * vocFigures({ lines, byId, alcohols: [{ grams: dec(12.3) }], waterMol, waterEntry, solVolumeMl }).voc.gramsPerLitre;
 * ```
 */
export function vocFigures(inputs: VocInputs): { voc: VocResult; notices: Notice[] } {
  const { lines, byId } = inputs;
  let grams = ZERO;
  const assumed: { material: Material; property: string }[] = [];
  const assume = (material: Material, property: string): void => {
    if (!assumed.some((a) => a.material === material)) assumed.push({ material, property });
  };
  const count = (material: Material, mass: Dec): void => {
    const verdict = vocVerdict(material);
    if (verdict === "no") return;
    grams = add(grams, mass);
    if (verdict === "assumed") assume(material, material.formula === undefined ? "formula" : "boilingPointC");
  };
  for (const line of lines) {
    const material = byId.get(line.materialId)?.material;
    if (!material) continue;
    if (line.role === "solvent" || line.role === "catalyst") {
      count(material, material.assay === undefined || material.assay === 1 ? line.massGrams : timesFactor(line.massGrams, material.assay));
    }
    if (line.carriedSolventGrams && !line.carriedSolventGrams.isZero()) {
      const carried = material.solventId === undefined ? undefined : byId.get(material.solventId)?.material;
      if (carried) count(carried, line.carriedSolventGrams);
      else {
        grams = add(grams, line.carriedSolventGrams);
        assume(material, "solventId");
      }
    }
  }
  for (const alcohol of inputs.alcohols) grams = add(grams, alcohol.grams);

  const waterMaterial = inputs.waterEntry.material;
  const waterMl = inputs.waterMol.isZero()
    ? ZERO
    : volumeOf(inputs.waterEntry, inputs.waterMol.times(dec(waterMaterial.molarMass ?? WATER_MOLAR_MASS_G_PER_MOL)));
  const lessWaterMl = inputs.solVolumeMl.minus(waterMl);
  if (!positive(lessWaterMl)) {
    throw new FormulationError(
      "invalid_input",
      `${inputs.waterEntry.path}.density`,
      `at the densities given, the water alone (${Number(waterMl.toPrecision(4))} mL) takes up the whole sol volume ` +
        `(${Number(inputs.solVolumeMl.toPrecision(4))} mL): check the densities of the water and of the aqueous stocks`,
    );
  }
  const gramsTimesMlPerL = grams.times(ML_PER_L);
  const voc: VocResult = {
    massGrams: toNumber(grams),
    gramsPerLitre: toNumber(inputs.perLitre ? grams.times(inputs.perLitre) : quotient(gramsTimesMlPerL, inputs.solVolumeMl)),
    gramsPerLitreLessWater: toNumber(quotient(gramsTimesMlPerL, lessWaterMl)),
    waterMl: toNumber(waterMl),
  };
  const notices: Notice[] = [];
  if (assumed.length > 0) {
    const first = assumed[0]!;
    const entry = byId.get(first.material.id);
    notices.push({
      level: "info",
      code: "voc_assumed_volatile",
      ...(entry ? { field: `${entry.path}.${first.property}` } : {}),
      message:
        `${assumed.map((a) => a.material.name).join(", ")}: no boiling point (or no named carried solvent) is given, so ${assumed.length === 1 ? "it is" : "they are"} ` +
        `counted as volatile organic compounds; add the boiling point to count only what boils at or below ${VOC_BOILING_POINT_MAX_C} °C.`,
    });
  }
  return { voc, notices };
}
