/**
 * The rows a line plot draws from a one-variable sweep, the grouping of its
 * figures by unit (one panel per unit) and where a line crosses a reference
 * level. Plain TypeScript, no framework.
 */
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import { axisFactor, outputFactor, outputIndex } from "./display";

/** One drawn point: shown x, point index, and y0…yk per figure (null where absent: a gap). */
export type LineRow = { x: number; p: number } & Record<`y${number}`, number | null>;

/**
 * Rows of a one-variable sweep in the axis's order, values in shown units.
 * @example lineRows(run, outputs)[0] // { x: 0, p: 0, y0: 1.497 }
 */
export function lineRows(run: ExplorationRun, outputs: OutputInfo[]): LineRow[] {
  const axis = run.plan.axes[0];
  if (!axis) return [];
  const fx = axisFactor(axis);
  const series = outputs.map((info) => ({ values: run.values[outputIndex(run, info)], f: outputFactor(info) }));
  return axis.values.map((v, p) => {
    const row = { x: v * fx, p } as LineRow;
    series.forEach((s, j) => {
      const y = s.values?.[p];
      row[`y${j}`] = y !== undefined && Number.isFinite(y) ? y * s.f : null;
    });
    return row;
  });
}

/** Figures sharing a unit, drawn in one panel; `index` is each figure's place in the outputs given. */
export interface UnitGroup {
  unit: string;
  members: { info: OutputInfo; index: number }[];
}

/**
 * Groups figures by unit in order of first appearance (figures of different
 * units never share a y axis).
 * @example unitGroups([{ unit: "" }, { unit: "g/L" }, { unit: "" }]).length // 2
 */
export function unitGroups(outputs: OutputInfo[]): UnitGroup[] {
  const groups: UnitGroup[] = [];
  outputs.forEach((info, index) => {
    const g = groups.find((x) => x.unit === info.unit);
    if (g) g.members.push({ info, index });
    else groups.push({ unit: info.unit, members: [{ info, index }] });
  });
  return groups;
}

/**
 * x where the line through (xs[i], ys[i]) crosses `level`, linear between
 * neighbouring points; gaps (null) break the line. A point exactly on the level counts once.
 * @example crossings([0, 10, 20], [1.5, 1.58, 1.6], 1.586) // [13]
 */
export function crossings(xs: readonly number[], ys: readonly (number | null | undefined)[], level: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < xs.length - 1; i++) {
    const a = ys[i];
    const b = ys[i + 1];
    if (a === null || a === undefined || b === null || b === undefined) continue;
    const da = a - level;
    const db = b - level;
    if (da === 0) {
      if (out.at(-1) !== xs[i]) out.push(xs[i]!);
      continue;
    }
    if (db === 0) {
      out.push(xs[i + 1]!);
      continue;
    }
    if (da < 0 !== db < 0) out.push(xs[i]! + ((xs[i + 1]! - xs[i]!) * da) / (da - db));
  }
  return out;
}
