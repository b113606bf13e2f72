/**
 * Columns of the points table: the point's number, the variables (or the
 * three ternary shares), each figure and the thermal verdict in words; with
 * the value each sorts by. Plain TypeScript, no framework.
 */
import { POINT_STATUSES, type ExplorationRun, type OutputInfo } from "@/lib/explore/types";
import { stepDecimals } from "./ticks";
import { axisFactor, outputFactor, outputIndex, pointStatus, STATUS_WORDS, statusSummary, valueText, withUnit } from "./display";

/** One column: its header (with unit), the text of a point's cell and the number it sorts by (NaN last). */
export interface PointColumn {
  id: string;
  header: string;
  numeric: boolean;
  text: (p: number) => string;
  sortValue: (p: number) => number;
}

const plain = (v: number, digits = 4) => valueText(v, "", digits);

/**
 * The table's columns for a run and the figures shown.
 * @example pointColumns(run, outputs).map((c) => c.header) // ["Point", "Titania, weight fraction (wt%)", "Refractive index", "Thermal check"]
 */
export function pointColumns(run: ExplorationRun, outputs: OutputInfo[]): PointColumn[] {
  const { plan } = run;
  const cols: PointColumn[] = [{ id: "point", header: "Point", numeric: true, text: (p) => String(p + 1), sortValue: (p) => p }];
  if (plan.ternary) {
    const t = plan.ternary;
    t.labels.forEach((label, k) => {
      const wt = (p: number) => (t.shares[3 * p + k] ?? NaN) * t.total * 100;
      cols.push({ id: `share${k}`, header: `${label} (wt%)`, numeric: true, text: (p) => plain(wt(p)), sortValue: wt });
    });
  } else {
    const n1 = plan.axes[1]?.values.length ?? 1;
    plan.axes.forEach((axis, k) => {
      const f = axisFactor(axis);
      const index = (p: number) => (plan.axes.length === 2 ? (k === 0 ? Math.floor(p / n1) : p % n1) : p);
      const v = (p: number) => (axis.values[index(p)] ?? NaN) * f;
      // One number of decimals down the column, enough for every value of the axis.
      const decimals = Math.min(4, Math.max(0, ...axis.values.map((x) => stepDecimals(Math.abs(x * f)))));
      const text = (p: number) => (Number.isFinite(v(p)) ? v(p).toFixed(decimals).replace("-", "−") : "–");
      cols.push({ id: `axis${k}`, header: withUnit(axis.label, axis.unit), numeric: true, text, sortValue: v });
    });
  }
  outputs.forEach((info, j) => {
    const values = run.values[outputIndex(run, info)];
    const f = outputFactor(info);
    const v = (p: number) => (values ? (values[p] ?? NaN) * f : NaN);
    cols.push({ id: `out${j}`, header: withUnit(info.label, info.unit), numeric: true, text: (p) => plain(v(p)), sortValue: v });
  });
  const refusals = new Map(run.refusals.map((r) => [r.point, r]));
  cols.push({
    id: "thermal",
    header: "Thermal check",
    numeric: false,
    text: (p) => {
      const s = pointStatus(run, p);
      const r = s === "refused" ? refusals.get(p) : undefined;
      return r ? `${STATUS_WORDS[s]} (${r.code} at ${r.field})` : STATUS_WORDS[s];
    },
    sortValue: (p) => run.status[p] ?? POINT_STATUSES.length,
  });
  return cols;
}

/**
 * Point indexes in the order of the first sort (NaN last either way, ties
 * by point number); the grid's order when unsorted.
 * @example sortedPoints(3, cols, [{ id: "out0", desc: true }]) // Uint32Array [2, 0, 1]
 */
export function sortedPoints(count: number, cols: PointColumn[], sorting: { id: string; desc: boolean }[]): Uint32Array {
  const order = new Uint32Array(count);
  for (let p = 0; p < count; p++) order[p] = p;
  const first = sorting[0];
  const col = first ? cols.find((c) => c.id === first.id) : undefined;
  if (!col || !first) return order;
  const keys = new Float64Array(count);
  for (let p = 0; p < count; p++) keys[p] = col.sortValue(p);
  const sign = first.desc ? -1 : 1;
  return order.sort((a, b) => {
    const ka = keys[a]!;
    const kb = keys[b]!;
    const na = Number.isNaN(ka);
    const nb = Number.isNaN(kb);
    if (na || nb) return na && nb ? a - b : na ? 1 : -1;
    return ka === kb ? a - b : sign * (ka - kb);
  });
}

/** "Points of the exploration: 21 points, Titania … (wt%) against …; 3 caution." */
export function tableCaption(run: ExplorationRun, outputs: OutputInfo[]): string {
  const what = outputs.map((o) => withUnit(o.label, o.unit)).join(", ");
  return `Points of the exploration, one row each: ${run.plan.count.toLocaleString("en-GB")} points; ${what || "no figures"}; thermal check in words (${statusSummary(run)}).`;
}
