/**
 * The parts of a formulation input, each a zod schema: the basis, the
 * components, water, solvent, catalyst, process steps, modifiers and the
 * coating. `formulationInputSchema` (input-schema.ts) puts them together and
 * adds the checks across fields; import them from there.
 */
import { z } from "zod";
import { nameText } from "./text-rules";
import {
  AREA_M2,
  BATCH_AMOUNT,
  DENSITY_G_PER_CM3,
  DRY_THICKNESS_NM,
  DURATION_H,
  MOLAR_RATIO,
  SPIN_RPM,
  SURFACE_TENSION_MN_PER_M,
  TEMPERATURE_C,
  VISCOSITY_MPA_S,
  WEIGHT_FRACTION,
  WET_THICKNESS_UM,
  WITHDRAWAL_MM_PER_S,
} from "./limits";
import { fraction, nonEmptyString, positiveNumber, rangedNumber, required, zeroOrRangedNumber } from "./zod-helpers";

/**
 * What fixes the batch size:
 * - solidMass: dry composite mass `grams` (g);
 * - solidsContent: sol mass `solMassGrams` (g) and solids content
 *   `solidsFraction` (dry composite mass / sol mass, 0 < x < 1);
 * - gelBody: mould volume `volumeMl` (mL), target bulk density `bulkDensity`
 *   (g/cm³) and expected linear drying shrinkage `linearShrinkage` (0 ≤ s < 1,
 *   default 0).
 *
 * @example
 * ```ts
 * basisSchema.parse({ type: "gelBody", volumeMl: 50, bulkDensity: 0.5, linearShrinkage: 0.25 });
 * ```
 */
export const basisSchema = z.discriminatedUnion(
  "type",
  [
    z.object({ type: z.literal("solidMass"), grams: rangedNumber("dry solid mass (g)", BATCH_AMOUNT) }),
    z.object({
      type: z.literal("solidsContent"),
      solMassGrams: rangedNumber("sol mass (g)", BATCH_AMOUNT),
      solidsFraction: positiveNumber("solids content").lt(1, { error: "solids content must be below 1" }),
    }),
    z.object({
      type: z.literal("gelBody"),
      volumeMl: rangedNumber("mould volume (mL)", BATCH_AMOUNT),
      bulkDensity: rangedNumber("bulk density (g/cm³)", DENSITY_G_PER_CM3),
      linearShrinkage: fraction("linear shrinkage", true).optional(),
    }),
  ],
  { error: "the basis must be a dry solid mass, a sol mass with its solids content, or a gel body" },
);

/**
 * One component of the dry composite: a precursor (weight fraction of its
 * residue) or an organic phase (dry weight fraction); 0 or 1e-6 … 1.
 *
 * @example
 * ```ts
 * componentSchema.parse({ materialId: "teos", weightFraction: 0.6 });
 * ```
 */
export const componentSchema = z.object(
  {
    materialId: nonEmptyString("component material", "choose a material for the component"),
    weightFraction: zeroOrRangedNumber("weight fraction", WEIGHT_FRACTION),
  },
  { error: required("component", "an object") },
);

/** How the water target is stated (chemistry: "Water"). */
export const WATER_RATIOS = ["R", "h", "perPrecursor"] as const;

/**
 * Water target: R (mol H2O per mol network-forming atom, the "h = H2O/M" of
 * many transition-metal papers), h (per mol hydrolysable group left after
 * ligand exchange) or perPrecursor (per mol of the precursor `referenceId`,
 * e.g. H2O : TEOS = 12). `countCarried` (default true): water carried by the
 * other materials counts toward the target; false adds the whole target.
 *
 * @example
 * ```ts
 * waterSpecSchema.parse({ materialId: "water-di", ratio: "R", value: 4 });
 * waterSpecSchema.parse({ materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 12, countCarried: false });
 * ```
 */
export const waterSpecSchema = z.object(
  {
    materialId: nonEmptyString("water", "choose the water"),
    ratio: z.enum(WATER_RATIOS, { error: "water ratio must be R (per network-forming atom), h (per alkoxy group) or per mol of a precursor" }),
    value: rangedNumber("water ratio", MOLAR_RATIO),
    referenceId: nonEmptyString("reference precursor", "choose the precursor the water ratio refers to").optional(),
    countCarried: z.boolean({ error: "count carried water must be true or false" }).optional(),
  },
  { error: required("water", "an object") },
);

/**
 * Added solvent: mol per mol network-forming atom, or a fill to the basis's sol mass or mould volume.
 *
 * @example
 * ```ts
 * solventSpecSchema.parse({ materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 });
 * ```
 */
export const solventSpecSchema = z.discriminatedUnion(
  "mode",
  [
    z.object({
      materialId: nonEmptyString("solvent", "choose the solvent"),
      mode: z.literal("molPerNetworkAtom"),
      value: rangedNumber("solvent ratio (mol per mol network atom)", MOLAR_RATIO),
    }),
    z.object({ materialId: nonEmptyString("solvent", "choose the solvent"), mode: z.literal("fill") }),
  ],
  { error: "the solvent must be given in mol per mol network atom, or as a fill" },
);

