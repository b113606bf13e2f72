import { describe, expect, it } from "vitest";
import { crossings, lineRows, thinRows, unitGroups } from "@/components/explore/plots/line-data";
import { pointColumns, sortedPoints, tableCaption } from "@/components/explore/plots/points-columns";
import { lineSummary, mapSummary, pointReadout, shownRange, ternarySummary } from "@/components/explore/plots/summaries";
import { axisFactor, statusCounts } from "@/components/explore/plots/display";
import { paddedTicks } from "@/components/explore/plots/ticks";
import { INDEX, lineRun, mapRun, ORGANIC, temperatureAxis, ternaryRun, titaniaAxis, VOC } from "../helpers/explore-run";

describe("line plot data", () => {
  it("returns rows in shown units: weight fractions and percent figures ×100, gaps as null", () => {
    const rows = lineRows(lineRun(), [INDEX, ORGANIC]);
    expect(rows.map((r) => r.x)).toEqual([0, 5, 10, 15, 20]);
    expect(rows[1]!.y0).toBeCloseTo(1.52, 12);
    expect(rows[1]!.y1).toBeCloseTo(55, 12);
    expect(rows[4]!.y0).toBeNull();
    expect(rows[4]!.y1).toBeNull();
  });

  it("groups figures of one unit into one panel, in order", () => {
    const groups = unitGroups([INDEX, VOC, { ...INDEX, key: "other" }]);
    expect(groups.map((g) => [g.unit, g.members.map((m) => m.index)])).toEqual([
      ["", [0, 2]],
      ["g/L", [1]],
    ]);
  });

  it("returns where a line crosses a level, broken at gaps", () => {
    // index 1.5 + 0.4·w crosses 1.54 at w = 0.1 → 10 wt% (a point exactly on it counts once)
    const rows = lineRows(lineRun(), [INDEX]);
    expect(crossings(rows.map((r) => r.x), rows.map((r) => r.y0), 1.53)).toHaveLength(1);
    expect(crossings(rows.map((r) => r.x), rows.map((r) => r.y0), 1.53)[0]).toBeCloseTo(7.5, 9);
    expect(crossings([0, 10, 20], [1.5, 1.58, 1.6], 1.586)[0]).toBeCloseTo(13, 9);
    expect(crossings([0, 1, 2], [1, null, 3], 2)).toEqual([]);
    expect(crossings([0, 1, 2], [1, 2, 3], 2)).toEqual([1]);
  });

  it("returns y ticks that enclose the figures", () => {
    const t = paddedTicks(1.4712, 1.5934, 5);
    expect(t.domain[0]).toBeLessThanOrEqual(1.4712);
    expect(t.domain[1]).toBeGreaterThanOrEqual(1.5934);
    expect(t.domain).toEqual([1.45, 1.6]);
    expect(paddedTicks(2, 2).domain[0]).toBeLessThan(2);
  });
});

describe("plot summaries", () => {
  it("says what a line plot draws, the range, the verdict and the revision", () => {
    const s = lineSummary(lineRun(), [INDEX, ORGANIC], { value: 1.586, label: "polycarbonate" });
    expect(s).toContain("against Titania precursor, weight fraction from 0\u00a0wt% to 20\u00a0wt% (5 values)");
    expect(s).toContain("refractive index from 1.500 to 1.560");
    expect(s).toContain("organic content from 45.00\u00a0wt% to 60.00\u00a0wt%");
    expect(s).toContain("1 caution, 1 fails the thermal check, 1 refused by the engine");
    expect(s).toContain("this revision at Titania precursor, weight fraction 5\u00a0wt%");
    expect(s).toContain("reference line polycarbonate at 1.586");
    expect(s.startsWith("Line plot of refractive index, organic content against")).toBe(true);
  });

  it("returns the shown range of a percent figure ×100 and null for a figure not in the run", () => {
    const r = shownRange(lineRun(), ORGANIC)!;
    expect(r.min).toBeCloseTo(40 + 5, 9);
    expect(r.max).toBeCloseTo(60, 9);
    expect(shownRange(lineRun(), VOC)).toBeNull();
  });

  it("says what a colour map and a ternary map draw", () => {
    expect(mapSummary(mapRun(), VOC)).toContain("Colour map of VOC over Titania precursor, weight fraction from 0\u00a0wt% to 20\u00a0wt% (3 values) across and Cure temperature from 100\u00a0°C to 120\u00a0°C (2 values) up, 6 points: VOC from 110.0\u00a0g/L to 312.0\u00a0g/L");
    const t = ternarySummary(ternaryRun(), VOC);
    expect(t).toContain("over TEOS, GPTMS and Titania precursor (shares of their 40\u00a0wt% total), 6 points");
    expect(t).toContain("this revision at TEOS 50\u00a0%, GPTMS 25\u00a0%, Titania precursor 25\u00a0%");
  });

  it("reads one point with its place, figures and verdict", () => {
    // map point 5 = i0 2, i1 1: titania 20 wt%, 120 °C, VOC 100 + 200 + 12 = 312 g/L
    expect(pointReadout(mapRun(), 5, [VOC])).toBe("Titania precursor, weight fraction 20\u00a0wt%, Cure temperature 120\u00a0°C: VOC 312.0\u00a0g/L; fails the thermal check");
    expect(pointReadout(lineRun(), 4, [INDEX])).toBe("Titania precursor, weight fraction 20\u00a0wt%: no figures; refused by the engine (fractions_sum at components.2.fraction)");
    // ternary point 1: TEOS 50 % of 40 wt% = 20 wt%
    expect(pointReadout(ternaryRun(), 1, [VOC])).toContain("TEOS 50\u00a0% (20\u00a0wt%)");
  });
});

