import { describe, expect, it } from "vitest";
import { capability, CPK_CAUTION, D2, D4, individualsChart } from "@/lib/quality/control-chart";

// Formulas: NIST/SEMATECH e-Handbook of Statistical Methods, section 6.3.2 (individuals
// control charts: x̄ ± 3·MR̄/d2, MR chart UCL = D4·MR̄, moving range of 2), section 6.1.6 (Cpk);
// constants d2 = 1.128, D4 = 3.267 for n = 2: ISO 7870-2, table 2.
// The worked examples below are computed by hand in the comments; one reproduces the
// Handbook's own individuals-chart example, its data and limits recalled from memory.

describe("I-MR control limits", () => {
  it("uses the ISO 7870-2 constants for moving ranges of two", () => {
    expect(D2).toBe(1.128);
    expect(D4).toBe(3.267);
    // 3 / d2 = 2.66 (the familiar individuals-chart factor, NIST/SEMATECH 6.3.2)
    expect(3 / D2).toBeCloseTo(2.66, 2);
  });

  it("matches a hand-computed example", () => {
    // x = 10, 12, 11, 13, 12  → x̄ = 58/5 = 11.6
    // moving ranges |12−10|, |11−12|, |13−11|, |12−13| = 2, 1, 2, 1 → MR̄ = 6/4 = 1.5
    // σ = MR̄/d2 = 1.5/1.128 = 1.329787…
    // UCL = 11.6 + 3σ = 15.589362…, LCL = 11.6 − 3σ = 7.610638…
    // MR chart UCL = 3.267 · 1.5 = 4.9005
    const c = individualsChart([10, 12, 11, 13, 12])!;
    expect(c.mean).toBeCloseTo(11.6, 12);
    expect(c.meanMovingRange).toBeCloseTo(1.5, 12);
    expect(c.sigma).toBeCloseTo(1.329787, 6);
    expect(c.upperControlLimit).toBeCloseTo(15.589362, 6);
    expect(c.lowerControlLimit).toBeCloseTo(7.610638, 6);
    expect(c.movingRangeUpperLimit).toBeCloseTo(4.9005, 10);
    expect(c.points.map((p) => p.movingRange)).toEqual([null, 2, 1, 2, 1]);
    expect(c.points.every((p) => p.rules.length === 0)).toBe(true);
  });

  it("reproduces the individuals-chart example of NIST/SEMATECH 6.3.2.2 (data and limits from memory)", () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, 6.3.2.2 "Individuals Control Charts",
    // example: ten measurements 49.6 47.6 49.9 51.3 47.8 51.2 52.6 52.4 53.6 52.1, with the
    // Handbook's limits UCL 55.80, centre line 50.81, LCL 45.82 and MR chart UCL 6.13
    // (data and limits recalled from memory, then recomputed by hand here):
    // Σx = 508.1 → x̄ = 50.81; moving ranges 2.0 2.3 1.4 3.5 3.4 1.4 0.2 1.2 1.5, Σ = 16.9
    // → MR̄ = 16.9/9 = 1.87778; 3·MR̄/1.128 = 4.99409 → UCL 55.804, LCL 45.816;
    // D4·MR̄ = 3.267 · 1.87778 = 6.1347. No point lies beyond the limits, no run of 8.
    const c = individualsChart([49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1])!;
    expect(c.mean).toBeCloseTo(50.81, 10);
    expect(c.meanMovingRange).toBeCloseTo(1.877778, 6);
    expect(c.upperControlLimit).toBeCloseTo(55.8, 2);
    expect(c.lowerControlLimit).toBeCloseTo(45.82, 2);
    expect(c.movingRangeUpperLimit).toBeCloseTo(6.13, 2);
    expect(c.points.some((p) => p.rules.includes("beyond-3-sigma"))).toBe(false);
    expect(c.points.some((p) => p.rules.includes("eight-on-one-side"))).toBe(false);
  });

  it("refuses fewer than two values or a non-finite one", () => {
    expect(individualsChart([])).toBeNull();
    expect(individualsChart([1])).toBeNull();
    expect(individualsChart([1, Number.NaN])).toBeNull();
  });
});

