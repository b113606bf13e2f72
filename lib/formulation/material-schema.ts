import { z } from "zod";
import {
  ASSAY,
  DENSITY_G_PER_CM3,
  EQUIVALENT_WEIGHT_G_PER_EQ,
  MOLAR_MASS_G_PER_MOL,
  PER_MOLECULE,
  PRICE_PER_KG,
  REFRACTIVE_INDEX,
  RESIDUE_UNITS_PER_MOLECULE,
  TEMPERATURE_C,
} from "./limits";
import { nameText } from "./text-rules";
import { fraction, nonEmptyString, rangedNumber, required, zeroOrRangedNumber } from "./zod-helpers";

import { MATERIAL_KINDS, type MaterialKind } from "./kinds";

export { MATERIAL_KINDS, type MaterialKind };

/** Tolerance on assay + waterFraction + solventFraction ≤ 1 (dimensionless). Common practice, no source. */
const COMPOSITION_SUM_TOLERANCE = 1e-9;

/** Longest material name (characters); the database column holds 200. */
export const MATERIAL_NAME_MAX = 200;

/** CAS Registry Number layout: 2–7 digits, 2 digits, 1 check digit. */
const CAS_NUMBER = /^\d{2,7}-\d{2}-\d$/;

const DIGIT_0 = 0x30;
const DIGIT_9 = 0x39;
const HYPHEN = 0x2d;

/**
 * The check of `casCheckDigitValid` by character codes, for text of ASCII
 * digits and hyphens only (hyphens ignored; the last digit is the check
 * digit; no digit at all passes, as 0 = 0); undefined for any other text.
 */
function digitsAndHyphensCheck(cas: string): boolean | undefined {
  let check = -1;
  let position = 0;
  let total = 0;
  for (let i = cas.length - 1; i >= 0; i -= 1) {
    const unit = cas.charCodeAt(i);
    if (unit === HYPHEN) continue;
    if (unit < DIGIT_0 || unit > DIGIT_9) return undefined;
    if (check < 0) check = unit - DIGIT_0;
    else total += (unit - DIGIT_0) * position;
    position += 1;
  }
  return check < 0 ? true : total % 10 === check;
}

/**
 * CAS Registry Number check digit: the sum of each digit (excluding the check
 * digit) times its position counted from the right, modulo 10.
 * Source: CAS, "CAS Registry Number" format description (published algorithm).
 *
 * @example
 * ```ts
 * casCheckDigitValid("7732-18-5"); // true (water: 8·1 + 1·2 + 2·3 + 3·4 + 7·5 + 7·6 = 105 → 5)
 * ```
 */
export function casCheckDigitValid(cas: string): boolean {
  const fast = digitsAndHyphensCheck(cas);
  if (fast !== undefined) return fast;
  // any other character: Number() of a single character decides (0 for white space, NaN otherwise), as before
  const digits = cas.replace(/-/g, "");
  const check = Number(digits.slice(-1));
  const body = digits.slice(0, -1);
  let total = 0;
  for (let i = 0; i < body.length; i += 1) total += Number(body[body.length - 1 - i]) * (i + 1);
  return total % 10 === check;
}

/**
 * True for a plain object whose values are all strings (property → source).
 *
 * @example
 * ```ts
 * isStringMap({ density: "CRC Handbook" }); // true
 * ```
 */
export function isStringMap(value: unknown): value is Record<string, string> {
  if (typeof value !== "object" || value === null || Array.isArray(value)) return false;
  for (const key in value) {
    if (typeof (value as Record<string, unknown>)[key] !== "string") return false;
  }
  return true;
}

/** GHS hazard statement code, e.g. "H225", "H360FD", "EUH014" (UN GHS). */
const HAZARD_CODE = /^(EUH|H)\d{3}[A-Za-z]{0,2}$/;

/**
 * What a precursor leaves in the dry solid and what it releases.
 * - residueFormula / residueMolarMass (g/mol): the oxide (SiO2, TiO2, Al2O3 …)
 *   or R-SiO1.5 unit of an organically modified silane;
 * - residuePerMolecule: residue formula units per precursor molecule
 *   (1 for TEOS → SiO2, 0.5 for Al(OR)3 → ½ Al2O3);
 * - residueDensity (g/cm³): skeletal density of the dry residue phase;
 * - networkAtomsPerMolecule: Si, Ti, Zr, Al, P atoms per molecule;
 * - hydrolysableGroupsPerMolecule: alkoxy groups per molecule;
 * - leavingAlcohol: alcohol released by hydrolysis (name, molar mass g/mol);
 * - conversionTemperatureC (°C): temperature needed to turn it into the stated residue;
 * - residueRefractiveIndex (n_D, 589 nm, 20–25 °C): of the residue as it is in the dry coat
 *   (amorphous, low-temperature hybrid), for the coat's refractive index.
 *
 * @example
 * ```ts
 * precursorDataSchema.parse({ residueFormula: "SiO2", residueMolarMass: 60.083, residuePerMolecule: 1,
 *   residueDensity: 2.2, networkAtomsPerMolecule: 1, hydrolysableGroupsPerMolecule: 4 });
 * ```
 */
