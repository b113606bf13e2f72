/**
 * What the setup form offers for a revision: the kinds of variable its input
 * allows, the components, modifiers and steps to pick from, and the starting
 * values of each row.
 */
import type { Grid, Search, VariableKind } from "@/lib/explore/spec";
import type { OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import { fromSearch, fromVariable, KIND_UNITS, type SearchValues, type SetupValues, type VariableValues } from "./setup-values";

export interface Choice {
  value: string;
  label: string;
}

/** Plain words for each kind of variable. */
export const KIND_LABELS: Record<VariableKind, string> = {
  weightFraction: "Weight fraction of a component",
  waterRatio: "Water ratio",
  solidsContent: "Solids content of the sol",
  modifierRatio: "Modifier ratio",
  stepTemperature: "Temperature of a process step",
  withdrawalSpeed: "Withdrawal speed (dip coat)",
};

/** Name of a material of the input, or its id. */
export function materialName(base: FormulationInput, id: string): string {
  return base.materials.find((m) => m.id === id)?.name ?? id;
}

/** The kinds of variable this input can vary. */
export function kindChoices(base: FormulationInput): Choice[] {
  const kinds: VariableKind[] = ["weightFraction", "waterRatio"];
  if (base.basis.type === "solidsContent") kinds.push("solidsContent");
  if ((base.modifiers?.length ?? 0) > 0) kinds.push("modifierRatio");
  if (base.steps.length > 0) kinds.push("stepTemperature");
  if (base.coating?.method === "dip") kinds.push("withdrawalSpeed");
  return kinds.map((k) => ({ value: k, label: KIND_LABELS[k] }));
}

export function componentChoices(base: FormulationInput): Choice[] {
  return base.components.map((c) => ({ value: c.materialId, label: `${materialName(base, c.materialId)} (now ${(c.weightFraction * 100).toFixed(1)} wt%)` }));
}

export function modifierChoices(base: FormulationInput): Choice[] {
  return (base.modifiers ?? []).map((m, i) => ({ value: String(i), label: `${materialName(base, m.materialId)} on ${materialName(base, m.precursorId)} (now ${m.molPerMetal} mol/mol)` }));
}

export function stepChoices(base: FormulationInput): Choice[] {
  return base.steps.map((s, i) => ({ value: String(i), label: `${i + 1}. ${s.name} (now ${s.temperatureC} °C)` }));
}

const round = (v: number, digits = 3): number => Number(v.toFixed(digits));

/**
 * A row's starting range for a kind, around the revision's own value.
 *
 * @example
 * ```ts
 * defaultVariable(hardCoat, "weightFraction", "ti-isopropoxide"); // 0 → 50 wt% in steps of 5
 * ```
 */
export function defaultVariable(base: FormulationInput, kind: VariableKind, pick?: string): VariableValues {
  const row = (from: number, to: number, step: number, extra: Partial<VariableValues> = {}): VariableValues => ({ kind, materialId: "", index: "0", from, to, step, ...extra });
  switch (kind) {
    case "weightFraction":
      return row(0, 50, 5, { materialId: pick ?? base.components[0]?.materialId ?? "" });
    case "waterRatio": {
      const now = base.water.value;
      return row(round(Math.max(0, now / 2)), round(Math.max(now * 2, 1)), round(Math.max(now / 4, 0.05)));
    }
    case "solidsContent":
      return row(5, 40, 5);
    case "modifierRatio":
      return row(0, 2, 0.25, { index: pick ?? "0" });
    case "stepTemperature": {
      const index = Number(pick ?? base.steps.length - 1);
      const now = base.steps[index]?.temperatureC ?? 25;
      return row(now - 30, now + 30, 10, { index: String(index) });
    }
    case "withdrawalSpeed":
      return row(0.5, 5, 0.5);
  }
}

/** The figures shown first: the index, organic content and density when the catalogue has them. */
function defaultOutputs(catalogue: readonly OutputInfo[]): string[] {
  const wanted = ["refractiveIndex", "organicContent", "theoreticalDensity"].filter((k) => catalogue.some((o) => o.key === k));
  return wanted.length > 0 ? wanted : catalogue.slice(0, 1).map((o) => o.key);
}

/** No limits yet; the aim: closest to the substrate's index when the coat's index is a figure, else the lowest of the first figure. */
function defaultSearch(base: FormulationInput, catalogue: readonly OutputInfo[]): SearchValues {
  const substrateIndex = base.materials.find((m) => m.id === base.substrateId)?.refractiveIndex;
  const byIndex = substrateIndex !== undefined && catalogue.some((o) => o.key === "refractiveIndex");
  return {
    on: false,
    constraints: [],
    thermal: "clear",
    goal: byIndex ? "closest" : "min",
    output: byIndex ? "refractiveIndex" : (catalogue[0]?.key ?? ""),
    value: byIndex ? substrateIndex : Number.NaN,
  };
}

/** The form's first values: the saved exploration's setup, or a sweep of the first component. */
export function initialSetup(base: FormulationInput, catalogue: readonly OutputInfo[], saved?: { grid: Grid; outputs: string[]; search: Search | null } | null): SetupValues {
  const components = base.components.map((c) => c.materialId);
  const second = defaultVariable(base, "weightFraction", components[1] ?? components[0]);
  const values: SetupValues = {
    mode: "line",
    variables: [defaultVariable(base, "weightFraction"), second],
    materialIds: [components[0] ?? "", components[1] ?? "", components[2] ?? ""],
    ternaryStep: 5,
    outputs: defaultOutputs(catalogue),
    search: defaultSearch(base, catalogue),
  };
  if (!saved) return values;
  const known = saved.outputs.filter((k) => catalogue.some((o) => o.key === k));
  if (known.length > 0) values.outputs = known;
  if (saved.search) values.search = fromSearch(saved.search, catalogue);
  if (saved.grid.kind === "ternary") {
    values.mode = "ternary";
    values.materialIds = [...saved.grid.materialIds];
    values.ternaryStep = Number((saved.grid.step * 100).toPrecision(12));
  } else {
    values.mode = saved.grid.variables.length === 2 ? "map" : "line";
    saved.grid.variables.forEach((v, i) => {
      values.variables[i] = fromVariable(v);
    });
  }
  return values;
}

/** Unit shown beside a row's range fields. */
export function rowUnit(kind: VariableKind): string {
  return KIND_UNITS[kind];
}
