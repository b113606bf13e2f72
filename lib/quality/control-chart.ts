/**
 * Individuals and moving range (I-MR) control charts, run rules and process
 * capability (Cpk) for the results of a batch property across batches.
 *
 * Source of the formulas: NIST/SEMATECH e-Handbook of Statistical Methods,
 * section 6.3.2 (Shewhart individuals control charts: centre line x̄, moving
 * range of two consecutive points, limits x̄ ± 3·MR̄/d2, MR chart UCL = D4·MR̄)
 * and section 6.3.2 run rules (Western Electric rules); the constants d2 = 1.128
 * and D4 = 3.267 for subgroups of n = 2 are those of ISO 7870-2 (Shewhart
 * control charts), table 2. Cpk: NIST/SEMATECH section 6.1.6.
 *
 * Limits are computed from the data, never from the specification: the
 * specification limits are drawn separately by the chart page.
 *
 * Pure code: plain numbers (double precision is ample for statistics of a
 * few hundred results); round only for display.
 */

/** d2 for moving ranges of two points (ISO 7870-2, table 2). */
export const D2 = 1.128;
/** D4 for moving ranges of two points (ISO 7870-2, table 2): MR chart upper limit = D4 · MR̄. */
export const D4 = 3.267;
/** Fewest results for which Cpk is shown. */
export const CPK_MIN_RESULTS = 25;

/** Run rules flagged per point. */
export const RUN_RULES = ["beyond-3-sigma", "two-of-three-beyond-2-sigma", "eight-on-one-side"] as const;
export type RunRule = (typeof RUN_RULES)[number];

/** Words for each run rule, for the chart legend and table. */
export const RUN_RULE_WORDS: Record<RunRule, string> = {
  "beyond-3-sigma": "a point beyond the 3σ control limits",
  "two-of-three-beyond-2-sigma": "2 of 3 consecutive points beyond 2σ on the same side",
  "eight-on-one-side": "8 points in a row on one side of the centre line",
};

export interface ChartPoint {
  /** Position in time order (0-based). */
  index: number;
  value: number;
  /** |x(i) − x(i−1)|; null for the first point. */
  movingRange: number | null;
  /** Run rules this point breaks (empty when none). */
  rules: RunRule[];
}

export interface IMRChart {
  points: ChartPoint[];
  /** Centre line of the individuals chart: mean of the values (same unit as the values). */
  mean: number;
  /** Mean of the moving ranges of two (same unit). */
  meanMovingRange: number;
  /** Process standard deviation estimated as MR̄ / d2 (same unit). */
  sigma: number;
  /** Individuals chart limits x̄ ± 3σ = x̄ ± 2.66 MR̄. */
  upperControlLimit: number;
  lowerControlLimit: number;
  /** Moving range chart: centre line MR̄, upper limit D4 · MR̄ (lower limit 0). */
  movingRangeUpperLimit: number;
}

/**
 * Builds the I-MR chart of values in time order. Needs at least 2 values
 * (one moving range); returns null otherwise or when a value is not finite.
 */
export function individualsChart(values: readonly number[]): IMRChart | null {
  if (values.length < 2 || values.some((v) => !Number.isFinite(v))) return null;
  const n = values.length;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const ranges = values.slice(1).map((v, i) => Math.abs(v - values[i]!));
  const meanMovingRange = ranges.reduce((s, r) => s + r, 0) / ranges.length;
  const sigma = meanMovingRange / D2;
  const points: ChartPoint[] = values.map((value, index) => ({
    index,
    value,
    movingRange: index === 0 ? null : ranges[index - 1]!,
    rules: [],
  }));
  for (const point of points) point.rules = rulesAt(values, point.index, mean, sigma);
  return {
    points,
    mean,
    meanMovingRange,
    sigma,
    upperControlLimit: mean + 3 * sigma,
    lowerControlLimit: mean - 3 * sigma,
    movingRangeUpperLimit: D4 * meanMovingRange,
  };
}

/** Side of the centre line: +1 above, −1 below, 0 on it. */
function side(v: number, mean: number): number {
  return v > mean ? 1 : v < mean ? -1 : 0;
}

/**
 * The run rules point i breaks. A run is flagged on the point that completes
 * it (and on every later point that keeps it going): the 2-of-3 rule on the
 * third point of the window when it is itself beyond 2σ, the 8-in-a-row rule
 * from the 8th point on. With σ = 0 (all values equal) nothing is flagged.
 */
function rulesAt(values: readonly number[], i: number, mean: number, sigma: number): RunRule[] {
  const rules: RunRule[] = [];
  if (sigma <= 0) return rules;
  const v = values[i]!;
  if (Math.abs(v - mean) > 3 * sigma) rules.push("beyond-3-sigma");
  if (i >= 2) {
    const s = side(v, mean);
    const beyond2 = (x: number) => side(x, mean) === s && Math.abs(x - mean) > 2 * sigma;
    if (s !== 0 && beyond2(v) && values.slice(i - 2, i + 1).filter(beyond2).length >= 2) {
      rules.push("two-of-three-beyond-2-sigma");
    }
  }
  if (i >= 7) {
    const s = side(v, mean);
    if (s !== 0 && values.slice(i - 7, i + 1).every((x) => side(x, mean) === s)) rules.push("eight-on-one-side");
  }
  return rules;
}

export interface Capability {
  /** min(USL − x̄, x̄ − LSL) / 3σ; with one limit only, that side's index. */
  cpk: number;
  /** Number of results used. */
  count: number;
  /** Always shown beside the figure. */
  caution: string;
}

export const CPK_CAUTION =
  "Cpk is meaningful only for a stable process (no run rule broken) whose results are roughly normally distributed; σ is estimated from the moving range.";

/**
 * Process capability index Cpk of the chart against the specification limits
 * (NIST/SEMATECH 6.1.6). Null with fewer than 25 results, without any limit, or
 * when σ is 0.
 */
export function capability(chart: IMRChart, lower: number | null, upper: number | null): Capability | null {
  const count = chart.points.length;
  if (count < CPK_MIN_RESULTS || chart.sigma <= 0 || (lower === null && upper === null)) return null;
  const sides: number[] = [];
  if (upper !== null) sides.push(upper - chart.mean);
  if (lower !== null) sides.push(chart.mean - lower);
  return { cpk: Math.min(...sides) / (3 * chart.sigma), count, caution: CPK_CAUTION };
}
