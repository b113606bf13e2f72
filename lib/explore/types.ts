/**
 * The shapes an exploration run passes from the grid and the numeric path to
 * the plots, the table, the search and the export. Pure TypeScript.
 */
import type { Candidate, Grid, OutputKey, Variable } from "./spec";

/** One axis of a sweep: a variable and the values it takes, in order. */
export interface Axis {
  variable: Variable;
  /** Plain words, e.g. "Titanium isopropoxide, weight fraction". */
  label: string;
  /** Unit shown beside the values, e.g. "wt%", "°C", "mm/s", "mol/mol". Weight fractions are stored 0–1 and shown in %. */
  unit: string;
  /** True when values are fractions stored 0–1 and shown ×100 (weight fractions, solids content). */
  percent?: boolean;
  values: number[];
}

/** The three components of a ternary map and where each point lies. */
export interface TernaryPlan {
  materialIds: [string, string, string];
  /** Component names, in the same order. */
  labels: [string, string, string];
  /** Σ of their weight fractions in the revision; every point shares this total. */
  total: number;
  /** Per point p: shares (0–1, summing to 1) of the total at 3p, 3p+1, 3p+2. */
  shares: Float64Array;
}

/**
 * The points of a grid. Order of points: for a one-variable sweep, the
 * axis's order; for two variables, p = i0 · n1 + i1 (the second variable
 * varies fastest; a map draws variable 0 across, variable 1 up); for a
 * ternary map, the order of `ternary.shares`.
 */
export interface GridPlan {
  grid: Grid;
  count: number;
  /** Sweep: one or two axes. Ternary: empty. */
  axes: Axis[];
  ternary?: TernaryPlan;
  /** The revision's own values of the variables (ternary: its three shares), for the "this revision" mark; absent when it lies outside the ranges. */
  base?: number[];
}

/** A grid the explorer cannot plan, with the field of the grid at fault (e.g. "grid.variables.0.step"). */
export interface PlanError {
  field: string;
  message: string;
}

/** Thermal verdict of a point, or the engine's refusal: index into POINT_STATUSES. */
export const POINT_STATUSES = ["clear", "caution", "fail", "refused"] as const;
export type PointStatus = (typeof POINT_STATUSES)[number];

/** A computed exploration. */
export interface ExplorationRun {
  plan: GridPlan;
  outputs: OutputKey[];
  /** values[o][p]: figure `outputs[o]` at point p; NaN where the point was refused or the figure is absent. */
  values: Float64Array[];
  /** Per point, an index into POINT_STATUSES. */
  status: Uint8Array;
  /** Refused points: the engine's code and field, by point index. */
  refusals: { point: number; code: string; field: string }[];
  /** The best candidates, when a search ran (best first, at most SEARCH_CANDIDATES). */
  candidates?: Candidate[];
}

/** A figure an exploration can show, with its words and unit. */
export interface OutputInfo {
  key: OutputKey;
  label: string;
  /** e.g. "g/cm³", "nm", "g/L", "°C", "" for a plain number, "%" for fractions shown in percent. */
  unit: string;
  /** Shown ×100 with a % unit (fractions). */
  percent?: boolean;
}
