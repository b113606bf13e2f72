/**
 * Helpers for the tests of the numeric coat figures (not part of the
 * engine's API): the NumericCoatContext of a decimal engine result, the coat
 * figures of that result, and a comparison of the two sets of figures.
 */
import { expect } from "vitest";
import type { CoatContext } from "../coat";
import { type Dec, toNumber } from "../decimal";
import type { FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import type { FormulationResult } from "../result-types";
import { COAT_KEYS, type NumericCoatContext, type NumericCoatFigures } from "./context";
import { figuresFromResult } from "./figures";


/**
 * Density of the dry phase a material leaves in the composite, g/cm³, from
 * the material data: a precursor's residue density, a modifier's bonded
 * ligand density, an organic phase's dry density (or its density as supplied).
 */
function phaseDensityOf(material: Material): number | undefined {
  if (material.kind === "precursor") return material.precursor?.residueDensity;
  if (material.kind === "modifier") return material.modifier?.bondedDensity;
  return material.phaseDensity ?? material.density;
}

/**
 * The NumericCoatContext of a decimal engine result: lines from
 * result.lines (0 for absent fields), phases from result.composite.phases
 * with their densities from the materials, S = composite mass, the sol's
 * mass and volume, water added + carried, the hydrolysis alcohols (molar
 * mass = g / mol), ρ_th and the porosity (0 without a bulk density).
 *
 * @example
 * ```ts
 * numericCoat(coatContextFromResult(input, computeFormulation(input)));
 * ```
 */
export function coatContextFromResult(input: FormulationInput, result: FormulationResult): NumericCoatContext {
  const byId = new Map(input.materials.map((m) => [m.id, m]));
  const material = (id: string): Material => {
    const found = byId.get(id);
    if (!found) throw new Error(`no material ${id}`);
    return found;
  };
  const phases = result.composite.phases.map((p) => {
    const density = phaseDensityOf(material(p.materialId));
    // the composite reports the density it used: the material data must give the same
    if (density !== p.density) throw new Error(`phase density of ${p.materialId}: material ${density}, composite ${p.density}`);
    return { materialId: p.materialId, ...(p.residueFormula === undefined ? {} : { residueFormula: p.residueFormula }), weightFraction: p.weightFraction, density };
  });
  return {
    input,
    byId,
    lines: result.lines.map((l) => ({
      materialId: l.materialId,
      role: l.role,
      massGrams: l.massGrams,
      volumeMl: l.volumeMl,
      moles: l.moles ?? 0,
      residueGrams: l.residueGrams ?? 0,
      carriedSolventGrams: l.carriedSolventGrams ?? 0,
    })),
    phases,
    solidMass: result.composite.massGrams,
    solMass: result.sol.massGrams,
    solVolume: result.sol.volumeMl,
    totalWaterMol: result.water.carriedMol + result.water.addMol,
    waterMaterial: material(input.water.materialId),
    alcohols: result.alcohol.map((a) => ({ mol: a.mol, molarMass: a.grams / a.mol })),
    theoreticalDensity: result.composite.theoreticalDensity,
    porosity: result.composite.porosity ?? 0,
  };
}

/**
 * The NumericCoatContext of the decimal context the engine hands to
 * addCoatPredictions, with the result so far (for ρ_th and the porosity):
 * for points where the coat predictions throw, which leave no result.
 * `alcohols` must be a list (the engine passes a one-shot iterator).
 *
 * @example
 * ```ts
 * numericCoat(coatContextFromDecimal(partialResult, { ...context, alcohols: [...context.alcohols] }));
 * ```
 */
export function coatContextFromDecimal(result: FormulationResult, context: CoatContext & { alcohols: readonly { mol: Dec; molarMass: number }[] }): NumericCoatContext {
  const byId = new Map([...context.byId].map(([id, entry]) => [id, entry.material]));
  const n = (value: Dec | undefined): number => (value === undefined ? 0 : toNumber(value));
  return {
    input: context.input,
    byId,
    lines: context.lines.map((l) => ({
      materialId: l.materialId,
      role: l.role,
      massGrams: n(l.massGrams),
      volumeMl: n(l.volumeMl),
      moles: n(l.moles),
      residueGrams: n(l.residueGrams),
      carriedSolventGrams: n(l.carriedSolventGrams),
    })),
    phases: context.phases.map((p) => ({
      materialId: p.materialId,
      ...(p.residueFormula === undefined ? {} : { residueFormula: p.residueFormula }),
      weightFraction: toNumber(p.weightFraction),
      density: p.densityValue,
    })),
    solidMass: n(context.solidMass),
    solMass: n(context.solMass),
    solVolume: n(context.solVolume),
    totalWaterMol: n(context.totalWaterMol),
    waterMaterial: context.waterEntry.material,
    alcohols: context.alcohols.map((a) => ({ mol: toNumber(a.mol), molarMass: a.molarMass })),
    theoreticalDensity: result.composite.theoreticalDensity,
    porosity: result.composite.porosity ?? 0,
  };
}

/**
 * The coat figures of a decimal engine result (NaN where it has none).
 *
 * @example
 * ```ts
 * coatFiguresOf(computeFormulation(input), input.materials).refractiveIndex;
 * ```
 */
export function coatFiguresOf(result: FormulationResult, materials: readonly Material[]): NumericCoatFigures {
  const all = figuresFromResult(result, materials);
  return Object.fromEntries(COAT_KEYS.map((key) => [key, all[key]])) as unknown as NumericCoatFigures;
}

/**
 * Asserts every coat figure is NaN exactly where the expected one is, and
 * otherwise within `rel` of it relative to its size. The index mismatch
 * (coat − substrate) is a difference of two indices near 1.5: its error is
 * that of the indices, so it is compared relative to the substrate's index
 * (the larger operand) when that is larger than the mismatch.
 *
 * @example
 * ```ts
 * expectCoatFiguresClose(numeric, coatFiguresOf(result, input.materials), 1e-9);
 * ```
 */
export function expectCoatFiguresClose(actual: NumericCoatFigures, expected: NumericCoatFigures, rel: number): void {
  for (const key of COAT_KEYS) {
    const a = actual[key];
    const e = expected[key];
    if (Number.isNaN(e)) {
      expect(a, `${key}: the engine has none`).toBeNaN();
      continue;
    }
    expect(Number.isFinite(a), `${key}: ${a}, engine ${e}`).toBe(true);
    let scale = Math.abs(e);
    if (key === "indexMismatch") scale = Math.max(scale, Math.abs(expected.refractiveIndex - e));
    const error = Math.abs(a - e) / (scale === 0 ? 1 : scale);
    expect(error, `${key}: numeric ${a}, engine ${e}`).toBeLessThanOrEqual(rel);
  }
}