describe("run rules (NIST/SEMATECH 6.3.2, Western Electric rules)", () => {
  it("flags a point beyond 3σ", () => {
    // 10, 11 alternating ×5 then 20: x̄ = 125/11 = 11.3636, MR̄ = (9·1 + 9)/10 = 1.8,
    // σ = 1.8/1.128 = 1.5957, UCL = 11.3636 + 4.7872 = 16.1508 < 20
    const values = [10, 11, 10, 11, 10, 11, 10, 11, 10, 11, 20];
    const c = individualsChart(values)!;
    expect(c.upperControlLimit).toBeCloseTo(16.1508, 3);
    expect(c.points[10]!.rules).toContain("beyond-3-sigma");
    expect(c.points.slice(0, 10).every((p) => !p.rules.includes("beyond-3-sigma"))).toBe(true);
  });

  it("flags 2 of 3 consecutive points beyond 2σ on the same side, on the completing point only", () => {
    // 20 points alternating 10, 11, then 13.5, 10.5, 13.5:
    // x̄ = (210 + 37.5)/23 = 10.76087; MR̄ = (19 + 2.5 + 3 + 3)/22 = 1.25; σ = 1.108156
    // x̄ + 2σ = 12.97718 < 13.5 < x̄ + 3σ = 14.08534: point 20 alone in its window,
    // point 22 is the second of [20, 21, 22] beyond 2σ above.
    const base = Array.from({ length: 20 }, (_, i) => (i % 2 ? 11 : 10));
    const c = individualsChart([...base, 13.5, 10.5, 13.5])!;
    expect(c.mean).toBeCloseTo(10.76087, 5);
    expect(c.sigma).toBeCloseTo(1.108156, 6);
    expect(c.points[20]!.rules).toEqual([]);
    expect(c.points[22]!.rules).toEqual(["two-of-three-beyond-2-sigma"]);
    expect(c.points.filter((p) => p.rules.length > 0).map((p) => p.index)).toEqual([22]);
  });

  it("flags 8 in a row on one side of the centre line from the 8th point on", () => {
    // 8 values at 9.9/10.1 (below), then 8 at 10.9/11.1 (above): x̄ = 10.5;
    // the second run completes at index 15 (8th point above); the first at index 7.
    const low = [9.9, 10.1, 9.9, 10.1, 9.9, 10.1, 9.9, 10.1];
    const high = [10.9, 11.1, 10.9, 11.1, 10.9, 11.1, 10.9, 11.1];
    const c = individualsChart([...low, ...high])!;
    expect(c.mean).toBeCloseTo(10.5, 12);
    expect(c.points[6]!.rules).not.toContain("eight-on-one-side");
    expect(c.points[7]!.rules).toContain("eight-on-one-side");
    expect(c.points[14]!.rules).not.toContain("eight-on-one-side");
    expect(c.points[15]!.rules).toContain("eight-on-one-side");
  });

  it("flags nothing when all values are equal (σ = 0)", () => {
    const c = individualsChart(Array(30).fill(5))!;
    expect(c.sigma).toBe(0);
    expect(c.points.every((p) => p.rules.length === 0)).toBe(true);
  });
});

describe("Cpk (NIST/SEMATECH 6.1.6)", () => {
  // 25 values alternating 10, 11 (13 × 10, 12 × 11): x̄ = 262/25 = 10.48, MR̄ = 1, σ = 1/1.128 = 0.886525
  const values = Array.from({ length: 25 }, (_, i) => (i % 2 ? 11 : 10));

  it("is shown only from 25 results on", () => {
    expect(capability(individualsChart(values.slice(0, 24))!, 7, 14)).toBeNull();
    expect(capability(individualsChart(values)!, 7, 14)).not.toBeNull();
  });

  it("takes the nearer limit: min(USL − x̄, x̄ − LSL)/3σ, with the caution", () => {
    // USL 14: (14 − 10.48)/(3·0.886525) = 3.52/2.659574 = 1.323520
    // LSL 9:  (10.48 − 9)/2.659574 = 1.48/2.659574 = 0.556480 → Cpk = 0.556480
    const cap = capability(individualsChart(values)!, 9, 14)!;
    expect(cap.cpk).toBeCloseTo(0.55648, 5);
    expect(cap.count).toBe(25);
    expect(cap.caution).toBe(CPK_CAUTION);
    expect(cap.caution).toMatch(/stable process/);
    // one-sided specification: upper limit only
    expect(capability(individualsChart(values)!, null, 14)!.cpk).toBeCloseTo(1.32352, 5);
    expect(capability(individualsChart(values)!, null, null)).toBeNull();
  });
});
