/**
 * The numeric fast path of the engine: every exploration figure of one
 * point in plain float64, from the same equations as computeFormulation
 * (lib/formulation/compute.ts) but without decimal.js, without validation
 * and without notices. Materials are indexed once when the model is built.
 * The decimal engine stays the source of every saved or released recipe;
 * the property test numeric.property.test.ts holds the two within 1e-9.
 */
import { DEFAULT_THERMAL_MARGIN_C, ML_PER_L } from "../constants";
import type { FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import { numericCoat } from "./coat";
import { composePoint } from "./composition";
import { numericEvaluator } from "./evaluator";
import type { NumericEvaluator, NumericFigures, NumericModel, NumericOutcome, NumericPhase } from "./figures";
import type { Knob } from "./knobs";
import { liquids } from "./liquids";
import { materialTable, positionOf, type MaterialTable } from "./material-table";
import { pointState, type PointState } from "./point-state";
import { NumericRefusal, refuse } from "./refusal";
import { thermalVerdict } from "./thermal";

/** S, g of dry composite, from the basis (basis.ts). */
function solidMassOf(basis: FormulationInput["basis"]): number {
  switch (basis.type) {
    case "solidMass":
      return basis.grams;
    case "solidsContent":
      return basis.solidsFraction * basis.solMassGrams;
    case "gelBody": {
      const remaining = 1 - (basis.linearShrinkage ?? 0);
      return basis.bulkDensity * basis.volumeMl * (remaining * remaining * remaining);
    }
  }
}

/** 1 − ∛r, volumetric 1 − r, for r = solid volume / sol volume. */
function shrinkageOf(ratio: number): { linear: number; volumetric: number } {
  return { volumetric: 1 - ratio, linear: 1 - Math.cbrt(ratio) };
}

/** The general branch: one whole input, every structure (modifiers, refusals, lines left out). */
function evaluatePoint(input: FormulationInput, table: MaterialTable, state: PointState): NumericFigures {
  const solidMass = solidMassOf(input.basis);
  composePoint(input, table, solidMass, state);
  const l = liquids(input, table, state);
  const { solMass, solVolume } = l;

  // Dry composite: φ_k = (w_k/ρ_k) · ρ_th, ρ_th = 1 / Σ(w_j/ρ_j).
  let totalSpecificVolume = 0;
  for (const phase of state.phases) totalSpecificVolume += phase.weightFraction / phase.density;
  const theoreticalDensity = 1 / totalSpecificVolume;
  let organicWeightFraction = 0;
  let organicVolumeFraction = 0;
  let organicContent = 0;
  const phases: NumericPhase[] = new Array<NumericPhase>(state.phases.length);
  for (let k = 0; k < state.phases.length; k += 1) {
    const p = state.phases[k]!;
    const volumeFraction = (p.weightFraction / p.density) * theoreticalDensity;
    if (p.organic) {
      organicWeightFraction += p.weightFraction;
      organicVolumeFraction += volumeFraction;
    }
    organicContent += p.weightFraction * p.share;
    phases[k] = { materialId: p.materialId, organic: p.organic, weightFraction: p.weightFraction, volumeFraction };
  }
  const dense = shrinkageOf(solidMass / theoreticalDensity / solVolume);
  const bulk = input.measuredBulkDensity ?? (input.basis.type === "gelBody" ? input.basis.bulkDensity : undefined);
  let porosity = Number.NaN;
  if (bulk !== undefined) {
    if (bulk > theoreticalDensity) refuse("bulk_density_above_theoretical", input.measuredBulkDensity !== undefined ? "measuredBulkDensity" : "basis.bulkDensity");
    porosity = 1 - bulk / theoreticalDensity;
  }

  if (input.substrateId !== undefined) {
    const substrate = table.materials[positionOf(table, input.substrateId, "substrateId")]!;
    if (substrate.thermal) state.subjects.push(substrate.thermal);
  }
  const thermal = thermalVerdict(state.subjects, state.conversionsC, input.steps, input.marginC ?? DEFAULT_THERMAL_MARGIN_C);

  const alcohols = state.alcoholOrder.map((slot) => ({ mol: state.alcoholMol[slot]!, molarMass: table.alcohols[slot]!.molarMass }));
  const coatFigures = numericCoat({
    input,
    byId: table.byId,
    lines: state.lines,
    phases: state.phases,
    solidMass,
    solMass,
    solVolume,
    totalWaterMol: l.totalWaterMol,
    waterMaterial: l.waterRow.material,
    alcohols,
    theoreticalDensity,
    porosity: Number.isNaN(porosity) ? 0 : porosity,
  });
  if ("ok" in coatFigures) throw new NumericRefusal(coatFigures.code, coatFigures.field);

  if (table.formulaRefusal) throw new NumericRefusal(table.formulaRefusal.code, table.formulaRefusal.field);
  return {
    solMassGrams: solMass,
    solVolumeMl: solVolume,
    solidsFraction: solidMass / solMass,
    residueGramsPerL: (solidMass * ML_PER_L) / solVolume,
    compositeMassGrams: solidMass,
    theoreticalDensity,
    porosity,
    denseLinearShrinkage: dense.linear,
    denseVolumetricShrinkage: dense.volumetric,
    organicWeightFraction,
    organicVolumeFraction,
    organicContent,
    phases,
    effectiveR: l.totalWaterMol / state.networkAtomMol,
    effectiveH: state.groupMol === 0 ? Number.NaN : l.totalWaterMol / state.groupMol,
    waterAddGrams: l.addGrams,
    solventAddedGrams: l.solventAddedGrams,
    solventMolPerNetworkAtom: l.solventMolPerNetworkAtom,
    thermalStatus: thermal.status,
    maxAllowedC: thermal.maxAllowedC,
    wetThicknessUm: coatFigures.wetThicknessUm,
    dryThicknessNm: coatFigures.dryThicknessNm,
    coverageM2PerL: coatFigures.coverageM2PerL,
    capillaryNumber: coatFigures.capillaryNumber,
    refractiveIndex: coatFigures.refractiveIndex,
    indexMismatch: coatFigures.indexMismatch,
    vocMassGrams: coatFigures.vocMassGrams,
    vocGramsPerLitre: coatFigures.vocGramsPerLitre,
    vocGramsPerLitreLessWater: coatFigures.vocGramsPerLitreLessWater,
    cureRatio: coatFigures.cureRatio,
    costTotal: coatFigures.costTotal,
    costPerKgDry: coatFigures.costPerKgDry,
    costPerLitreSol: coatFigures.costPerLitreSol,
    costPerM2: coatFigures.costPerM2,
  };
}

const NO_KNOBS: readonly Knob[] = [];
const NO_VALUES: readonly number[] = [];

/**
 * A NumericModel that computes every exploration figure in plain float64.
 * Inputs must already be valid (formulationInputSchema); a point the engine
 * would refuse while computing gives `{ ok: false, code, field }` with the
 * engine's code and field. `prepare` resolves an input's structure once for
 * many points (evaluator.ts); `evaluate` is prepare and one point.
 *
 * @param materials - the materials every evaluated input uses (indexed once)
 * @returns the model
 * @example
 * ```ts
 * const model = numericModel(input.materials);
 * const outcome = model.evaluate({ ...input, water: { ...input.water, value: 6 } });
 * if (outcome.ok) outcome.figures.solidsFraction; // dry composite / sol mass
 * const sweep = model.prepare!(input, [{ kind: "waterValue" }]);
 * sweep.evaluate(Float64Array.of(6)); // 0 clear, 1 caution, 2 fail, −1 refused
 * ```
 */
export function numericModel(materials: readonly Material[]): NumericModel {
  const table = materialTable(materials);
  const state = pointState(table);
  const general = (input: FormulationInput): NumericOutcome => {
    try {
      return { ok: true, figures: evaluatePoint(input, table, state) };
    } catch (error) {
      if (error instanceof NumericRefusal) return error.toFailure();
      throw error;
    }
  };
  return {
    evaluate(input: FormulationInput): NumericOutcome {
      const evaluator = numericEvaluator(table, input, NO_KNOBS, general);
      if (evaluator.evaluate(NO_VALUES) < 0) return { ok: false, code: evaluator.refusal.code, field: evaluator.refusal.field };
      return { ok: true, figures: evaluator.toFigures() };
    },
    prepare(base: FormulationInput, knobs: readonly Knob[]): NumericEvaluator {
      return numericEvaluator(table, base, knobs, general);
    },
  };
}
