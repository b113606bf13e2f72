import { z } from "zod";
import { WEIGHT_FRACTION_SCALE_TOLERANCE } from "./constants";
import { ONE } from "./decimal";
import { DENSITY_G_PER_CM3, MARGIN_C } from "./limits";
import { materialSchema, type Material, type MaterialKind } from "./material-schema";
import { compareSum, decimalSum } from "./sum-compare";
import { nonEmptyString, rangedNumber, required } from "./zod-helpers";
import {
  basisSchema,
  catalystSpecSchema,
  coatingSpecSchema,
  componentSchema,
  modifierSpecSchema,
  processStepSchema,
  solventSpecSchema,
  waterSpecSchema,
} from "./input-parts";

// the parts stay importable from here, beside the input they make up
export * from "./input-parts";

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
