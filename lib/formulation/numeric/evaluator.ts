/**
 * Many points of one input, the knobs varied: the kernel (kernel.ts) for
 * every point its plan covers, the general branch (the point's input through
 * composition.ts, liquids.ts and the coat figures) for the rest, so a point
 * always gets the same figures or refusal whichever branch computed it.
 */
import type { FormulationInput } from "../input-schema";
import type { ThermalStatus } from "../result-types";
import { SCALAR_FIGURES } from "./compare";
import type { NumericEvaluator, NumericFigures, NumericOutcome, NumericPhase } from "./figures";
import { KERNEL_GENERAL, kernelPoint, kernelState } from "./kernel";
import { C_ORGANIC, C_PHASE_DENSITY, STRIDE, zeros } from "./kernel-layout";
import { kernelPlan } from "./kernel-plan";
import { inputAt, type Knob } from "./knobs";
import type { MaterialTable } from "./material-table";

const STATUS: readonly ThermalStatus[] = ["clear", "caution", "fail"];
const STATUS_RANK: Record<string, number> = { clear: 0, caution: 1, fail: 2 };
const REFUSED = -1;
// Read once (an imported binding is a getter where modules are compiled one by one).
const GENERAL = KERNEL_GENERAL;
const point = kernelPoint;

/**
 * An evaluator of `base` with `knobs` varied over the materials of `table`.
 *
 * @param general - the general branch: the figures of one whole input, or the engine's refusal
 * @example
 * ```ts
 * const evaluator = numericEvaluator(table, input, [{ kind: "waterValue" }], general);
 * if (evaluator.evaluate(Float64Array.of(6)) >= 0) evaluator.figures[0]; // sol mass, g
 * ```
 */
export function numericEvaluator(
  table: MaterialTable,
  base: FormulationInput,
  knobs: readonly Knob[],
  general: (input: FormulationInput) => NumericOutcome,
): NumericEvaluator {
  const plan = kernelPlan(table, base, knobs);
  const state = plan && kernelState(plan);
  const figures = zeros(SCALAR_FIGURES.length);
  const density = SCALAR_FIGURES.indexOf("theoreticalDensity");
  const ids = base.components.map((c) => c.materialId);
  const refusal = { code: "", field: "" };
  /** The general branch's figures of the last point, undefined when the kernel computed it. */
  let last: NumericFigures | undefined;
  let status = REFUSED;

  function phases(): NumericPhase[] {
    if (last) return last.phases;
    return ids.map((materialId, i) => {
      const w = state!.w[i]!;
      return { materialId, organic: plan!.coef[i * STRIDE + C_ORGANIC] === 1, weightFraction: w, volumeFraction: (w / plan!.coef[i * STRIDE + C_PHASE_DENSITY]!) * figures[density]! };
    });
  }

  return {
    figures,
    refusal,
    evaluate(values: ArrayLike<number>): number {
      last = undefined;
      if (plan) {
        status = point(plan, state!, values, figures);
        if (status !== GENERAL) return status;
      }
      const outcome = general(inputAt(base, knobs, values));
      if (!outcome.ok) {
        refusal.code = outcome.code;
        refusal.field = outcome.field;
        figures.fill(Number.NaN);
        status = REFUSED;
        return status;
      }
      last = outcome.figures;
      for (let k = 0; k < SCALAR_FIGURES.length; k++) figures[k] = last[SCALAR_FIGURES[k]!];
      status = STATUS_RANK[last.thermalStatus]!;
      return status;
    },
    phaseFraction(id: string, field: "weightFraction" | "volumeFraction"): number {
      if (status === REFUSED) return Number.NaN;
      let sum = 0;
      if (last) {
        for (const phase of last.phases) if (phase.materialId === id) sum += phase[field];
        return sum;
      }
      for (let i = 0; i < ids.length; i++) {
        if (ids[i] !== id) continue;
        const w = state!.w[i]!;
        sum += field === "weightFraction" ? w : (w / plan!.coef[i * STRIDE + C_PHASE_DENSITY]!) * figures[density]!;
      }
      return sum;
    },
    toFigures(): NumericFigures {
      return last ?? figuresObject(figures, phases(), STATUS[status]!);
    },
  };
}

const I = Object.fromEntries(SCALAR_FIGURES.map((key, k) => [key, k])) as Record<(typeof SCALAR_FIGURES)[number], number>;

/** A figures object (one shape, keys in the order of evaluatePoint's) from the scalar figures. */
function figuresObject(f: readonly number[], phases: NumericPhase[], thermalStatus: ThermalStatus): NumericFigures {
  return {
    solMassGrams: f[I.solMassGrams]!,
    solVolumeMl: f[I.solVolumeMl]!,
    solidsFraction: f[I.solidsFraction]!,
    residueGramsPerL: f[I.residueGramsPerL]!,
    compositeMassGrams: f[I.compositeMassGrams]!,
    theoreticalDensity: f[I.theoreticalDensity]!,
    porosity: f[I.porosity]!,
    denseLinearShrinkage: f[I.denseLinearShrinkage]!,
    denseVolumetricShrinkage: f[I.denseVolumetricShrinkage]!,
    organicWeightFraction: f[I.organicWeightFraction]!,
    organicVolumeFraction: f[I.organicVolumeFraction]!,
    organicContent: f[I.organicContent]!,
    phases,
    effectiveR: f[I.effectiveR]!,
    effectiveH: f[I.effectiveH]!,
    waterAddGrams: f[I.waterAddGrams]!,
    solventAddedGrams: f[I.solventAddedGrams]!,
    solventMolPerNetworkAtom: f[I.solventMolPerNetworkAtom]!,
    thermalStatus,
    maxAllowedC: f[I.maxAllowedC]!,
    wetThicknessUm: f[I.wetThicknessUm]!,
    dryThicknessNm: f[I.dryThicknessNm]!,
    coverageM2PerL: f[I.coverageM2PerL]!,
    capillaryNumber: f[I.capillaryNumber]!,
    refractiveIndex: f[I.refractiveIndex]!,
    indexMismatch: f[I.indexMismatch]!,
    vocMassGrams: f[I.vocMassGrams]!,
    vocGramsPerLitre: f[I.vocGramsPerLitre]!,
    vocGramsPerLitreLessWater: f[I.vocGramsPerLitreLessWater]!,
    cureRatio: f[I.cureRatio]!,
    costTotal: f[I.costTotal]!,
    costPerKgDry: f[I.costPerKgDry]!,
    costPerLitreSol: f[I.costPerLitreSol]!,
    costPerM2: f[I.costPerM2]!,
  };
}
