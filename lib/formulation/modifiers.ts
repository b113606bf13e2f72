import { Dec, dec, divideUnlessOne, ONE, timesFactor, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import { compareSum } from "./sum-compare";
import type { ModifierSpec, ProcessStep } from "./input-schema";
import { materialById, requireMolarMass, solutionWaterMol, volumeOf, type IndexedMaterial } from "./material-index";
import type { ModifierData, PrecursorData } from "./material-schema";
import type { Notice } from "./result-types";

/** A modifier line with its material, the precursor it modifies and whether its ligand stays in the dry solid. */
export interface ModifierPlan {
  spec: ModifierSpec;
  index: number;
  entry: IndexedMaterial;
  data: ModifierData;
  precursor: PrecursorData;
  /** False when a process step reaches the ligand's removal temperature. */
  bonded: boolean;
  /** The step that burns the ligand out, when one does. */
  removedBy?: ProcessStep;
}

/**
 * The modifier lines of an input with their data; the bonded ligand is
 * burnt out when any step reaches its removal temperature.
 *
 * @example
 * ```ts
 * planModifiers(input.modifiers ?? [], byId, input.steps)[0]?.bonded; // true below the removal temperature
 * ```
 */
export function planModifiers(
  specs: readonly ModifierSpec[],
  byId: Map<string, IndexedMaterial>,
  steps: readonly ProcessStep[],
): ModifierPlan[] {
  return specs.map((spec, index) => {
    const entry = materialById(byId, spec.materialId, `modifiers.${index}.materialId`);
    const data = entry.material.modifier;
    const target = materialById(byId, spec.precursorId, `modifiers.${index}.precursorId`).material;
    const precursor = target.precursor;
    if (!data || !precursor) {
      throw new FormulationError("invalid_input", `modifiers.${index}.materialId`, `${entry.material.name} cannot modify ${target.name}`);
    }
    const removal = data.removalTemperatureC;
    const removedBy = removal === undefined ? undefined : steps.find((step) => step.temperatureC >= removal);
    return { spec, index, entry, data, precursor, bonded: removedBy === undefined, ...(removedBy ? { removedBy } : {}) };
  });
}

/**
 * Bonded-ligand mass per gram of ligand-free dry composite, c = Σ Δm / S_free
 * (chemistry: "Modifiers"). Each bonded line adds Δm = x · a_p · M_b with
 * a_p = atoms per molecule · w_p · S_free / (k_p · M_res,p), so c does not
 * depend on S_free and S_free = S / (1 + c).
 *
 * @param plans - the modifier lines
 * @param fractionOf - the (scaled) weight fraction of a precursor component
 * @returns c, dimensionless
 * @example
 * ```ts
 * // Ti(OPr)4 at w = 0.2 (TiO2 79.865 g/mol), acac x = 1 (M_b = 91.11): c = 0.2 · 91.11 / 79.865 = 0.22816
 * ligandMassPerFreeGram(plans, (id) => new Dec(0.2));
 * ```
 */
export function ligandMassPerFreeGram(plans: readonly ModifierPlan[], fractionOf: (precursorId: string) => Dec): Dec {
  let c = ZERO;
  for (const plan of plans) {
    if (!plan.bonded) continue;
    const p = plan.precursor;
    const atomsPerResidueGram = dec(p.networkAtomsPerMolecule).div(dec(p.residuePerMolecule).times(dec(p.residueMolarMass)));
    c = c.plus(dec(plan.spec.molPerMetal).times(atomsPerResidueGram).times(fractionOf(plan.spec.precursorId)).times(dec(plan.data.bondedMolarMass)));
  }
  return c;
}

/** Amounts of one modifier line (decimal; units in the names). */
export interface ModifierAmounts {
  /** mol ligand: x · a_p. */
  moles: Dec;
  /** g as supplied: n · M / assay. */
  massGrams: Dec;
  volumeMl: Dec;
  /** mol alkoxy groups replaced: q · n. */
  groupsReplacedMol: Dec;
  /** g of bonded ligand left in the dry solid: n · M_b, or 0 when burnt out. */
  bondedGrams: Dec;
  carriedWaterMol: Dec;
  carriedSolventGrams: Dec;
}

/**
 * One modifier line's amounts for a precursor with `precursorAtomMol` mol of
 * network-forming atoms.
 *
 * @example
 * ```ts
 * // acac (100.117 g/mol, 0.975 g/cm³), x = 1 on 0.1 mol Ti → 10.0117 g, 10.268 mL
 * modifierAmounts(plan, new Dec(0.1)).massGrams.toNumber(); // 10.0117
 * ```
 */
export function modifierAmounts(plan: ModifierPlan, precursorAtomMol: Dec): ModifierAmounts {
  const material = plan.entry.material;
  const moles = dec(plan.spec.molPerMetal).times(precursorAtomMol);
  const massGrams = divideUnlessOne(moles.times(requireMolarMass(plan.entry)), material.assay);
  return {
    moles,
    massGrams,
    volumeMl: volumeOf(plan.entry, massGrams),
    groupsReplacedMol: moles.times(dec(plan.data.groupsReplacedPerMolecule)),
    bondedGrams: plan.bonded ? moles.times(dec(plan.data.bondedMolarMass)) : ZERO,
    carriedWaterMol: solutionWaterMol(material, massGrams),
    carriedSolventGrams: timesFactor(massGrams, material.solventFraction),
  };
}

/**
 * Refuses more ligand than a precursor has alkoxy groups: Σ x · q over the
 * lines on one precursor may not exceed its groups per metal atom
 * ("too_much_modifier" on the last line that passes the limit).
 *
 * @example
 * ```ts
 * checkModifierLoad(plans); // throws for acac x = 5 on Ti(OR)4 (5 > 4)
 * ```
 */
export function checkModifierLoad(plans: readonly ModifierPlan[], names: (precursorId: string) => string): void {
  const load = new Map<string, Dec>();
  for (const plan of plans) {
    const p = plan.precursor;
    const total = (load.get(plan.spec.precursorId) ?? ZERO).plus(dec(plan.spec.molPerMetal).times(dec(plan.data.groupsReplacedPerMolecule)));
    load.set(plan.spec.precursorId, total);
    const perMetal = dec(p.hydrolysableGroupsPerMolecule).div(p.networkAtomsPerMolecule > 0 ? dec(p.networkAtomsPerMolecule) : new Dec(1));
    if (total.greaterThan(perMetal.times(1 + 1e-12))) {
      throw new FormulationError(
        "too_much_modifier",
        `modifiers.${plan.index}.molPerMetal`,
        `the modifiers on ${names(plan.spec.precursorId)} would replace ${Number(total.toPrecision(4))} alkoxy groups per metal atom, ` +
          `but it has only ${Number(perMetal.toPrecision(4))}; lower the modifier ratio`,
      );
    }
  }
}

/** Least modifier ratio (mol per mol metal) that counts as "modified" for the fast-hydrolysis caution. Livage, Henry & Sanchez (1988). */
export const MIN_MODIFIER_RATIO = 0.5;
const MIN_MODIFIER_RATIO_DEC = dec(MIN_MODIFIER_RATIO);

/**
 * Cautions for fast-hydrolysing alkoxides (Ti, Zr, Al; material flag
 * `fastHydrolysing`) present without a modifier of at least 0.5 mol per
 * metal, in a sol whose effective R exceeds 1: they precipitate instead of
 * co-condensing (Livage, Henry & Sanchez, Prog. Solid State Chem. 18 (1988) 259).
 *
 * @example
 * ```ts
 * fastHydrolysisNotices([{ id: "ti-isopropoxide", name: "Ti(OiPr)4", path: "materials.2" }], plans, 4);
 * ```
 */
export function fastHydrolysisNotices(
  fast: readonly { id: string; name: string; path: string }[],
  plans: readonly ModifierPlan[],
  effectiveR: Dec,
): Notice[] {
  if (fast.length === 0 || !effectiveR.greaterThan(ONE)) return [];
  const notices: Notice[] = [];
  // the same words for every precursor: built once, when the first caution is raised
  let rest: string | undefined;
  for (const precursor of fast) {
    // Σ mol per metal of its modifiers against the minimum, as the decimal sum decides (see compareSum)
    let ratios: number[] | undefined;
    for (const plan of plans) if (plan.spec.precursorId === precursor.id) (ratios ??= []).push(plan.spec.molPerMetal);
    if (ratios !== undefined && compareSum(ratios, MIN_MODIFIER_RATIO_DEC) >= 0) continue;
    rest ??=
      ` hydrolyses far faster than the silicon alkoxides and, at an effective R of ${Number(effectiveR.toPrecision(4))}, ` +
      `will precipitate unless it is modified first: add a chelating modifier (acetylacetone, ethyl acetoacetate or a carboxylic acid) ` +
      `at ${MIN_MODIFIER_RATIO}–2 mol per mol metal before any water.`;
    notices.push({ level: "caution", code: "fast_hydrolysis_unmodified", field: "modifiers", message: `${precursor.name}${rest}` });
  }
  return notices;
}

/**
 * Notes on the modifiers: the weight fractions were targets of the
 * ligand-free composite, and which ligands a step burns out.
 *
 * @example
 * ```ts
 * modifierNotices(plans, true).map((n) => n.code); // ["ligand_free_targets"]
 * ```
 */
export function modifierNotices(plans: readonly ModifierPlan[], bondedPresent: boolean): Notice[] {
  const notices: Notice[] = [];
  if (bondedPresent) {
    notices.push({
      level: "info",
      code: "ligand_free_targets",
      field: "components",
      message:
        "The weight fractions entered are of the ligand-free composite; the bonded modifier ligands are a phase of their own, " +
        "so the composite's weight and volume fractions below include them and the basis fixes the whole.",
    });
  }
  for (const plan of plans) {
    if (!plan.removedBy) continue;
    notices.push({
      level: "info",
      code: "ligand_removed",
      field: `modifiers.${plan.index}`,
      message:
        `"${plan.removedBy.name}" at ${plan.removedBy.temperatureC} °C reaches the removal temperature of ${plan.entry.material.name} ` +
        `(${plan.data.removalTemperatureC} °C): its bonded ligand is burnt out and not counted in the dry composite.`,
    });
  }
  return notices;
}
