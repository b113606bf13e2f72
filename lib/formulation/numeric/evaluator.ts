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
import { kernelPlan } from "./kernel-plan";
import { inputAt, type Knob } from "./knobs";
import type { MaterialTable } from "./material-table";

const STATUS: readonly ThermalStatus[] = ["clear", "caution", "fail"];
const STATUS_RANK: Record<string, number> = { clear: 0, caution: 1, fail: 2 };
const REFUSED = -1;

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
  const figures = new Float64Array(SCALAR_FIGURES.length);
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
      return { materialId, organic: plan!.organic[i] === 1, weightFraction: w, volumeFraction: (w / plan!.phaseDensity[i]!) * figures[density]! };
    });
  }

  return {
    figures,
    refusal,
    evaluate(values: Float64Array): number {
      last = undefined;
      if (plan) {
        status = kernelPoint(plan, state!, values, figures);
        if (status !== KERNEL_GENERAL) return status;
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
        sum += field === "weightFraction" ? w : (w / plan!.phaseDensity[i]!) * figures[density]!;
      }
      return sum;
    },
    toFigures(): NumericFigures {
      if (last) return last;
      const out = {} as Record<string, number>;
      for (let k = 0; k < SCALAR_FIGURES.length; k++) out[SCALAR_FIGURES[k]!] = figures[k]!;
      return { ...(out as Omit<NumericFigures, "phases" | "thermalStatus">), phases: phases(), thermalStatus: STATUS[status]! };
    },
  };
}
