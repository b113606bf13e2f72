/**
 * The explorer's setup form: its values as entered (weight fractions and
 * solids contents in %), their conversion to the contract's Grid and Search
 * (lib/explore/spec.ts), and every message placed at the form field at fault.
 */
import { z } from "zod";
import { isPlanError, planGrid } from "@/lib/explore/grid";
import { gridSchema, searchSchema, type Grid, type Search, type Variable, type VariableKind } from "@/lib/explore/spec";
import type { GridPlan, OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";

export type Mode = "line" | "map" | "ternary";
export type Goal = "min" | "max" | "closest";
export type ThermalAllowance = "clear" | "caution" | "any";

/** One varied thing as entered; NaN for an empty number field. */
export interface VariableValues {
  kind: VariableKind;
  /** weightFraction: the component's material id. */
  materialId: string;
  /** modifierRatio / stepTemperature: index of the modifier or step, as a string for the select. */
  index: string;
  from: number;
  to: number;
  step: number;
}

/** One limit of the target search; NaN = no limit on that side. Entered in the figure's shown unit. */
export interface LimitValues {
  output: string;
  min: number;
  max: number;
}

export interface SearchValues {
  on: boolean;
  constraints: LimitValues[];
  thermal: ThermalAllowance;
  goal: Goal;
  output: string;
  /** The value to come closest to, in the figure's shown unit. */
  value: number;
}

export interface SetupValues {
  mode: Mode;
  /** Always two rows; a line uses the first only. */
  variables: VariableValues[];
  /** Ternary: the three components. */
  materialIds: string[];
  /** Ternary step, % of the three components' shared total. */
  ternaryStep: number;
  outputs: string[];
  search: SearchValues;
}

/** A message at a form field path, e.g. "variables.0.step" ("count": the grid as a whole, shown with the point count). */
export interface SetupIssue {
  path: string;
  message: string;
}

/** Unit a variable kind is entered in. */
export const KIND_UNITS: Record<VariableKind, string> = {
  weightFraction: "wt%",
  waterRatio: "mol/mol",
  solidsContent: "wt%",
  modifierRatio: "mol/mol",
  stepTemperature: "°C",
  withdrawalSpeed: "mm/s",
};

/** Entered value ÷ stored value: fractions are entered in %. */
export function kindScale(kind: VariableKind): number {
  return kind === "weightFraction" || kind === "solidsContent" ? 100 : 1;
}

const num = (v: number): number => (typeof v === "number" ? v : Number.NaN);

/**
 * The contract's variable for a row of the form (not yet validated).
 *
 * @example
 * ```ts
 * toVariable({ kind: "weightFraction", materialId: "teos", index: "0", from: 0, to: 20, step: 5 }); // from 0, to 0.2, step 0.05
 * ```
 */
export function toVariable(v: VariableValues): Variable {
  const s = kindScale(v.kind);
  const range = { from: num(v.from) / s, to: num(v.to) / s, step: num(v.step) / s };
  switch (v.kind) {
    case "weightFraction":
      return { kind: v.kind, materialId: v.materialId, ...range };
    case "modifierRatio":
    case "stepTemperature":
      return { kind: v.kind, index: Number(v.index), ...range };
    default:
      return { kind: v.kind, ...range };
  }
}

/** The contract's grid for the form's values (not yet validated). */
export function toGrid(values: SetupValues): Grid {
  if (values.mode === "ternary") {
    return { kind: "ternary", materialIds: [values.materialIds[0] ?? "", values.materialIds[1] ?? "", values.materialIds[2] ?? ""], step: num(values.ternaryStep) / 100 };
  }
  const rows = values.mode === "line" ? values.variables.slice(0, 1) : values.variables.slice(0, 2);
  return { kind: "sweep", variables: rows.map(toVariable) };
}

/** Rounds away binary noise of a unit change (0.07 × 100 = 7.000000000000001). */
const clean = (v: number): number => Number(v.toPrecision(12));

/** The form row of a stored variable (a saved exploration). */
export function fromVariable(v: Variable): VariableValues {
  const s = kindScale(v.kind);
  return {
    kind: v.kind,
    materialId: v.kind === "weightFraction" ? v.materialId : "",
    index: v.kind === "modifierRatio" || v.kind === "stepTemperature" ? String(v.index) : "0",
    from: clean(v.from * s),
    to: clean(v.to * s),
    step: clean(v.step * s),
  };
}

/** How one figure is shown: × 100 for fractions shown in %. */
export const outputScale = (info: OutputInfo | undefined): number => (info?.percent ? 100 : 1);

/** The contract's search for the form's values (not yet validated); figures entered in their shown unit. */
export function toSearch(values: SearchValues, catalogue: readonly OutputInfo[]): Search {
  const scaleOf = (key: string) => outputScale(catalogue.find((o) => o.key === key));
  const opt = (v: number, key: string) => (Number.isFinite(num(v)) ? v / scaleOf(key) : undefined);
  const objective: Search["objective"] =
    values.goal === "closest" ? { goal: "closest", output: values.output, value: num(values.value) / scaleOf(values.output) } : { goal: values.goal, output: values.output };
  return {
    constraints: values.constraints.map((c) => ({ output: c.output, min: opt(c.min, c.output), max: opt(c.max, c.output) })),
    thermal: values.thermal,
    objective,
  };
}

/** The form's search values for a stored search. */
export function fromSearch(search: Search, catalogue: readonly OutputInfo[]): SearchValues {
  const scaleOf = (key: string) => outputScale(catalogue.find((o) => o.key === key));
  return {
    on: true,
    constraints: search.constraints.map((c) => ({
      output: c.output,
      min: c.min === undefined ? Number.NaN : clean(c.min * scaleOf(c.output)),
      max: c.max === undefined ? Number.NaN : clean(c.max * scaleOf(c.output)),
    })),
    thermal: search.thermal,
    goal: search.objective.goal,
    output: search.objective.output,
    value: search.objective.goal === "closest" ? clean(search.objective.value * scaleOf(search.objective.output)) : Number.NaN,
  };
}

/** The form field of a path in the grid (zod issue path or a PlanError field without its "grid." prefix). */
export function gridFieldOf(path: readonly PropertyKey[], ternary: boolean): string {
  const parts = path.map(String);
  if (ternary) {
    if (parts[0] === "step") return "ternaryStep";
    if (parts[0] === "materialIds") return `materialIds.${parts[1] ?? "0"}`;
    return "mode";
  }
  if (parts[0] === "variables" && parts[1] !== undefined) return `variables.${parts[1]}.${parts[2] ?? "kind"}`;
  // The grid as a whole (too many points of two variables together): beside the point count.
  if (parts[0] === "variables") return "count";
  return "mode";
}

/** The form field of a path in the search. */
export function searchFieldOf(path: readonly PropertyKey[]): string {
  const parts = path.map(String);
  if (parts[0] === "constraints" && parts[1] !== undefined) {
    const leaf = parts[2] === "output" || parts[2] === "max" ? parts[2] : "min";
    return `search.constraints.${parts[1]}.${leaf}`;
  }
  if (parts[0] === "objective") return parts[1] === "value" ? "search.value" : "search.output";
  if (parts[0] === "thermal") return "search.thermal";
  return "search.goal";
}

/** What a setup comes to: its grid and plan when they are valid, every message otherwise. */
export interface SetupCheck {
  grid?: Grid;
  plan?: GridPlan;
  search?: Search;
  issues: SetupIssue[];
}

/**
 * Checks the form against the contract's schemas and plans the grid (the point
 * count before anything runs); every refusal is placed at its field.
 *
 * @example
 * ```ts
 * const { plan, issues } = checkSetup(values, revision.input, catalogue);
 * plan?.count; // points the run would compute
 * ```
 */
export function checkSetup(values: SetupValues, base: FormulationInput, catalogue: readonly OutputInfo[]): SetupCheck {
  const issues: SetupIssue[] = [];
  const ternary = values.mode === "ternary";
  let grid: Grid | undefined;
  let plan: GridPlan | undefined;
  const parsed = gridSchema.safeParse(toGrid(values));
  if (!parsed.success) {
    for (const issue of parsed.error.issues) issues.push({ path: gridFieldOf(issue.path, ternary), message: issue.message });
  } else {
    grid = parsed.data;
    const planned = planGrid(grid, base);
    if (isPlanError(planned)) {
      issues.push({ path: gridFieldOf(planned.field.replace(/^grid\.?/, "").split(".").filter(Boolean), ternary), message: planned.message });
    } else {
      plan = planned;
    }
  }
  if (values.outputs.length === 0) issues.push({ path: "outputs", message: "choose at least one figure to show" });
  let search: Search | undefined;
  if (values.search.on) {
    const parsedSearch = searchSchema.safeParse(toSearch(values.search, catalogue));
    if (!parsedSearch.success) {
      for (const issue of parsedSearch.error.issues) issues.push({ path: searchFieldOf(issue.path), message: issue.message });
    } else {
      search = parsedSearch.data;
    }
  }
  return { grid, plan, search, issues };
}

/**
 * The form's zod schema for react-hook-form: the values pass through, every
 * message of checkSetup lands at its field.
 */
export function setupSchema(base: FormulationInput, catalogue: readonly OutputInfo[]): z.ZodType<SetupValues, SetupValues> {
  return z.custom<SetupValues>((v) => typeof v === "object" && v !== null).superRefine((values, ctx) => {
    for (const issue of checkSetup(values, base, catalogue).issues) ctx.addIssue({ code: "custom", message: issue.message, path: issue.path.split(".") });
  });
}
