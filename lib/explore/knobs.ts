/**
 * A grid's points as knob values (lib/formulation/numeric/knobs.ts): what
 * pointInput sets at a point, written as plain numbers instead of an input
 * object, for the numeric model's prepared evaluator. The weight fractions
 * are the same numbers pointInput gives (same sums, same tidying). Pure
 * TypeScript.
 */
import type { FormulationInput } from "../formulation/input-schema";
import type { Knob } from "../formulation/numeric/knobs";
import { prepare, SUM_TOLERANCE, tidy as tidyWeight, type PointRefusal } from "./apply";
import type { GridPlan } from "./types";

// Read once (an imported binding is a getter where modules are compiled one by one).
const tidy = tidyWeight;
const SLACK = SUM_TOLERANCE;

/** The knobs of a plan and where each axis writes. */
export interface KnobPlan {
  knobs: Knob[];
  /** True when the first base.components.length knobs are every component's weight fraction. */
  weights: boolean;
  /** Per axis: its knob, or −1 for a weight-fraction axis (it sets the weight knobs). */
  axisKnob: number[];
  /** Per weight-fraction axis: its component; −1 for other axes. */
  componentOf: number[];
  othersTotal: number;
  ternaryOf: number[];
}

/**
 * The knobs a plan varies: every component's weight fraction when an axis (or the ternary map) varies
 * one, then one knob per other axis.
 *
 * @example
 * ```ts
 * knobPlan(base, plan).knobs; // e.g. [{ kind: "weightFraction", component: 0 }, …, { kind: "waterValue" }]
 * ```
 */
export function knobPlan(base: FormulationInput, plan: GridPlan): KnobPlan {
  const p = prepare(base, plan);
  const weights = plan.ternary !== undefined || plan.axes.some((a) => a.variable.kind === "weightFraction");
  const knobs: Knob[] = weights ? base.components.map((_, component) => ({ kind: "weightFraction" as const, component })) : [];
  const axisKnob = plan.axes.map((axis) => {
    const v = axis.variable;
    if (v.kind === "weightFraction") return -1;
    if (v.kind === "waterRatio") knobs.push({ kind: "waterValue" });
    else if (v.kind === "solidsContent") knobs.push({ kind: "solidsFraction" });
    else if (v.kind === "modifierRatio") knobs.push({ kind: "modifierRatio", index: v.index });
    else if (v.kind === "stepTemperature") knobs.push({ kind: "stepTemperature", index: v.index });
    else knobs.push({ kind: "withdrawalSpeed" });
    return knobs.length - 1;
  });
  return { knobs, weights, axisKnob, componentOf: p.componentOf, othersTotal: p.othersTotal, ternaryOf: p.ternaryOf };
}

/**
 * Writes the knob values of one point into `values` (pointInput's numbers, without the input object).
 *
 * @param point - 0 … plan.count − 1
 * @returns undefined, or pointInput's refusal for the point
 * @example
 * ```ts
 * const k = knobPlan(base, plan);
 * const values = new Float64Array(k.knobs.length);
 * if (!pointKnobs(base, plan, k, 7, values)) evaluator.evaluate(values);
 * ```
 */
export function pointKnobs(base: FormulationInput, plan: GridPlan, k: KnobPlan, point: number, values: Float64Array): PointRefusal | undefined {
  const components = base.components;
  const n = components.length;
  if (plan.ternary) {
    const t = plan.ternary;
    for (let i = 0; i < n; i++) values[i] = components[i]!.weightFraction;
    for (let j = 0; j < 3; j++) values[k.ternaryOf[j]!] = tidy(t.shares[3 * point + j]! * t.total);
    return undefined;
  }
  const axes = plan.axes;
  const two = axes.length === 2;
  const n1 = two ? axes[1]!.values.length : 1;
  const i0 = two ? Math.floor(point / n1) : point;
  let sum = 0;
  for (let a = 0; a < axes.length; a++) {
    const value = axes[a]!.values[a === 0 ? i0 : point % n1]!;
    const knob = k.axisKnob[a]!;
    if (knob >= 0) values[knob] = value;
    else sum += tidy(value);
  }
  if (!k.weights) return undefined;
  let remainder = 1 - sum;
  if (remainder < -SLACK) return { code: "fractions_over_one", field: "components" };
  if (remainder < 0) remainder = 0;
  if (remainder > SLACK && !(k.othersTotal > 0)) return { code: "nothing_takes_the_rest", field: "components" };
  const scale = k.othersTotal > 0 ? remainder / k.othersTotal : 0;
  for (let i = 0; i < n; i++) values[i] = tidy(components[i]!.weightFraction * scale);
  // a component on both axes takes the first axis's value, as pointInput does
  for (let a = axes.length - 1; a >= 0; a--) {
    if (k.axisKnob[a]! >= 0) continue;
    values[k.componentOf[a]!] = tidy(tidy(axes[a]!.values[a === 0 ? i0 : point % n1]!));
  }
  return undefined;
}
