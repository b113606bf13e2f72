/**
 * An exploration as rows for export (one row per point) and a first block
 * stating what was explored. lib/spreadsheet/exploration-sheet.ts writes them
 * as .csv or .xlsx. Pure TypeScript.
 */
import { ENGINE_VERSION } from "../formulation/constants";
import type { FormulationInput } from "../formulation/input-schema";
import { shownValue } from "./labels";
import { outputInfo } from "./outputs";
import type { Constraint, Objective, Search } from "./spec";
import { POINT_STATUSES, type Axis, type ExplorationRun, type PointStatus } from "./types";

/** One exported cell: text, a number, or empty. */
export type ExportCell = string | number | null;

/** What an export states about an exploration beside its run. */
export interface ExplorationExport {
  /** The formulation's name. */
  formulationName: string;
  /** The revision explored, as shown to people, e.g. "Revision 3". */
  revisionLabel: string;
  /** The exploration's name, when saved. */
  explorationName?: string;
  /** The revision's input (names and units of the materials). */
  base: FormulationInput;
  /** The computed run (see runExplorationSync / planAndRun). */
  run: ExplorationRun;
  /** The target search, when there was one. */
  search?: Search;
  /** Defaults to the engine's ENGINE_VERSION. */
  engineVersion?: string;
}

/** The rows of an export: `about` (Item, Value pairs), then the points' `header` and `rows`. */
export interface ExplorationRows {
  about: ExportCell[][];
  header: ExportCell[];
  rows: ExportCell[][];
}

/** Said in every export, beside the engine version. */
export const NUMERIC_PATH_NOTE = "figures from the numeric path; recipes come from the full engine";

/** A point's thermal verdict in words. */
export const STATUS_WORDS: Record<PointStatus, string> = {
  clear: "clear",
  caution: "caution",
  fail: "fail",
  refused: "refused by the engine",
};

/** Plain words for the codes a refused point carries (the engine's FormulationError codes and the explorer's own). */
const REFUSAL_WORDS: Record<string, string> = {
  fractions_over_one: "the varied weight fractions add up to more than 1",
  nothing_takes_the_rest: "the varied weight fractions add up to less than 1 and no other component takes the rest",
  fractions_do_not_sum: "the weight fractions do not sum to 1",
  solids_content_too_high: "the solids content is higher than the materials allow",
  mould_too_small: "the mould is too small for the composite",
  too_much_modifier: "more modifier than the precursor has groups to replace",
  bulk_density_above_theoretical: "the bulk density is above the theoretical density",
  nothing_to_fill: "there is nothing for the solvent to fill",
  no_residue: "a precursor leaves no residue",
  no_network_atoms: "no network-forming atoms",
  no_hydrolysable_groups: "no hydrolysable groups",
  missing_density: "a density is missing",
  missing_molar_mass: "a molar mass is missing",
  invalid_input: "the input is not valid",
};

/**
 * The engine's reason for a refused point, in words, with its code and field.
 *
 * @example
 * ```ts
 * refusalWords("too_much_modifier", "modifiers.0.molPerMetal");
 * // "more modifier than the precursor has groups to replace (too_much_modifier, at modifiers.0.molPerMetal)"
 * ```
 */
export function refusalWords(code: string, field: string): string {
  const words = REFUSAL_WORDS[code];
  return words ? `${words} (${code}, at ${field})` : `${code} (at ${field})`;
}

const withUnit = (label: string, unit: string): string => (unit ? `${label} (${unit})` : label);
const trim = (n: number): number => Number(n.toPrecision(12));

function outputLabel(key: string, base: FormulationInput): { label: string; unit: string; percent: boolean } {
  const info = outputInfo(key, base);
  return info ? { label: info.label, unit: info.unit, percent: info.percent === true } : { label: key, unit: "", percent: false };
}

function axisWords(axis: Axis): string {
  const v = axis.variable;
  const p = axis.percent === true;
  const unit = axis.unit ? ` ${axis.unit}` : "";
  return `${axis.label}: ${shownValue(v.from, p)} to ${shownValue(v.to, p)}${unit} in steps of ${shownValue(v.step, p)}${unit} (${axis.values.length} values)`;
}

function limitWords(c: Constraint, base: FormulationInput): string {
  const { label, unit, percent } = outputLabel(c.output, base);
  const u = unit ? ` ${unit}` : "";
  const parts: string[] = [];
  if (c.min !== undefined) parts.push(`≥ ${shownValue(c.min, percent)}${u}`);
  if (c.max !== undefined) parts.push(`≤ ${shownValue(c.max, percent)}${u}`);
  return `${label} ${parts.join(" and ")}`;
}

