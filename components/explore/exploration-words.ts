/**
 * Plain words for a saved exploration: what varied, the limits and the aim
 * of its search. Pure functions, shared by the saved-explorations list and
 * its tests. Weight fractions and the solids content are stored 0–1 and
 * shown in %.
 */
import type { OutputInfo } from "@/lib/explore/types";
import type { Constraint, Grid, Objective, Search, Variable } from "@/lib/explore/spec";

/** Looks up a figure's words and unit (the output catalogue). */
export type OutputWords = (key: string) => OutputInfo;

/** Names of what the grid varies (material id, "step:<i>", "modifier:<i>" → name), as the list query gives them. */
export type GridNames = Record<string, string>;

/** A number for people: at most 4 significant digits, no trailing zeros. */
export function shortNumber(value: number): string {
  if (!Number.isFinite(value)) return "–";
  return String(Number(value.toPrecision(4)));
}

/** A value of a figure with its unit, ×100 for fractions shown in %. */
export function figureWords(value: number, info: Pick<OutputInfo, "unit" | "percent">): string {
  const shown = info.percent ? value * 100 : value;
  return info.unit ? `${shortNumber(shown)} ${info.unit}` : shortNumber(shown);
}

function variableLabel(v: Variable, names: GridNames): { label: string; unit: string; percent: boolean } {
  switch (v.kind) {
    case "weightFraction":
      return { label: `${names[v.materialId] ?? v.materialId}, weight fraction`, unit: "%", percent: true };
    case "waterRatio":
      return { label: "Water ratio", unit: "", percent: false };
    case "solidsContent":
      return { label: "Solids content", unit: "%", percent: true };
    case "modifierRatio":
      return { label: `${names[`modifier:${v.index}`] ?? `Modifier ${v.index + 1}`}, mol per mol metal`, unit: "mol/mol", percent: false };
    case "stepTemperature":
      return { label: `${names[`step:${v.index}`] ?? `Step ${v.index + 1}`}, temperature`, unit: "°C", percent: false };
    case "withdrawalSpeed":
      return { label: "Withdrawal speed", unit: "mm/s", percent: false };
  }
}

/**
 * One varied thing with its range and step.
 *
 * @example
 * ```ts
 * variableWords({ kind: "stepTemperature", index: 3, from: 80, to: 140, step: 10 }, { "step:3": "Thermal cure" });
 * // "Thermal cure, temperature: 80 → 140 °C in steps of 10 °C"
 * ```
 */
export function variableWords(v: Variable, names: GridNames): string {
  const { label, unit, percent } = variableLabel(v, names);
  const n = (x: number) => figureWords(x, { unit: "", percent });
  const u = unit ? ` ${unit}` : "";
  return `${label}: ${n(v.from)} → ${n(v.to)}${u} in steps of ${n(v.step)}${u}`;
}

/** A grid as it arrives through JSON (the ternary tuple becomes a plain array). */
export type GridLike = Exclude<Grid, { kind: "ternary" }> | { kind: "ternary"; materialIds: readonly string[]; step: number };

/** What an exploration varied, one line per axis (a ternary map is one line). */
export function gridWords(grid: GridLike, names: GridNames): string[] {
  if (grid.kind === "ternary") {
    const [a, b, c] = grid.materialIds.map((id) => names[id] ?? id);
    return [`Ternary map of ${a}, ${b} and ${c} (their shares of the total they have, in steps of ${shortNumber(grid.step * 100)} %)`];
  }
  return grid.variables.map((v) => variableWords(v, names));
}

/**
 * A limit of a search in words.
 *
 * @example constraintWords({ output: "organicWeightFraction", min: 0.6 }, words) // "Organic weight fraction ≥ 60 %"
 */
export function constraintWords(c: Constraint, words: OutputWords): string {
  const info = words(c.output);
  if (c.min !== undefined && c.max !== undefined) return `${info.label} from ${figureWords(c.min, info)} to ${figureWords(c.max, info)}`;
  if (c.min !== undefined) return `${info.label} ≥ ${figureWords(c.min, info)}`;
  return `${info.label} ≤ ${figureWords(c.max!, info)}`;
}

/** A label inside a sentence: its first letter lowered unless it starts an abbreviation ("VOC", "n_D" stay). */
function inSentence(label: string): string {
  return /^[A-Z][a-z]/.test(label) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}

/** The aim of a search in words: "lowest …", "highest …", "… closest to 1.586". */
export function objectiveWords(o: Objective, words: OutputWords): string {
  const info = words(o.output);
  if (o.goal === "min") return `lowest ${inSentence(info.label)}`;
  if (o.goal === "max") return `highest ${inSentence(info.label)}`;
  return `${inSentence(info.label)} closest to ${figureWords(o.value, info)}`;
}

/** The thermal condition of a search in words. */
export function thermalWords(search: Search): string {
  return search.thermal === "clear" ? "thermal check clear" : search.thermal === "caution" ? "thermal check clear or caution" : "any thermal verdict";
}

/**
 * A candidate's values of the grid's variables with units, in the grid's order
 * (a ternary map: the three weight fractions).
 *
 * @example candidateValuesWords({ kind: "sweep", variables: [tiFraction, cureStep] }, [0.1, 110]) // "10 %, 110 °C"
 */
export function candidateValuesWords(grid: GridLike, values: readonly number[]): string {
  const units = grid.kind === "ternary" ? values.map(() => ({ unit: "%", percent: true })) : grid.variables.map((v) => variableLabel(v, {}));
  return values.map((x, i) => figureWords(x, units[i] ?? { unit: "", percent: false })).join(", ");
}
