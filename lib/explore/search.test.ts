import { describe, expect, it } from "vitest";
import { isPlanError, planGrid } from "./grid";
import { bestCandidates, pointValues } from "./search";
import { candidateSchema, type Search } from "./spec";
import { visorCoat } from "./test-fixtures";
import type { ExplorationRun, GridPlan } from "./types";

const base = visorCoat(0.05);
const CLEAR = 0;
const CAUTION = 1;
const FAIL = 2;
const REFUSED = 3;

/** A hand-made run over a water-ratio sweep 1 … n (values chosen by the test, not computed). */
function fakeRun(columns: Record<string, number[]>, status: number[]): ExplorationRun {
  const n = status.length;
  const plan = planGrid({ kind: "sweep", variables: [{ kind: "waterRatio", from: 1, to: n, step: 1 }] }, base) as GridPlan;
  const outputs = Object.keys(columns);
  return { plan, outputs, values: outputs.map((k) => Float64Array.from(columns[k]!)), status: Uint8Array.from(status), refusals: [] };
}
const search = (s: Partial<Search>): Search => ({ constraints: [], thermal: "any", objective: { goal: "min", output: "a" }, ...s });

describe("bestCandidates", () => {
  const run = fakeRun(
    { a: [5, 3, 8, 1, 3, Number.NaN, 2, 9], b: [0.1, 0.5, 0.6, 0.2, 0.9, 0.9, 0.7, 0.8] },
    [CLEAR, CLEAR, CAUTION, FAIL, CLEAR, CLEAR, REFUSED, CAUTION],
  );

  it("ranks by the lowest, the highest or the closest value", () => {
    expect(bestCandidates(run, search({ objective: { goal: "min", output: "a" } })).map((c) => c.point)).toEqual([3, 1, 4, 0, 2, 7]);
    expect(bestCandidates(run, search({ objective: { goal: "max", output: "a" } })).map((c) => c.point)).toEqual([7, 2, 0, 1, 4, 3]);
    // closest to 4: |3 − 4| = |5 − 4| = 1 → points 0, 1, 4 tie and keep their order
    const closest = bestCandidates(run, search({ objective: { goal: "closest", output: "a", value: 4 } }));
    expect(closest.map((c) => c.point)).toEqual([0, 1, 4, 3, 2, 7]);
    expect(closest[0]!.score).toBe(5);
  });

  it("keeps only allowed thermal verdicts and never a refused point", () => {
    expect(bestCandidates(run, search({ thermal: "clear" })).map((c) => c.point)).toEqual([1, 4, 0]);
    expect(bestCandidates(run, search({ thermal: "caution" })).map((c) => c.point)).toEqual([1, 4, 0, 2, 7]);
    expect(bestCandidates(run, search({ thermal: "any" })).map((c) => c.point)).not.toContain(6);
  });

  it("keeps points within every limit, and a NaN figure fails its limit", () => {
    const within = bestCandidates(run, search({ constraints: [{ output: "b", min: 0.5, max: 0.8 }] }));
    expect(within.map((c) => c.point)).toEqual([1, 2, 7]);
    // point 5 has b = 0.9 but a NaN objective: never listed
    expect(bestCandidates(run, search({ constraints: [{ output: "b", min: 0.85 }] })).map((c) => c.point)).toEqual([4]);
    const nanLimit = fakeRun({ a: [1, 2], b: [Number.NaN, 0.5] }, [CLEAR, CLEAR]);
    expect(bestCandidates(nanLimit, search({ constraints: [{ output: "b", max: 1 }] })).map((c) => c.point)).toEqual([1]);
    // a figure the run did not compute: nothing qualifies
    expect(bestCandidates(run, search({ constraints: [{ output: "refractiveIndex", min: 1 }] }))).toEqual([]);
  });

  it("lists at most 10, the earliest point first among equals, each valid against candidateSchema", () => {
    const flat = fakeRun({ a: Array.from({ length: 30 }, (_, i) => (i % 3 === 0 ? 1 : 2)) }, Array.from({ length: 30 }, () => CLEAR));
    const best = bestCandidates(flat, search({}));
    expect(best.map((c) => c.point)).toEqual([0, 3, 6, 9, 12, 15, 18, 21, 24, 27]);
    for (const c of best) expect(candidateSchema.safeParse(c).success).toBe(true);
    expect(best[1]).toEqual({ point: 3, values: [4], score: 1, figures: { a: 1 }, thermalStatus: "clear" });
  });

  it("counts figures equal but for float noise as a tie (9 significant digits), keeping the point order", () => {
    const noisy = fakeRun({ a: [1.0000000000004, 1, 0.9999999999996, 1.00001] }, [CLEAR, CLEAR, CLEAR, CLEAR]);
    expect(bestCandidates(noisy, search({})).map((c) => c.point)).toEqual([0, 1, 2, 3]);
    expect(bestCandidates(noisy, search({ objective: { goal: "max", output: "a" } })).map((c) => c.point)).toEqual([3, 0, 1, 2]);
    // the score is the figure itself, unrounded
    expect(bestCandidates(noisy, search({}))[0]!.score).toBe(1.0000000000004);
  });

  it("gives each candidate its variable values and only its finite figures", () => {
    const [first] = bestCandidates(run, search({ constraints: [{ output: "b", max: 0.15 }] }));
    expect(first).toEqual({ point: 0, values: [1], score: 5, figures: { a: 5, b: 0.1 }, thermalStatus: "clear" });
  });
});

describe("pointValues", () => {
  it("gives both values of a map point and the weight fractions of a ternary point", () => {
    const map = planGrid({ kind: "sweep", variables: [{ kind: "waterRatio", from: 1, to: 3, step: 1 }, { kind: "stepTemperature", index: 3, from: 100, to: 120, step: 10 }] }, base);
    if (isPlanError(map)) throw new Error(map.message);
    expect(pointValues(map, 5)).toEqual([2, 120]);
    const ternary = planGrid({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.5 }, base);
    if (isPlanError(ternary)) throw new Error(ternary.message);
    expect(pointValues(ternary, 1).map((v) => Number(v.toFixed(12)))).toEqual([0, 0.5, 0.5]);
  });
});