function aimWords(o: Objective, base: FormulationInput): string {
  const { label, unit, percent } = outputLabel(o.output, base);
  if (o.goal === "min") return `lowest ${label}`;
  if (o.goal === "max") return `highest ${label}`;
  return `${label} closest to ${shownValue(o.value, percent)}${unit ? ` ${unit}` : ""}`;
}

const THERMAL_WORDS: Record<Search["thermal"], string> = {
  clear: "clear only",
  caution: "clear or caution",
  any: "any verdict (refused points excluded)",
};

function aboutRows(e: ExplorationExport): ExportCell[][] {
  const { run, base } = e;
  const plan = run.plan;
  const rows: ExportCell[][] = [];
  if (e.explorationName) rows.push(["Exploration", e.explorationName]);
  rows.push(["Formulation", e.formulationName], ["Revision", e.revisionLabel]);
  if (plan.ternary) {
    const t = plan.ternary;
    const step = plan.grid.kind === "ternary" ? plan.grid.step : Number.NaN;
    rows.push([
      "What varied",
      `ternary map of ${t.labels.join(", ")}: they share ${shownValue(t.total, true)} wt% of the dry composite in steps of ${shownValue(step, true)} % of that share; the other components stay as they are`,
    ]);
  } else {
    for (const axis of plan.axes) rows.push(["What varied", axisWords(axis)]);
    if (plan.axes.some((a) => a.variable.kind === "weightFraction")) rows.push(["", "the other components keep their proportions and share the rest"]);
  }
  const refused = run.status.reduce((n, s) => (POINT_STATUSES[s] === "refused" ? n + 1 : n), 0);
  rows.push(["Points", plan.count], ["Points refused by the engine", refused]);
  if (e.search) {
    for (const c of e.search.constraints) rows.push(["Limit", limitWords(c, base)]);
    rows.push(["Thermal check allowed", THERMAL_WORDS[e.search.thermal]], ["Aim", aimWords(e.search.objective, base)]);
    rows.push(["Candidates found", run.candidates?.length ?? 0]);
  }
  rows.push(["Engine version", e.engineVersion ?? ENGINE_VERSION], ["Note", NUMERIC_PATH_NOTE]);
  return rows;
}

/**
 * The export's rows: a first block (Item, Value) stating the formulation, revision, what varied, the
 * limits and aim, the engine version and the numeric-path note; then one row per point in point order:
 * the variable values (weight fractions and solids content in %, ternary: the three weight fractions),
 * every output of the run (fractions in %), the thermal verdict in words, and the engine's reason for a
 * refused point. Units sit in the headers; empty cells where a figure is absent.
 *
 * @example
 * ```ts
 * const { about, header, rows } = explorationRows({ formulationName: "Visor hard coat HC-3", revisionLabel: "Revision 2", base, run });
 * header[0]; // "Titanium(IV) isopropoxide, weight fraction of the dry composite (wt%)"
 * ```
 */
export function explorationRows(e: ExplorationExport): ExplorationRows {
  const { run, base } = e;
  const plan = run.plan;
  const header: ExportCell[] = [];
  if (plan.ternary) for (const name of plan.ternary.labels) header.push(`${name}, weight fraction of the dry composite (wt%)`);
  else for (const axis of plan.axes) header.push(withUnit(axis.label, axis.unit));
  const outputs = run.outputs.map((key) => outputLabel(key, base));
  for (const o of outputs) header.push(withUnit(o.label, o.unit));
  header.push("Thermal check", "Reason refused");

  const refusals = new Map(run.refusals.map((r) => [r.point, r]));
  const n1 = plan.axes.length === 2 ? plan.axes[1]!.values.length : 1;
  const rows: ExportCell[][] = new Array(plan.count);
  for (let p = 0; p < plan.count; p++) {
    const row: ExportCell[] = [];
    if (plan.ternary) {
      const { shares, total } = plan.ternary;
      for (let k = 0; k < 3; k++) row.push(trim(shares[3 * p + k]! * total * 100));
    } else if (plan.axes.length === 2) {
      row.push(shownValue(plan.axes[0]!.values[Math.floor(p / n1)]!, plan.axes[0]!.percent === true));
      row.push(shownValue(plan.axes[1]!.values[p % n1]!, plan.axes[1]!.percent === true));
    } else {
      row.push(shownValue(plan.axes[0]!.values[p]!, plan.axes[0]!.percent === true));
    }
    outputs.forEach((o, i) => {
      const v = run.values[i]![p]!;
      row.push(Number.isFinite(v) ? (o.percent ? v * 100 : v) : null);
    });
    const status = POINT_STATUSES[run.status[p]!] ?? "refused";
    row.push(STATUS_WORDS[status]);
    const refusal = refusals.get(p);
    row.push(refusal ? refusalWords(refusal.code, refusal.field) : null);
    rows[p] = row;
  }
  return { about: aboutRows(e), header, rows };
}