export const precursorDataSchema = z.object(
  {
    residueFormula: nonEmptyString("residue formula"),
    residueMolarMass: rangedNumber("residue molar mass (g/mol)", MOLAR_MASS_G_PER_MOL),
    residuePerMolecule: rangedNumber("residue formula units per molecule", RESIDUE_UNITS_PER_MOLECULE),
    residueDensity: rangedNumber("residue density (g/cm³)", DENSITY_G_PER_CM3),
    networkAtomsPerMolecule: zeroOrRangedNumber("network-forming atoms per molecule", PER_MOLECULE),
    hydrolysableGroupsPerMolecule: zeroOrRangedNumber("hydrolysable groups per molecule", PER_MOLECULE),
    leavingAlcohol: z
      .object(
        {
          name: nonEmptyString("alcohol name"),
          molarMass: rangedNumber("alcohol molar mass (g/mol)", MOLAR_MASS_G_PER_MOL),
        },
        { error: required("leaving alcohol", "an object") },
      )
      .optional(),
    conversionTemperatureC: rangedNumber("conversion temperature (°C)", TEMPERATURE_C).optional(),
    residueRefractiveIndex: rangedNumber("residue refractive index", REFRACTIVE_INDEX).optional(),
  },
  { error: required("precursor data", "an object") },
);

/**
 * What a modifier (a chelating or exchanging ligand: acetylacetone, ethyl
 * acetoacetate, methacrylic acid …) does to the alkoxide it is added to
 * (chemistry: "Modifiers"):
 * - groupsReplacedPerMolecule: alkoxy groups each ligand replaces (q, 1 for these ligands);
 * - bondedFormula / bondedMolarMass (g/mol): the ligand as it stays in the dry solid,
 *   the anion's molar mass less half an oxygen atom (acac⁻ C5H7O2 99.11 → 91.11 g/mol);
 * - bondedDensity (g/cm³): density of the bonded-ligand phase in the dry composite;
 * - removalTemperatureC (°C): a step at or above it burns the ligand out.
 *
 * @example
 * ```ts
 * modifierDataSchema.parse({ groupsReplacedPerMolecule: 1, bondedFormula: "C5H7O1.5", bondedMolarMass: 91.11, bondedDensity: 1.3 });
 * ```
 */
export const modifierDataSchema = z.object(
  {
    groupsReplacedPerMolecule: rangedNumber("alkoxy groups replaced per ligand", PER_MOLECULE),
    bondedFormula: nonEmptyString("bonded ligand formula"),
    bondedMolarMass: rangedNumber("bonded ligand molar mass (g/mol)", MOLAR_MASS_G_PER_MOL),
    bondedDensity: rangedNumber("bonded ligand density (g/cm³)", DENSITY_G_PER_CM3),
    removalTemperatureC: rangedNumber("ligand removal temperature (°C)", TEMPERATURE_C).optional(),
  },
  { error: required("modifier data", "an object") },
);

/**
 * Thermal limits, °C: glass transition, melting, degradation onset in air
 * (e.g. onset of mass loss in thermogravimetry) and, optionally, in inert
 * gas; for plastics a short-term limit, the heat deflection temperature at
 * 1.8 MPa (ISO 75-2 method A), and a grade-specific long-term maximum
 * service temperature.
 *
 * @example
 * ```ts
 * thermalDataSchema.parse({ glassTransitionC: 147, degradationOnsetC: 450, heatDeflectionC: 132, maxServiceC: 125 });
 * ```
 */
export const thermalDataSchema = z.object(
  {
    glassTransitionC: rangedNumber("glass transition (°C)", TEMPERATURE_C).optional(),
    meltingC: rangedNumber("melting point (°C)", TEMPERATURE_C).optional(),
    degradationOnsetC: rangedNumber("degradation onset in air (°C)", TEMPERATURE_C).optional(),
    degradationOnsetInertC: rangedNumber("degradation onset in inert gas (°C)", TEMPERATURE_C).optional(),
    heatDeflectionC: rangedNumber("heat deflection temperature at 1.8 MPa (°C)", TEMPERATURE_C).optional(),
    maxServiceC: rangedNumber("maximum service temperature (°C)", TEMPERATURE_C).optional(),
  },
  { error: required("thermal data", "an object") },
);

/** The mass fractions of a material as supplied that must not add up to more than 1. */
interface CompositionFractions {
  assay?: number;
  waterFraction?: number;
  solventFraction?: number;
}

/** assay (default 1) + waterFraction + solventFraction, dimensionless. */
function compositionSum(material: CompositionFractions): number {
  return (material.assay ?? 1) + (material.waterFraction ?? 0) + (material.solventFraction ?? 0);
}

