/**
 * Planning an exploration's grid: the points are counted before anything runs,
 * and a grid the explorer cannot compute is refused with a message naming the
 * field at fault. Pure TypeScript.
 */
import type { FormulationInput } from "../formulation/input-schema";
import { MOLAR_RATIO, TEMPERATURE_C, WITHDRAWAL_MM_PER_S } from "../formulation/limits";
import { materialName, variableLabel } from "./labels";
import { EXPLORE_MAX_POINTS, gridSchema, type Grid, type Variable } from "./spec";
import type { Axis, GridPlan, PlanError, TernaryPlan } from "./types";

/** Relative tolerance (of one step) within which the last value of a range counts as reaching `to`. */
const STEP_TOLERANCE = 1e-9;

/** Values each kind of variable may take: the engine's input limits (lib/formulation/limits.ts). */
const LIMITS: Record<Variable["kind"], { min: number; max: number; openMin?: boolean; openMax?: boolean; words: string }> = {
  weightFraction: { min: 0, max: 1, words: "a weight fraction must lie between 0 and 1 (0–100 wt%)" },
  solidsContent: { min: 0, max: 1, openMin: true, openMax: true, words: "the solids content must lie above 0 and below 1 (0–100 wt%, both excluded)" },
  waterRatio: { ...MOLAR_RATIO, words: `the water ratio must lie between ${MOLAR_RATIO.min} and ${MOLAR_RATIO.max} mol/mol` },
  modifierRatio: { ...MOLAR_RATIO, words: `the modifier ratio must lie between ${MOLAR_RATIO.min} and ${MOLAR_RATIO.max} mol/mol` },
  stepTemperature: { ...TEMPERATURE_C, words: `a step temperature must lie between ${TEMPERATURE_C.min} and ${TEMPERATURE_C.max} °C` },
  withdrawalSpeed: { ...WITHDRAWAL_MM_PER_S, words: `the withdrawal speed must lie between ${WITHDRAWAL_MM_PER_S.min} and ${WITHDRAWAL_MM_PER_S.max} mm/s` },
};

const fmt = (n: number): string => n.toLocaleString("en", { maximumFractionDigits: 0 });

function tooMany(count: number, field: string): PlanError {
  return {
    field,
    message: `this grid would compute ${count > 1e12 ? `more than ${fmt(1e12)}` : fmt(count)} points; at most ${fmt(EXPLORE_MAX_POINTS)} — widen the step or narrow the range`,
  };
}

/**
 * Number of values from `from` to `to` in steps of `step`, `to` included when it lies within 1e-9 of a step.
 *
 * @example
 * ```ts
 * rangeCount(0, 0.2, 0.01); // 21
 * ```
 */
export function rangeCount(from: number, to: number, step: number): number {
  return Math.floor(Math.abs(to - from) / step + STEP_TOLERANCE) + 1;
}

/**
 * The values of a range: from, from ± step, … up to and including `to` (within 1e-9 of a step; never past it).
 *
 * @example
 * ```ts
 * rangeValues(100, 80, 10); // [100, 90, 80]
 * ```
 */
export function rangeValues(from: number, to: number, step: number): number[] {
  const n = rangeCount(from, to, step);
  const dir = to >= from ? 1 : -1;
  const values = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    // The first value is `from` itself (−0 + 0 would turn a −0 into +0).
    const v = i === 0 ? from : from + dir * i * step;
    values[i] = Math.abs(v - to) <= STEP_TOLERANCE * step || dir * (v - to) > 0 ? to : v;
  }
  return values;
}

/** The revision's own value of a variable (undefined when it has none). */
function baseValue(base: FormulationInput, v: Variable): number | undefined {
  switch (v.kind) {
    case "weightFraction":
      return base.components.find((c) => c.materialId === v.materialId)?.weightFraction;
    case "solidsContent":
      return base.basis.type === "solidsContent" ? base.basis.solidsFraction : undefined;
    case "waterRatio":
      return base.water.value;
    case "modifierRatio":
      return base.modifiers?.[v.index]?.molPerMetal;
    case "stepTemperature":
      return base.steps[v.index]?.temperatureC;
    case "withdrawalSpeed":
      return base.coating?.method === "dip" ? base.coating.withdrawalMmPerS : undefined;
  }
}

