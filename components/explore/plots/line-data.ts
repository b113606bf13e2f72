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

/**
 * Fewer rows to draw for a long sweep, the same picture: the rows are cut
 * into buckets and each keeps its first and last row and the lowest and
 * highest row of every series; both rows at each edge of a gap are kept, so
 * gaps stay gaps. Rows pass unchanged when there are at most `maxRows`.
 * @example thinRows(rows, 2, 1200).length // ≤ about 1200 for 10,000 rows without gaps
 */
export function thinRows(rows: LineRow[], series: number, maxRows: number): LineRow[] {
  if (rows.length <= maxRows) return rows;
  const keep = new Uint8Array(rows.length);
  const buckets = Math.max(1, Math.floor(maxRows / (2 + 2 * series)));
  const size = Math.ceil(rows.length / buckets);
  for (let start = 0; start < rows.length; start += size) {
    const end = Math.min(rows.length, start + size);
    keep[start] = 1;
    keep[end - 1] = 1;
    for (let j = 0; j < series; j++) {
      let lo = -1;
      let hi = -1;
      for (let i = start; i < end; i++) {
        const y = rows[i]![`y${j}`];
        if (y === null || y === undefined) continue;
        if (lo < 0 || y < rows[lo]![`y${j}`]!) lo = i;
        if (hi < 0 || y > rows[hi]![`y${j}`]!) hi = i;
      }
      if (lo >= 0) keep[lo] = 1;
      if (hi >= 0) keep[hi] = 1;
    }
  }
  for (let j = 0; j < series; j++) {
    for (let i = 1; i < rows.length; i++) {
      const gapBefore = rows[i - 1]![`y${j}`] === null;
      const gapHere = rows[i]![`y${j}`] === null;
      if (gapBefore !== gapHere) keep[i - 1] = keep[i] = 1;
    }
  }
  return rows.filter((_, i) => keep[i] === 1);
}