describe("points table", () => {
  it("returns headers with units and the verdict in words", () => {
    const cols = pointColumns(lineRun(), [INDEX, ORGANIC]);
    expect(cols.map((c) => c.header)).toEqual(["Point", "Titania precursor, weight fraction (wt%)", "Refractive index", "Organic content (wt%)", "Thermal check"]);
    const thermal = cols.at(-1)!;
    expect([0, 2, 3, 4].map((p) => thermal.text(p))).toEqual(["clear", "caution", "fails the thermal check", "refused by the engine (fractions_sum at components.2.fraction)"]);
    expect(cols[3]!.text(1)).toBe("55.00");
  });

  it("returns the variables of a map and the weight fractions of a ternary map", () => {
    const map = pointColumns(mapRun(), [VOC]);
    expect([0, 1, 2, 3, 4, 5].map((p) => map[2]!.text(p))).toEqual(["100", "120", "100", "120", "100", "120"]);
    expect([0, 2, 4].map((p) => map[1]!.text(p))).toEqual(["0", "10", "20"]);
    // One number of decimals down a column: 0, 2.5 and 5 wt% print as 0.0, 2.5, 5.0.
    const run = lineRun();
    const axis = { ...run.plan.axes[0]!, values: [0, 0.025, 0.05] };
    const cols = pointColumns({ ...run, plan: { ...run.plan, count: 3, axes: [axis] } }, []);
    expect([0, 1, 2].map((p) => cols[1]!.text(p))).toEqual(["0.0", "2.5", "5.0"]);
    const tern = pointColumns(ternaryRun(), [VOC]);
    expect(tern[1]!.header).toBe("TEOS (wt%)");
    expect(tern[1]!.text(1)).toBe("20.00");
  });

  it("sorts by a column, NaN last, ties by point", () => {
    const cols = pointColumns(lineRun(), [INDEX]);
    expect(Array.from(sortedPoints(5, cols, [{ id: "out0", desc: true }]))).toEqual([3, 2, 1, 0, 4]);
    expect(Array.from(sortedPoints(5, cols, [{ id: "out0", desc: false }]))).toEqual([0, 1, 2, 3, 4]);
    expect(Array.from(sortedPoints(5, cols, []))).toEqual([0, 1, 2, 3, 4]);
  });

  it("sorts 10,000 points quickly and counts statuses", () => {
    const run = lineRun();
    const n = 10_000;
    const axis = { ...run.plan.axes[0]!, values: Array.from({ length: n }, (_, i) => i / n) };
    const big = { ...run, plan: { ...run.plan, count: n, axes: [axis] }, values: [Float64Array.from({ length: n }, (_, i) => Math.sin(i))], outputs: [INDEX.key], status: new Uint8Array(n) };
    const t0 = performance.now();
    const order = sortedPoints(n, pointColumns(big, [INDEX]), [{ id: "out0", desc: false }]);
    expect(performance.now() - t0).toBeLessThan(500);
    let rising = true;
    for (let i = 1; i < n; i++) rising &&= Math.sin(order[i]!) >= Math.sin(order[i - 1]!);
    expect(rising).toBe(true);
    expect(statusCounts(big).clear).toBe(n);
    expect(tableCaption(big, [INDEX])).toContain("10,000 points");
  });
});

describe("axis factor", () => {
  it("returns ×100 for weight fractions and the solids content, ×1 otherwise, and follows an axis's own percent flag", () => {
    expect(axisFactor(titaniaAxis([0, 0.1]))).toBe(100);
    expect(axisFactor(temperatureAxis([100, 120]))).toBe(1);
    expect(axisFactor({ ...titaniaAxis([0, 0.1]), percent: false } as ReturnType<typeof titaniaAxis>)).toBe(1);
    expect(axisFactor({ ...temperatureAxis([0, 1]), percent: true } as ReturnType<typeof titaniaAxis>)).toBe(100);
  });
});

describe("thinned line rows", () => {
  const long = (n: number, gapAt: number[] = []) =>
    Array.from({ length: n }, (_, p) => ({ x: p, p, y0: gapAt.includes(p) ? null : Math.sin(p / 50) + (p === 4321 ? 5 : 0) }));

  it("returns the rows unchanged when there are few", () => {
    const rows = long(100);
    expect(thinRows(rows, 1, 1600)).toBe(rows);
  });

  it("returns at most about maxRows rows, keeping the ends and every spike", () => {
    const thin = thinRows(long(20_000), 1, 1600);
    expect(thin.length).toBeLessThanOrEqual(1600);
    expect(thin[0]!.p).toBe(0);
    expect(thin.at(-1)!.p).toBe(19_999);
    expect(thin.some((r) => r.p === 4321)).toBe(true);
    // rows stay in order
    expect(thin.every((r, i) => i === 0 || r.p > thin[i - 1]!.p)).toBe(true);
  });

  it("keeps both edges of a gap, so the line still breaks there", () => {
    const thin = thinRows(long(20_000, [7000, 7001, 7002]), 1, 1600);
    const ps = thin.map((r) => r.p);
    expect(ps).toContain(6999);
    expect(ps).toContain(7000);
    expect(ps).toContain(7002);
    expect(ps).toContain(7003);
  });
});
