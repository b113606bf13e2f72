/**
 * One point of a grid applied to the revision's input: as knob values
 * (lib/formulation/numeric/knobs.ts; plain numbers, what the numeric model's
 * prepared evaluator takes for every point of a run) and, from those, as the
 * point's input (pointInput: for the decimal engine and for opening a
 * candidate), which copies only what the point changes. Pure TypeScript.
 */
import type { FormulationInput } from "../formulation/input-schema";
import { WEIGHT_FRACTION } from "../formulation/limits";
import { inputAt, type Knob } from "../formulation/numeric/knobs";
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
  /** The base's weight fractions, in component order (read per point without the input objects). */
  baseWeights: Float64Array;
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
  const baseWeights = Float64Array.from(base.components, (c) => c.weightFraction);
  return { knobs, weights, axisKnob, componentOf: p.componentOf, othersTotal: p.othersTotal, ternaryOf: p.ternaryOf, baseWeights };
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
  const weights = k.baseWeights;
  const n = weights.length;
  if (plan.ternary) {
    const t = plan.ternary;
    for (let i = 0; i < n; i++) values[i] = weights[i]!;
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
  if (remainder < -SUM_TOLERANCE) return { code: "fractions_over_one", field: "components" };
  if (remainder < 0) remainder = 0;
  if (remainder > SUM_TOLERANCE && !(k.othersTotal > 0)) return { code: "nothing_takes_the_rest", field: "components" };
  const scale = k.othersTotal > 0 ? remainder / k.othersTotal : 0;
  for (let i = 0; i < n; i++) values[i] = tidy(weights[i]! * scale);
  // a component on both axes takes the first axis's value, as pointInput does
  for (let a = axes.length - 1; a >= 0; a--) {
    if (k.axisKnob[a]! >= 0) continue;
    values[k.componentOf[a]!] = tidy(axes[a]!.values[a === 0 ? i0 : point % n1]!);
  }
  return undefined;
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
  const k = knobPlan(base, plan);
  const values = new Float64Array(k.knobs.length);
  const refusal = pointKnobs(base, plan, k, point, values);
  return refusal ?? inputAt(base, k.knobs, values);
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