/**
 * Catalyst: mol of the active acid or base per mol network-forming atom.
 *
 * @example
 * ```ts
 * catalystSpecSchema.parse({ materialId: "hcl-37", molPerNetworkAtom: 0.01 });
 * ```
 */
export const catalystSpecSchema = z.object(
  {
    materialId: nonEmptyString("catalyst", "choose the catalyst"),
    molPerNetworkAtom: rangedNumber("catalyst ratio (mol per mol network atom)", MOLAR_RATIO),
  },
  { error: required("catalyst", "an object") },
);

/** Where a step happens: in the liquid sol, while drying, or while curing (annealing included). */
export const STEP_STAGES = ["sol", "drying", "curing"] as const;
/** The gas over a step. */
export const STEP_ATMOSPHERES = ["air", "inert"] as const;

/**
 * A process step: name, temperature (°C), duration (h), stage (default
 * "curing", so stored schedules keep their checks) and atmosphere (default "air").
 *
 * @example
 * ```ts
 * processStepSchema.parse({ name: "Thermal cure", temperatureC: 120, durationH: 2, stage: "curing" });
 * ```
 */
export const processStepSchema = z.object(
  {
    name: nameText("step name", { max: 200 }),
    temperatureC: rangedNumber("step temperature (°C)", TEMPERATURE_C),
    durationH: rangedNumber("step duration (h)", DURATION_H),
    stage: z.enum(STEP_STAGES, { error: 'step stage must be "sol", "drying" or "curing"' }).optional(),
    atmosphere: z.enum(STEP_ATMOSPHERES, { error: 'step atmosphere must be "air" or "inert"' }).optional(),
  },
  { error: required("process step", "an object") },
);

/**
 * A modifier line: `molPerMetal` mol of the modifier `materialId` per mol of
 * network-forming atoms of the precursor `precursorId` (x = 0.5–2 is usual).
 *
 * @example
 * ```ts
 * modifierSpecSchema.parse({ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 });
 * ```
 */
export const modifierSpecSchema = z.object(
  {
    materialId: nonEmptyString("modifier", "choose the modifier"),
    precursorId: nonEmptyString("modified precursor", "choose the precursor it modifies"),
    molPerMetal: rangedNumber("modifier ratio (mol per mol metal)", MOLAR_RATIO),
  },
  { error: required("modifier", "an object") },
);

/** The coating methods the engine predicts a film for (chemistry: "What the coat will be"). */
export const COATING_METHODS = ["dip", "spin", "wetFilm"] as const;

/** Fields every coating method may carry: the dry thickness wanted (nm) and the area to coat (m²). */
const coatingTargets = {
  targetDryThicknessNm: rangedNumber("target dry thickness (nm)", DRY_THICKNESS_NM).optional(),
  areaM2: rangedNumber("area to coat (m²)", AREA_M2).optional(),
};

/**
 * How the coat is applied:
 * - dip: withdrawal speed (mm/s), sol viscosity (mPa·s) and surface tension
 *   (mN/m), Landau–Levich;
 * - spin: spin speed (rpm) and one measured film (`calibration`: rpm and dry
 *   thickness in nm), thickness ∝ rpm^(−1/2);
 * - wetFilm: a wet film thickness (µm) laid by a bar, a slot die or a spray.
 * Each may carry a target dry thickness (nm) and the area to coat (m²).
 *
 * @example
 * ```ts
 * coatingSpecSchema.parse({ method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24 });
 * ```
 */
export const coatingSpecSchema = z.discriminatedUnion(
  "method",
  [
    z.object({
      method: z.literal("dip"),
      withdrawalMmPerS: rangedNumber("withdrawal speed (mm/s)", WITHDRAWAL_MM_PER_S),
      viscosityMPaS: rangedNumber("sol viscosity (mPa·s)", VISCOSITY_MPA_S),
      surfaceTensionMNPerM: rangedNumber("surface tension (mN/m)", SURFACE_TENSION_MN_PER_M),
      ...coatingTargets,
    }),
    z.object({
      method: z.literal("spin"),
      rpm: rangedNumber("spin speed (rpm)", SPIN_RPM),
      calibration: z.object(
        {
          rpm: rangedNumber("calibration spin speed (rpm)", SPIN_RPM),
          dryThicknessNm: rangedNumber("calibration dry thickness (nm)", DRY_THICKNESS_NM),
        },
        { error: "spin coating needs one measured film: its spin speed (rpm) and dry thickness (nm)" },
      ),
      ...coatingTargets,
    }),
    z.object({
      method: z.literal("wetFilm"),
      wetThicknessUm: rangedNumber("wet film thickness (µm)", WET_THICKNESS_UM),
      ...coatingTargets,
    }),
  ],
  { error: "the coating method must be dip, spin or a wet film of stated thickness" },
);