/** Why a variable does not fit the revision (field and message), or null. */
function variableProblem(base: FormulationInput, v: Variable, at: string): PlanError | null {
  switch (v.kind) {
    case "weightFraction":
      if (!base.components.some((c) => c.materialId === v.materialId)) {
        return { field: `${at}.materialId`, message: `${materialName(base, v.materialId)} is not a component of this revision; choose one of its components` };
      }
      return null;
    case "solidsContent":
      return base.basis.type === "solidsContent"
        ? null
        : { field: `${at}.kind`, message: "the solids content varies only with a solids-content basis (a sol mass and its solids content); this revision uses another basis" };
    case "modifierRatio": {
      const count = base.modifiers?.length ?? 0;
      return v.index < count ? null : { field: `${at}.index`, message: `this revision has ${count === 0 ? "no modifier" : `${count} modifier${count === 1 ? "" : "s"}`}; modifier ${v.index + 1} does not exist` };
    }
    case "stepTemperature":
      return v.index < base.steps.length
        ? null
        : { field: `${at}.index`, message: `this revision has ${base.steps.length} process step${base.steps.length === 1 ? "" : "s"}; step ${v.index + 1} does not exist` };
    case "withdrawalSpeed":
      return base.coating?.method === "dip" ? null : { field: `${at}.kind`, message: "the withdrawal speed varies only for a dip coat; this revision is not dip coated" };
    case "waterRatio":
      return null;
  }
}

/** Why a range cannot be swept (field and message), or null. */
function rangeProblem(v: Variable, at: string): PlanError | null {
  const limit = LIMITS[v.kind];
  for (const end of ["from", "to"] as const) {
    const x = v[end];
    const below = limit.openMin ? x <= limit.min : x < limit.min;
    const above = limit.openMax ? x >= limit.max : x > limit.max;
    if (below || above) return { field: `${at}.${end}`, message: `${limit.words}; the range ${end === "from" ? "starts" : "ends"} at ${x}` };
  }
  if (v.from === v.to) return { field: `${at}.to`, message: `the range is empty: it starts and ends at ${v.from}; give an end different from the start` };
  const span = Math.abs(v.to - v.from);
  if (v.step > span * (1 + STEP_TOLERANCE)) {
    return { field: `${at}.step`, message: `the step (${v.step}) is larger than the range (${v.from} to ${v.to}); choose a step of at most ${span}` };
  }
  return null;
}

/** Two variables that vary the same thing. */
function sameVariable(a: Variable, b: Variable): boolean {
  if (a.kind !== b.kind) return false;
  if (a.kind === "weightFraction" && b.kind === "weightFraction") return a.materialId === b.materialId;
  if ((a.kind === "modifierRatio" && b.kind === "modifierRatio") || (a.kind === "stepTemperature" && b.kind === "stepTemperature")) return a.index === b.index;
  return true;
}

function planSweep(grid: Extract<Grid, { kind: "sweep" }>, base: FormulationInput): GridPlan | PlanError {
  const vars = grid.variables;
  for (let i = 0; i < vars.length; i++) {
    const at = `grid.variables.${i}`;
    const problem = variableProblem(base, vars[i]!, at) ?? rangeProblem(vars[i]!, at);
    if (problem) return problem;
  }
  if (vars.length === 2 && sameVariable(vars[0]!, vars[1]!)) {
    return { field: "grid.variables.1", message: "the second variable is the same as the first; choose something else to vary, or vary one thing" };
  }
  const counts = vars.map((v) => rangeCount(v.from, v.to, v.step));
  const count = counts.reduce((a, b) => a * b, 1);
  if (count > EXPLORE_MAX_POINTS) return tooMany(count, vars.length === 1 ? "grid.variables.0.step" : "grid.variables");
  const axes: Axis[] = vars.map((variable) => {
    const { label, unit, percent } = variableLabel(base, variable);
    return { variable, label, unit, percent, values: rangeValues(variable.from, variable.to, variable.step) };
  });
  const baseValues = vars.map((v) => baseValue(base, v));
  const inside = vars.every((v, i) => {
    const x = baseValues[i];
    const tol = STEP_TOLERANCE * v.step;
    return x !== undefined && x >= Math.min(v.from, v.to) - tol && x <= Math.max(v.from, v.to) + tol;
  });
  return { grid, count, axes, ...(inside ? { base: baseValues as number[] } : {}) };
}