/**
 * A material as supplied. Units: molarMass g/mol of the active compound
 * (including water of crystallisation); density g/cm³ as supplied;
 * phaseDensity g/cm³ of the dry organic phase; assay, waterFraction and
 * solventFraction are mass fractions of the material as supplied. For
 * polymers, `formula` is the repeat unit. For the coat's predictions:
 * refractiveIndex (n_D, 589 nm, 20–25 °C) of an organic phase, a substrate or
 * a modifier's bonded ligand; boilingPointC (°C at 101.3 kPa, for VOC);
 * epoxyEquivalentWeight / amineHydrogenEquivalentWeight (g/eq of the active
 * compound); pricePerKg (the team's price per kg as supplied, in the team's
 * currency).
 *
 * @example
 * ```ts
 * materialSchema.parse({ id: "ethanol", name: "Ethanol", kind: "solvent", formula: "C2H6O", molarMass: 46.069, density: 0.7893 });
 * ```
 */
export const materialSchema = z
  .object(
    {
      id: nonEmptyString("material reference", "the material has no reference in the library"),
      name: nameText("material name", { max: MATERIAL_NAME_MAX }),
      kind: z.enum(MATERIAL_KINDS, {
        error: `kind must be one of ${MATERIAL_KINDS.join(", ")}`,
      }),
      formula: z.string({ error: required("formula", "text") }).optional(),
      casNumber: z
        .string({ error: required("CAS number", "text") })
        .regex(CAS_NUMBER, { error: "CAS number must look like 78-10-4" })
        .refine(casCheckDigitValid, { error: "CAS number check digit does not match" })
        .nullable()
        .optional(),
      molarMass: rangedNumber("molar mass (g/mol)", MOLAR_MASS_G_PER_MOL).optional(),
      density: rangedNumber("density (g/cm³)", DENSITY_G_PER_CM3).optional(),
      assay: rangedNumber("assay", ASSAY).optional(),
      waterFraction: fraction("water fraction", true).optional(),
      solventFraction: fraction("solvent fraction", true).optional(),
      crystalWaterPerFormula: zeroOrRangedNumber("water of crystallisation per formula unit", PER_MOLECULE).optional(),
      phaseDensity: rangedNumber("dry phase density (g/cm³)", DENSITY_G_PER_CM3).optional(),
      precursor: precursorDataSchema.optional(),
      modifier: modifierDataSchema.optional(),
      /** The solvent this material carries (its solventFraction): a material id, e.g. "1-propanol" in a zirconium propoxide solution. */
      solventId: nonEmptyString("carried solvent").optional(),
      /** A Ti, Zr or Al alkoxide that hydrolyses far faster than a silicon alkoxide and wants a modifier. */
      fastHydrolysing: z.boolean({ error: "fast-hydrolysing must be true or false" }).optional(),
      /** Moisture-sensitive and flammable like the alkoxides (default: a precursor with hydrolysable groups). */
      moistureSensitive: z.boolean({ error: "moisture-sensitive must be true or false" }).optional(),
      thermal: thermalDataSchema.optional(),
      /** n_D (589 nm, 20–25 °C) of the organic phase, the substrate or a modifier's bonded ligand. */
      refractiveIndex: rangedNumber("refractive index", REFRACTIVE_INDEX).optional(),
      /** °C at 101.3 kPa (initial boiling point); decides what counts as VOC. */
      boilingPointC: rangedNumber("boiling point (°C)", TEMPERATURE_C).optional(),
      /** g of active compound per mol of epoxy groups (EEW). */
      epoxyEquivalentWeight: rangedNumber("epoxy equivalent weight (g/eq)", EQUIVALENT_WEIGHT_G_PER_EQ).optional(),
      /** g of active compound per mol of amine hydrogens (AHEW). */
      amineHydrogenEquivalentWeight: rangedNumber("amine hydrogen equivalent weight (g/eq)", EQUIVALENT_WEIGHT_G_PER_EQ).optional(),
      /** The team's price per kg as supplied, in the team's currency. */
      pricePerKg: rangedNumber("price per kg", PRICE_PER_KG).optional(),
      hazards: z
        .array(
          z.string({ error: required("hazard statement", "text") }).regex(HAZARD_CODE, {
            error: "hazard statements must be GHS codes such as H225",
          }),
          { error: required("hazards", "a list of GHS codes") },
        )
        .optional(),
      // A single check instead of a per-entry record schema: sources never enter the
      // arithmetic, and this keeps validation cheap on every engine call.
      sources: z
        .custom<Record<string, string>>(isStringMap, { error: "sources must map each property name to a source text" })
        .optional(),
    },
    { error: required("material", "an object") },
  )
  // a plain check (cheaper for zod than a refinement that adds its own issues), on the assay, naming the sum
  .refine((material) => compositionSum(material) <= 1 + COMPOSITION_SUM_TOLERANCE, {
    path: ["assay"],
    error: (issue) =>
      `assay + water fraction + solvent fraction is ${Number(compositionSum(issue.input as CompositionFractions).toPrecision(6))}, it must not exceed 1`,
  });

/** A material as supplied, see `materialSchema`. */
export type Material = z.infer<typeof materialSchema>;
/** Precursor data of a material, see `precursorDataSchema`. */
export type PrecursorData = z.infer<typeof precursorDataSchema>;
/** Modifier data of a material, see `modifierDataSchema`. */
export type ModifierData = z.infer<typeof modifierDataSchema>;
/** Thermal limits of a material, see `thermalDataSchema`. */
export type ThermalData = z.infer<typeof thermalDataSchema>;
