/**
 * The target search over a computed run: the points that meet every limit and
 * the thermal allowance, best first by the objective. Pure TypeScript.
 */
import { SEARCH_CANDIDATES, type Candidate, type OutputKey, type Search } from "./spec";
import { POINT_STATUSES, type ExplorationRun, type GridPlan } from "./types";

/**
 * Significant digits at which objective figures are compared: figures equal but for float64 noise
 * (the numeric path agrees with the decimal engine within 1e-9 relative) tie and keep the point order,
 * so both paths list the same candidates.
 */
export const RANK_DIGITS = 9;

/** Highest status index each thermal allowance admits (clear 0, caution 1, fail 2; refused 3 never). */
const ALLOWED: Record<Search["thermal"], number> = { clear: 0, caution: 1, any: 2 };

/**
 * The values of the grid's variables at a point, in the grid's order, as stored (weight fractions 0–1);
 * for a ternary map, the three components' weight fractions (share × total).
 *
 * @example
 * ```ts
 * pointValues(plan, 0); // e.g. [0] for a titania sweep from 0
 * ```
 */
export function pointValues(plan: GridPlan, point: number): number[] {
  if (plan.ternary) {
    const { shares, total } = plan.ternary;
    return [shares[3 * point]! * total, shares[3 * point + 1]! * total, shares[3 * point + 2]! * total];
  }
  if (plan.axes.length === 2) {
    const n1 = plan.axes[1]!.values.length;
    return [plan.axes[0]!.values[Math.floor(point / n1)]!, plan.axes[1]!.values[point % n1]!];
  }
  return [plan.axes[0]!.values[point]!];
}

/** Every output key a search reads (constraints, then the objective), each once. */
export function searchOutputs(search: Search): OutputKey[] {
  return [...new Set([...search.constraints.map((c) => c.output), search.objective.output])];
}

/**
 * The best points of a run for a search: a point qualifies when its thermal status is allowed
 * ("clear" only; "caution": clear or caution; "any": all but refused points) and every constraint's
 * figure lies within its min/max (NaN fails). Ranked by the objective: lowest, highest, or smallest
 * |value − target| for "closest", figures compared at RANK_DIGITS significant digits; ties keep the points' order. At most SEARCH_CANDIDATES. A candidate's
 * `score` is the objective's figure at its point (for "closest", the figure itself, not the distance).
 * Figures read outputs the run did not compute as NaN (so nothing qualifies): runExploration appends
 * the search's outputs for that reason.
 *
 * @param run - a computed run
 * @param search - limits, thermal allowance and objective
 * @returns the candidates, best first, with their variable values and every finite figure of `run.outputs`
 * @example
 * ```ts
 * bestCandidates(run, { constraints: [{ output: "organicContent", min: 0.6 }], thermal: "clear", objective: { goal: "closest", output: "refractiveIndex", value: 1.586 } });
 * ```
 */
export function bestCandidates(run: ExplorationRun, search: Search): Candidate[] {
  const column = (key: OutputKey): Float64Array | undefined => {
    const at = run.outputs.indexOf(key);
    return at >= 0 ? run.values[at] : undefined;
  };
  const limits = search.constraints.map((c) => ({ values: column(c.output), min: c.min ?? -Infinity, max: c.max ?? Infinity }));
  const objective = column(search.objective.output);
  if (!objective || limits.some((l) => !l.values)) return [];
  const goal = search.objective;
  const rank = (figure: number): number => {
    const v = Number(figure.toPrecision(RANK_DIGITS));
    return goal.goal === "min" ? v : goal.goal === "max" ? -v : Math.abs(v - goal.value);
  };
  const allowed = ALLOWED[search.thermal];

  // A short list kept sorted by rank; a later point with an equal rank goes after the earlier one.
  const best: { point: number; rank: number }[] = [];
  const count = run.plan.count;
  for (let p = 0; p < count; p++) {
    if (run.status[p]! > allowed) continue;
    const score = objective[p]!;
    if (!Number.isFinite(score)) continue;
    let ok = true;
    for (const l of limits) {
      const v = l.values![p]!;
      if (!(v >= l.min && v <= l.max)) {
        ok = false;
        break;
      }
    }
    if (!ok) continue;
    const r = rank(score);
    if (best.length === SEARCH_CANDIDATES && r >= best[best.length - 1]!.rank) continue;
    let at = best.length;
    while (at > 0 && best[at - 1]!.rank > r) at--;
    best.splice(at, 0, { point: p, rank: r });
    if (best.length > SEARCH_CANDIDATES) best.pop();
  }

  return best.map(({ point }) => {
    const figures: Record<string, number> = {};
    run.outputs.forEach((key, o) => {
      const v = run.values[o]![point]!;
      if (Number.isFinite(v)) figures[key] = v;
    });
    const status = POINT_STATUSES[run.status[point]!] as Candidate["thermalStatus"];
    return { point, values: pointValues(run.plan, point), score: objective[point]!, figures, thermalStatus: status };
  });
}
