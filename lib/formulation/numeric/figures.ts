/**
 * The figures the numeric path (plain float64) computes for one point of an
 * exploration, and the same figures read from the decimal engine's result.
 * The decimal engine stays the source of every saved, printed or released
 * recipe; these figures are for plots and searches only.
 *
 * A figure the engine leaves out (no coating, no bulk density, no price …)
 * is NaN here, so that every figures object has the same shape.
 */
import { computeFormulation } from "../compute";
import { isFormulationError } from "../errors";
import { molarMassOf } from "../formula";
import type { FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import type { FormulationResult, ThermalStatus } from "../result-types";
import type { Knob } from "./knobs";

/** One phase of the dry composite: a residue, an organic phase or a bonded ligand. */
export interface NumericPhase {
  materialId: string;
  /** True for the phase of an organic component (kind "organic"); residues and bonded ligands are not. */
  organic: boolean;
  weightFraction: number;
  volumeFraction: number;
}

/** Every figure an exploration can plot or search on. Units in the names; NaN where the engine has no value. */
export interface NumericFigures {
  /** sol.massGrams */
  solMassGrams: number;
  /** sol.volumeMl (ideal mixing) */
  solVolumeMl: number;
  /** sol.solidsFraction, dry composite / sol mass */
  solidsFraction: number;
  /** sol.residueGramsPerL */
  residueGramsPerL: number;
  /** composite.massGrams */
  compositeMassGrams: number;
  /** composite.theoreticalDensity, g/cm³ */
  theoreticalDensity: number;
  /** composite.porosity (NaN without a bulk density) */
  porosity: number;
  /** composite.denseShrinkage.linear */
  denseLinearShrinkage: number;
  /** composite.denseShrinkage.volumetric */
  denseVolumetricShrinkage: number;
  /** Σ weight fraction of the phases with `organic` true. */
  organicWeightFraction: number;
  /** Σ volume fraction of the phases with `organic` true. */
  organicVolumeFraction: number;
  /**
   * Organic content of the dry composite, mass fraction: organic phases, bonded modifier ligands, and the
   * organic group R of every R-SiO1.5 residue (its share of the residue's formula mass, e.g. C6H11O2 in
   * (C6H11O2)SiO1.5 from GPTMS: 115.15 / 167.23 = 0.689). What a burn-off (TGA) of the ideal composite would lose.
   */
  organicContent: number;
  /** composite.phases, in the engine's order. */
  phases: NumericPhase[];
  /** water.effectiveR */
  effectiveR: number;
  /** water.effectiveH (NaN when absent) */
  effectiveH: number;
  /** water.addGrams */
  waterAddGrams: number;
  /** solvent.addedGrams (NaN without a solvent) */
  solventAddedGrams: number;
  /** solvent.molPerNetworkAtom (NaN when absent) */
  solventMolPerNetworkAtom: number;
  /** thermal.status */
  thermalStatus: ThermalStatus;
  /** thermal.maxAllowedC, °C (NaN when absent) */
  maxAllowedC: number;
  /** coating.wetThicknessUm (NaN without a coating) */
  wetThicknessUm: number;
  /** coating.dryThicknessNm */
  dryThicknessNm: number;
  /** coating.coverageM2PerL */
  coverageM2PerL: number;
  /** coating.capillaryNumber (dip only) */
  capillaryNumber: number;
  /** optics.refractiveIndex */
  refractiveIndex: number;
  /** optics.mismatch, coat − substrate */
  indexMismatch: number;
  /** voc.massGrams */
  vocMassGrams: number;
  /** voc.gramsPerLitre */
  vocGramsPerLitre: number;
  /** voc.gramsPerLitreLessWater */
  vocGramsPerLitreLessWater: number;
  /** cure.ratio */
  cureRatio: number;
  /** cost.total */
  costTotal: number;
  /** cost.perKgDry */
  costPerKgDry: number;
  /** cost.perLitreSol */
  costPerLitreSol: number;
  /** cost.perM2 */
  costPerM2: number;
}

/** A point the engine refuses (infeasible), with the engine's code and field. */
export interface NumericFailure {
  ok: false;
  code: string;
  field: string;
}

/** The outcome of one point: figures, or the reason the engine would refuse it. */
export type NumericOutcome = { ok: true; figures: NumericFigures } | NumericFailure;

/**
 * The figures of many points of one input whose knobs (knobs.ts) vary: resolved once, then evaluated
 * point by point into plain numbers. The figures of the last point stay readable until the next one.
 */
export interface NumericEvaluator {
  /** The scalar figures of the last point, in SCALAR_FIGURES order (compare.ts); NaN where absent or refused. */
  readonly figures: number[];
  /**
   * Computes one point.
   *
   * @param values - one value per knob, in the order the evaluator was prepared with
   * @returns the thermal status (0 clear, 1 caution, 2 fail), or −1 when the engine would refuse the point
   */
  evaluate(values: ArrayLike<number>): number;
  /** The refusal of the last point (when evaluate returned −1): the engine's code and field. */
  readonly refusal: { code: string; field: string };
  /** Σ weight or volume fraction of the last point's phases of material `id`. */
  phaseFraction(id: string, field: "weightFraction" | "volumeFraction"): number;
  /** The last point's figures as an object (allocates; for a single point). */
  toFigures(): NumericFigures;
}

/** Figures for inputs over one list of materials, indexed once. */
export interface NumericModel {
  /**
   * The figures of one input. The input must already be valid against
   * formulationInputSchema (it is not validated again); its `materials`
   * are ignored in favour of the ones the model was built with.
   */
  evaluate(input: FormulationInput): NumericOutcome;
  /**
   * An evaluator of many points of `base` with `knobs` varied, when the model offers one (the numeric
   * model does; the decimal model computes every point from its input).
   */
  prepare?(base: FormulationInput, knobs: readonly Knob[]): NumericEvaluator;
}

const nan = (value: number | undefined): number => (value === undefined ? Number.NaN : value);

/**
 * The organic share (mass fraction) of a residue formula: the parenthesised
 * leading group R of "(R)SiO1.5" over the whole formula's molar mass; 0 for an
 * oxide without such a group.
 *
 * @example
 * ```ts
 * organicShareOfResidue("(CH3)SiO1.5"); // 15.035 / 67.11 ≈ 0.224
 * organicShareOfResidue("TiO2"); // 0
 * ```
 */
export function organicShareOfResidue(formula: string): number {
  const match = /^\(([^()]+)\)/.exec(formula.replace(/\s+/g, ""));
  if (!match?.[1]) return 0;
  return molarMassOf(match[1]) / molarMassOf(formula);
}

/**
 * Per material, the organic share of its phase in the dry composite: 1 for an
 * organic phase and for a modifier's bonded ligand, the R group's share for a
 * precursor with an R-SiO1.5 residue, 0 otherwise.
 *
 * @example
 * ```ts
 * organicShares([gptms, teos, peg]).get("gptms"); // ≈ 0.689
 * ```
 */
export function organicShares(materials: readonly Material[]): Map<string, number> {
  const shares = new Map<string, number>();
  for (const m of materials) {
    if (m.kind === "organic" || m.kind === "modifier") shares.set(m.id, 1);
    else if (m.kind === "precursor" && m.precursor) shares.set(m.id, organicShareOfResidue(m.precursor.residueFormula));
  }
  return shares;
}

/**
 * The exploration figures of a decimal engine result.
 *
 * @param result - a result of computeFormulation
 * @param materials - the materials of its input
 * @returns the figures, NaN where the result has no value
 * @example
 * ```ts
 * figuresFromResult(computeFormulation(input), input.materials).theoreticalDensity; // g/cm³
 * ```
 */
export function figuresFromResult(result: FormulationResult, materials: readonly Material[]): NumericFigures {
  const kinds = new Map(materials.map((m) => [m.id, m.kind]));
  const shares = organicShares(materials);
  let organicWeightFraction = 0;
  let organicVolumeFraction = 0;
  let organicContent = 0;
  const phases: NumericPhase[] = result.composite.phases.map((p) => {
    const organic = kinds.get(p.materialId) === "organic" && p.residueFormula === undefined;
    if (organic) {
      organicWeightFraction += p.weightFraction;
      organicVolumeFraction += p.volumeFraction;
    }
    organicContent += p.weightFraction * (shares.get(p.materialId) ?? 0);
    return { materialId: p.materialId, organic, weightFraction: p.weightFraction, volumeFraction: p.volumeFraction };
  });
  return {
    solMassGrams: result.sol.massGrams,
    solVolumeMl: result.sol.volumeMl,
    solidsFraction: result.sol.solidsFraction,
    residueGramsPerL: result.sol.residueGramsPerL,
    compositeMassGrams: result.composite.massGrams,
    theoreticalDensity: result.composite.theoreticalDensity,
    porosity: nan(result.composite.porosity),
    denseLinearShrinkage: result.composite.denseShrinkage.linear,
    denseVolumetricShrinkage: result.composite.denseShrinkage.volumetric,
    organicWeightFraction,
    organicVolumeFraction,
    organicContent,
    phases,
    effectiveR: result.water.effectiveR,
    effectiveH: nan(result.water.effectiveH),
    waterAddGrams: result.water.addGrams,
    solventAddedGrams: nan(result.solvent?.addedGrams),
    solventMolPerNetworkAtom: nan(result.solvent?.molPerNetworkAtom),
    thermalStatus: result.thermal.status,
    maxAllowedC: nan(result.thermal.maxAllowedC),
    wetThicknessUm: nan(result.coating?.wetThicknessUm),
    dryThicknessNm: nan(result.coating?.dryThicknessNm),
    coverageM2PerL: nan(result.coating?.coverageM2PerL),
    capillaryNumber: nan(result.coating?.capillaryNumber),
    refractiveIndex: nan(result.optics?.refractiveIndex),
    indexMismatch: nan(result.optics?.mismatch),
    vocMassGrams: nan(result.voc?.massGrams),
    vocGramsPerLitre: nan(result.voc?.gramsPerLitre),
    vocGramsPerLitreLessWater: nan(result.voc?.gramsPerLitreLessWater),
    cureRatio: nan(result.cure?.ratio),
    costTotal: nan(result.cost?.total),
    costPerKgDry: nan(result.cost?.perKgDry),
    costPerLitreSol: nan(result.cost?.perLitreSol),
    costPerM2: nan(result.cost?.perM2),
  };
}

/**
 * A NumericModel that runs the full decimal engine on every point (validation
 * included): the reference the numeric path is tested against, and the way a
 * chosen candidate is checked before it becomes a draft.
 *
 * @param materials - the materials every evaluated input uses
 * @example
 * ```ts
 * const outcome = decimalModel(input.materials).evaluate(input);
 * if (outcome.ok) outcome.figures.refractiveIndex;
 * ```
 */
export function decimalModel(materials: readonly Material[]): NumericModel {
  return {
    evaluate(input: FormulationInput): NumericOutcome {
      try {
        return { ok: true, figures: figuresFromResult(computeFormulation({ ...input, materials: [...materials] }), materials) };
      } catch (error) {
        if (isFormulationError(error)) return { ok: false, code: error.code, field: error.field };
        throw error;
      }
    },
  };
}