function planTernary(grid: Extract<Grid, { kind: "ternary" }>, base: FormulationInput): GridPlan | PlanError {
  const ids = grid.materialIds;
  const fractions: number[] = [];
  for (let i = 0; i < 3; i++) {
    const id = ids[i]!;
    if (ids.indexOf(id) !== i) return { field: `grid.materialIds.${i}`, message: `${materialName(base, id)} is chosen twice; choose three different components` };
    const component = base.components.find((c) => c.materialId === id);
    if (!component) return { field: `grid.materialIds.${i}`, message: `${materialName(base, id)} is not a component of this revision; choose one of its components` };
    fractions.push(component.weightFraction);
  }
  const total = fractions[0]! + fractions[1]! + fractions[2]!;
  if (!(total > 0)) {
    return { field: "grid.materialIds", message: "the three components have no weight in this revision (their fractions sum to 0), so there is nothing for them to share; give them a weight fraction first" };
  }
  const divisions = Math.round(1 / grid.step);
  if (Math.abs(divisions * grid.step - 1) > STEP_TOLERANCE) {
    return { field: "grid.step", message: `the step must divide the total into whole steps (1 / ${grid.step} is not a whole number); e.g. 0.05, 0.1, 0.125, 0.2 or 0.25` };
  }
  const count = ((divisions + 1) * (divisions + 2)) / 2;
  if (count > EXPLORE_MAX_POINTS) return tooMany(count, "grid.step");
  const shares = ternaryShares(divisions);
  const ternary: TernaryPlan = {
    materialIds: [ids[0], ids[1], ids[2]],
    labels: [materialName(base, ids[0]), materialName(base, ids[1]), materialName(base, ids[2])],
    total,
    shares,
  };
  return { grid, count, axes: [], ternary, base: fractions.map((f) => f / total) };
}

/**
 * The shares of a ternary grid with `divisions` steps a side, in point order: the first component's
 * share rises slowest (0, 1/n, … 1), the second's next (0 … 1 − first), the third takes the rest;
 * (n + 1)(n + 2)/2 points, three shares each (a/n, b/n, (n − a − b)/n), summing to 1.
 *
 * @example
 * ```ts
 * ternaryShares(1); // [0,0,1, 0,1,0, 1,0,0]
 * ```
 */
export function ternaryShares(divisions: number): Float64Array {
  const n = divisions;
  const shares = new Float64Array(((n + 1) * (n + 2) * 3) / 2);
  let k = 0;
  for (let a = 0; a <= n; a++) {
    for (let b = 0; b <= n - a; b++) {
      shares[k++] = a / n;
      shares[k++] = b / n;
      shares[k++] = (n - a - b) / n;
    }
  }
  return shares;
}

/**
 * Plans a grid over a revision: checks it, counts its points (refusing more than
 * EXPLORE_MAX_POINTS before anything is computed) and lists the values of each axis
 * with plain labels and units, or the ternary shares. Point order: see GridPlan.
 *
 * @param grid - what varies (validated again here against gridSchema)
 * @param base - the revision's input; its own values give the "this revision" mark
 * @returns the plan, or a PlanError naming the field at fault (e.g. "grid.variables.0.to")
 * @example
 * ```ts
 * const plan = planGrid({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.01 }] }, input);
 * if (!("message" in plan)) plan.count; // 21
 * ```
 */
export function planGrid(grid: Grid, base: FormulationInput): GridPlan | PlanError {
  const parsed = gridSchema.safeParse(grid);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return { field: ["grid", ...issue.path.map(String)].join("."), message: issue.message };
  }
  return parsed.data.kind === "sweep" ? planSweep(parsed.data, base) : planTernary(parsed.data, base);
}

/**
 * True when planGrid refused the grid.
 *
 * @example
 * ```ts
 * const plan = planGrid(grid, input);
 * if (isPlanError(plan)) showError(plan.field, plan.message);
 * ```
 */
export function isPlanError(plan: GridPlan | PlanError): plan is PlanError {
  return "message" in plan && !("count" in plan);
}
