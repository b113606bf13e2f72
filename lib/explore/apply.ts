/**
 * The revision's input at one point of a grid. Runs for every point of a run
 * (up to 20,000 times), so it copies only what the point changes and shares
 * everything else with the revision's input. Pure TypeScript.
 */
import type { Component, FormulationInput } from "../formulation/input-schema";
import { WEIGHT_FRACTION } from "../formulation/limits";
import type { GridPlan } from "./types";

/** Why a point has no valid input: a code and the input's field at fault. */
export interface PointRefusal {
  code: "fractions_over_one" | "nothing_takes_the_rest" | "no_such_point";
  field: string;
}

/** Slack on Σ weight fractions = 1 (a float sum of a few steps). */
export const SUM_TOLERANCE = 1e-9;

/** The schema's smallest non-zero weight fraction, read once (an imported binding is a getter where modules are compiled one by one). */
const MIN_WEIGHT = WEIGHT_FRACTION.min;

/**
 * A weight fraction the input schema accepts: values in (0, 1e-6) (the schema allows exactly 0 or
 * 1e-6 … 1) become 0, and a float just above 1 becomes 1.
 *
 * @example
 * ```ts
 * tidy(3e-7); // 0
 * ```
 */
export function tidy(w: number): number {
  if (w < MIN_WEIGHT) return 0;
  return w > 1 ? 1 : w;
}

/** What the points of one plan share. */
export interface Prepared {
  base: FormulationInput;
  /** Per axis: the index of its component in base.components, or −1 when the axis is not a weight fraction. */
  componentOf: number[];
  /** Σ weight fraction of the components no axis varies. */
  othersTotal: number;
  /** Ternary: the indices of its three components in base.components. */
  ternaryOf: number[];
}

const prepared = new WeakMap<GridPlan, Prepared>();

/**
 * What every point of `plan` over `base` shares (the varied components' indices, Σ of the others),
 * worked out once per plan.
 *
 * @example
 * ```ts
 * prepare(base, plan).othersTotal; // Σ weight fraction of the components no axis varies
 * ```
 */
export function prepare(base: FormulationInput, plan: GridPlan): Prepared {
  const cached = prepared.get(plan);
  if (cached && cached.base === base) return cached;
  const indexOf = (id: string): number => base.components.findIndex((c) => c.materialId === id);
  const componentOf = plan.axes.map((a) => (a.variable.kind === "weightFraction" ? indexOf(a.variable.materialId) : -1));
  const othersTotal = base.components.reduce((sum, c, i) => (componentOf.includes(i) ? sum : sum + c.weightFraction), 0);
  const ternaryOf = plan.ternary ? plan.ternary.materialIds.map(indexOf) : [];
  const made = { base, componentOf, othersTotal, ternaryOf };
  prepared.set(plan, made);
  return made;
}

function ternaryInput(base: FormulationInput, plan: GridPlan, p: Prepared, point: number): FormulationInput {
  const t = plan.ternary!;
  const components: Component[] = base.components.slice();
  for (let k = 0; k < 3; k++) {
    const i = p.ternaryOf[k]!;
    components[i] = { materialId: t.materialIds[k]!, weightFraction: tidy(t.shares[3 * point + k]! * t.total) };
  }
  return { ...base, components };
}

/** Sets the varied weight fractions; the others keep their proportions and share 1 − Σ varied. */
function applyFractions(base: FormulationInput, p: Prepared, varied: number[], values: number[]): Component[] | PointRefusal {
  let sum = 0;
  for (const v of values) sum += v;
  let remainder = 1 - sum;
  if (remainder < -SUM_TOLERANCE) return { code: "fractions_over_one", field: "components" };
  if (remainder < 0) remainder = 0;
  if (remainder > SUM_TOLERANCE && !(p.othersTotal > 0)) return { code: "nothing_takes_the_rest", field: "components" };
  const scale = p.othersTotal > 0 ? remainder / p.othersTotal : 0;
  return base.components.map((c, i) => {
    const at = varied.indexOf(i);
    return { materialId: c.materialId, weightFraction: tidy(at >= 0 ? values[at]! : c.weightFraction * scale) };
  });
}

/**
 * The revision's input with the values of one point of the plan. A varied weight fraction is set and
 * the other components keep their proportions, sharing 1 − Σ varied; ternary points set the three
 * components to share × total and leave the others as they are. Weight fractions below 1e-6 become 0
 * (the input schema allows exactly 0). The result passes formulationInputSchema when the plan came
 * from planGrid over the same `base`.
 *
 * @param base - the revision's input (not changed; unchanged parts are shared, not copied)
 * @param plan - a plan of planGrid over `base`
 * @param point - the point's index, 0 … plan.count − 1
 * @returns the point's input, or a refusal: "fractions_over_one" (the varied fractions exceed 1),
 *   "nothing_takes_the_rest" (they fall short of 1 and no other component can take the rest)
 * @example
 * ```ts
 * const input = pointInput(base, plan, 3);
 * if (!isPointRefusal(input)) model.evaluate(input);
 * ```
 */
export function pointInput(base: FormulationInput, plan: GridPlan, point: number): FormulationInput | PointRefusal {
  if (!Number.isInteger(point) || point < 0 || point >= plan.count) return { code: "no_such_point", field: "point" };
  const p = prepare(base, plan);
  if (plan.ternary) return ternaryInput(base, plan, p, point);
  const axes = plan.axes;
  const n1 = axes.length === 2 ? axes[1]!.values.length : 1;
  const index = axes.length === 2 ? [Math.floor(point / n1), point % n1] : [point];
  const out: FormulationInput = { ...base };
  const varied: number[] = [];
  const fractions: number[] = [];
  for (let a = 0; a < axes.length; a++) {
    const variable = axes[a]!.variable;
    const value = axes[a]!.values[index[a]!]!;
    switch (variable.kind) {
      case "weightFraction":
        varied.push(p.componentOf[a]!);
        fractions.push(tidy(value));
        break;
      case "waterRatio":
        out.water = { ...out.water, value };
        break;
      case "solidsContent":
        if (out.basis.type === "solidsContent") out.basis = { ...out.basis, solidsFraction: value };
        break;
      case "modifierRatio": {
        const modifiers = (out.modifiers ?? []).slice();
        modifiers[variable.index] = { ...modifiers[variable.index]!, molPerMetal: value };
        out.modifiers = modifiers;
        break;
      }
      case "stepTemperature": {
        const steps = out.steps.slice();
        steps[variable.index] = { ...steps[variable.index]!, temperatureC: value };
        out.steps = steps;
        break;
      }
      case "withdrawalSpeed":
        if (out.coating?.method === "dip") out.coating = { ...out.coating, withdrawalMmPerS: value };
        break;
    }
  }
  if (varied.length > 0) {
    const components = applyFractions(base, p, varied, fractions);
    if (!Array.isArray(components)) return components;
    out.components = components;
  }
  return out;
}

/**
 * True when pointInput refused the point.
 *
 * @example
 * ```ts
 * const input = pointInput(base, plan, 0);
 * if (isPointRefusal(input)) console.log(input.code, input.field);
 * ```
 */
export function isPointRefusal(value: FormulationInput | PointRefusal): value is PointRefusal {
  return "code" in value;
}
