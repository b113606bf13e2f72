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
import { KERNEL_GENERAL, kernelPoint } from "./kernel";
import { kernelState, type KernelState } from "./kernel-state";
import { C_ORGANIC, C_PHASE_DENSITY, STRIDE, zeros } from "./kernel-layout";
import { kernelPlan, type KernelPlan } from "./kernel-plan";
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
  return new Evaluator(table, base, knobs, general);
}

const DENSITY = SCALAR_FIGURES.indexOf("theoreticalDensity");
const ORGANIC = C_ORGANIC;
const PHASE_DENSITY = C_PHASE_DENSITY;
const WIDTH = STRIDE;

/** A class, so that making one (once per evaluate(input)) makes no closures. */
class Evaluator implements NumericEvaluator {
  readonly figures = zeros(SCALAR_FIGURES.length);
  readonly refusal = { code: "", field: "" };
  private readonly plan: KernelPlan | undefined;
  private readonly state: KernelState | undefined;
  /** The general branch's figures of the last point, undefined when the kernel computed it. */
  private last: NumericFigures | undefined = undefined;
  private status = REFUSED;

  constructor(
    table: MaterialTable,
    private readonly base: FormulationInput,
    private readonly knobs: readonly Knob[],
    private readonly general: (input: FormulationInput) => NumericOutcome,
  ) {
    this.plan = kernelPlan(table, base, knobs);
    this.state = this.plan && kernelState(this.plan);
  }

  evaluate(values: ArrayLike<number>): number {
    this.last = undefined;
    const figures = this.figures;
    if (this.plan) {
      this.status = point(this.plan, this.state!, values, figures);
      if (this.status !== GENERAL) return this.status;
    }
    const outcome = this.general(inputAt(this.base, this.knobs, values));
    if (!outcome.ok) {
      this.refusal.code = outcome.code;
      this.refusal.field = outcome.field;
      figures.fill(Number.NaN);
      this.status = REFUSED;
      return REFUSED;
    }
    const last = outcome.figures;
    this.last = last;
    for (let k = 0; k < SCALAR_FIGURES.length; k++) figures[k] = last[SCALAR_FIGURES[k]!];
    this.status = STATUS_RANK[last.thermalStatus]!;
    return this.status;
  }

  /** w_i / ρ_i · ρ_th of component i's phase at the last kernel point. */
  private volumeFraction(i: number): number {
    return (this.state!.w[i]! / this.plan!.coef[i * WIDTH + PHASE_DENSITY]!) * this.figures[DENSITY]!;
  }

  phaseFraction(id: string, field: "weightFraction" | "volumeFraction"): number {
    if (this.status === REFUSED) return Number.NaN;
    let sum = 0;
    if (this.last) {
      for (const phase of this.last.phases) if (phase.materialId === id) sum += phase[field];
      return sum;
    }
    const components = this.base.components;
    for (let i = 0; i < components.length; i++) {
      if (components[i]!.materialId !== id) continue;
      sum += field === "weightFraction" ? this.state!.w[i]! : this.volumeFraction(i);
    }
    return sum;
  }

  toFigures(): NumericFigures {
    if (this.last) return this.last;
    const phases: NumericPhase[] = [];
    const components = this.base.components;
    for (let i = 0; i < components.length; i++) {
      phases.push({
        materialId: components[i]!.materialId,
        organic: this.plan!.coef[i * WIDTH + ORGANIC] === 1,
        weightFraction: this.state!.w[i]!,
        volumeFraction: this.volumeFraction(i),
      });
    }
    return figuresObject(this.figures, phases, STATUS[this.status]!);
  }
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
