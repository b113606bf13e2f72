import { z } from "zod";
import { WEIGHT_FRACTION_SCALE_TOLERANCE } from "./constants";
import { ONE } from "./decimal";
import { compareSum, decimalSum } from "./sum-compare";
import { nameText } from "./text-rules";
import { materialSchema, type Material, type MaterialKind } from "./material-schema";
import {
  AREA_M2,
  BATCH_AMOUNT,
  DENSITY_G_PER_CM3,
  DRY_THICKNESS_NM,
  DURATION_H,
  MARGIN_C,
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

type Ctx = z.RefinementCtx;

/** The highest and lowest sums of weight fractions the engine scales to 1 (1 ± WEIGHT_FRACTION_SCALE_TOLERANCE). */
const HIGHEST_SUM = ONE.plus(WEIGHT_FRACTION_SCALE_TOLERANCE);
const LOWEST_SUM = ONE.minus(WEIGHT_FRACTION_SCALE_TOLERANCE);

function addIssue(ctx: Ctx, path: (string | number)[], code: string, message: string): void {
  ctx.addIssue({ code: "custom", path, message, params: { code } });
}

const KIND_WORDS: Record<MaterialKind, string> = {
  precursor: "a precursor",
  organic: "an organic phase",
  substrate: "a substrate",
  solvent: "a solvent",
  water: "water",
  catalyst: "a catalyst",
  modifier: "a modifier",
};

/** The kinds each reference may name. */
const COMPONENT_KINDS: readonly MaterialKind[] = ["precursor", "organic"];
const WATER_KINDS: readonly MaterialKind[] = ["water"];
const MODIFIER_KINDS: readonly MaterialKind[] = ["modifier"];
const SOLVENT_KINDS: readonly MaterialKind[] = ["solvent"];
const CATALYST_KINDS: readonly MaterialKind[] = ["catalyst"];
const SUBSTRATE_KINDS: readonly MaterialKind[] = ["substrate"];

function checkReference(
  ctx: Ctx,
  byId: Map<string, Material>,
  id: string,
  path: (string | number)[],
  kinds: readonly MaterialKind[],
): void {
  const material = byId.get(id);
  if (!material) {
    addIssue(ctx, path, "unknown_material", "the chosen material is not in the materials list");
    return;
  }
  let known = false;
  for (const kind of kinds) if (kind === material.kind) known = true;
  if (!known) {
    const wanted = kinds.map((kind) => KIND_WORDS[kind]).join(" or ");
    addIssue(ctx, path, "wrong_kind", `"${material.name}" is ${KIND_WORDS[material.kind]}, expected ${wanted}`);
  }
}

/**
 * Everything the engine needs, inline (the engine never reads a database).
 * Shapes and ranges are checked field by field; cross-field checks (weight
 * fractions summing to 1 within 0.5 %, scaled to 1 by the engine; references to known materials of the
 * right kind, no fill without a sol mass or mould volume) are custom issues
 * whose `params.code` is the FormulationError code.
 *
 * @example
 * ```ts
 * const result = formulationInputSchema.safeParse(body);
 * if (!result.success) console.log(result.error.issues);
 * ```
 */
export const formulationInputSchema = z
  .object(
    {
      materials: z.array(materialSchema, { error: required("materials", "a list") }),
      basis: basisSchema,
      components: z
        .array(componentSchema, { error: required("components", "a list") })
        .min(1, { error: "at least one component is required" }),
      water: waterSpecSchema,
      solvent: solventSpecSchema.optional(),
      catalyst: catalystSpecSchema.optional(),
      modifiers: z.array(modifierSpecSchema, { error: required("modifiers", "a list") }).optional(),
      substrateId: nonEmptyString("substrate", "choose the substrate").optional(),
      steps: z.array(processStepSchema, { error: required("process steps", "a list") }),
      marginC: rangedNumber("thermal margin (°C)", MARGIN_C).optional(),
      measuredBulkDensity: rangedNumber("measured bulk density (g/cm³)", DENSITY_G_PER_CM3).optional(),
      /** Optional order of addition: material ids; lines not listed follow in the default order. */
      /** How the coat is applied, for the film predictions (optional). */
      coating: coatingSpecSchema.optional(),
      additionOrder: z.array(nonEmptyString("addition order entry", "choose a material for each place in the addition order"), { error: required("addition order", "a list") }).optional(),
    },
    { error: required("formulation input", "an object") },
  )
  .superRefine((input, ctx) => {
    const byId = new Map<string, Material>();
    const materials = input.materials;
    for (let index = 0; index < materials.length; index += 1) {
      const material = materials[index]!;
      if (byId.has(material.id)) {
        addIssue(ctx, ["materials", index, "id"], "duplicate_material", `the material "${material.name}" appears twice in the materials list`);
      } else {
        byId.set(material.id, material);
      }
    }

    const seen = new Set<string>();
    const components = input.components;
    const fractions = new Array<number>(components.length);
    for (let index = 0; index < components.length; index += 1) {
      const component = components[index]!;
      checkReference(ctx, byId, component.materialId, ["components", index, "materialId"], COMPONENT_KINDS);
      if (seen.has(component.materialId)) {
        addIssue(
          ctx,
          ["components", index, "materialId"],
          "duplicate_component",
          `"${byId.get(component.materialId)?.name ?? "a material"}" is chosen for two components; combine its weight fractions`,
        );
      }
      seen.add(component.materialId);
      fractions[index] = component.weightFraction;
    }
    // |Σw − 1| > tolerance, as the decimal sum decides (the float sum settles all but a sum at the edge)
    if (compareSum(fractions, HIGHEST_SUM) > 0 || compareSum(fractions, LOWEST_SUM) < 0) {
      const total = decimalSum(fractions);
      addIssue(
        ctx,
        ["components"],
        "fractions_do_not_sum",
        `weight fractions sum to ${Number(total.toPrecision(8))}, they must sum to 1 (a sum within 0.5 % of 1 is scaled to 1)`,
      );
    }

    checkReference(ctx, byId, input.water.materialId, ["water", "materialId"], WATER_KINDS);
    const componentPrecursor = (id: string): boolean => seen.has(id) && byId.get(id)?.kind === "precursor";
    const nameOf = (id: string): string => (byId.has(id) ? `"${byId.get(id)!.name}"` : "the chosen material");
    if (input.water.ratio === "perPrecursor") {
      if (input.water.referenceId === undefined) {
        addIssue(ctx, ["water", "referenceId"], "invalid_input", "choose the precursor the water ratio refers to");
      } else if (!componentPrecursor(input.water.referenceId)) {
        addIssue(ctx, ["water", "referenceId"], "invalid_input", `${nameOf(input.water.referenceId)} is not a precursor of this composition`);
      }
    }
    const modifiers = input.modifiers;
    if (modifiers) {
      for (let index = 0; index < modifiers.length; index += 1) {
        const modifier = modifiers[index]!;
        checkReference(ctx, byId, modifier.materialId, ["modifiers", index, "materialId"], MODIFIER_KINDS);
        const material = byId.get(modifier.materialId);
        if (material?.kind === "modifier" && !material.modifier) {
          addIssue(ctx, ["modifiers", index, "materialId"], "invalid_input", `"${material.name}" has no modifier data (groups replaced, bonded ligand)`);
        }
        if (!componentPrecursor(modifier.precursorId)) {
          addIssue(ctx, ["modifiers", index, "precursorId"], "invalid_input", `${nameOf(modifier.precursorId)} is not a precursor of this composition`);
        }
      }
    }
    if (input.solvent) {
      checkReference(ctx, byId, input.solvent.materialId, ["solvent", "materialId"], SOLVENT_KINDS);
      if (input.solvent.mode === "fill" && input.basis.type === "solidMass") {
        addIssue(
          ctx,
          ["solvent", "mode"],
          "nothing_to_fill",
          "a solvent fill needs a sol mass (solids-content basis) or a mould volume (gel-body basis); a dry-solid-mass basis leaves nothing to fill",
        );
      }
    }
    if (input.catalyst) {
      checkReference(ctx, byId, input.catalyst.materialId, ["catalyst", "materialId"], CATALYST_KINDS);
    }
    if (input.substrateId !== undefined) {
      checkReference(ctx, byId, input.substrateId, ["substrateId"], SUBSTRATE_KINDS);
    }
    const additionOrder = input.additionOrder;
    if (additionOrder) {
      for (let index = 0; index < additionOrder.length; index += 1) {
        if (!byId.has(additionOrder[index]!)) {
          addIssue(ctx, ["additionOrder", index], "unknown_material", "a material in the addition order is not in the materials list");
        }
      }
    }
  });

/** The engine's input, see `formulationInputSchema`. */
export type FormulationInput = z.infer<typeof formulationInputSchema>;
/** The batch-size basis, see `basisSchema`. */
export type Basis = z.infer<typeof basisSchema>;
/** A dry-composite component, see `componentSchema`. */
export type Component = z.infer<typeof componentSchema>;
/** A modifier line, see `modifierSpecSchema`. */
export type ModifierSpec = z.infer<typeof modifierSpecSchema>;
/** The coating method and its settings, see `coatingSpecSchema`. */
export type CoatingSpec = z.infer<typeof coatingSpecSchema>;
/** A process step, see `processStepSchema`. */
export type ProcessStep = z.infer<typeof processStepSchema>;
