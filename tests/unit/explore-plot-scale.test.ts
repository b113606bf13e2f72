import { describe, expect, it } from "vitest";
import { colourAt, cssColourAt, figureRange, relativeLuminance, SCALE_ANCHORS, scalePosition, scaleTable, SCALE_STEPS } from "@/components/explore/plots/colour-scale";
import { niceStep, niceTicks, stepDecimals, tickText } from "@/components/explore/plots/ticks";

describe("colour scale", () => {
  it("returns the first and last anchors at the ends and clamps beyond them", () => {
    expect(colourAt(0)).toEqual(SCALE_ANCHORS[0]);
    expect(colourAt(1)).toEqual(SCALE_ANCHORS.at(-1));
    expect(colourAt(-3)).toEqual(SCALE_ANCHORS[0]);
    expect(colourAt(7)).toEqual(SCALE_ANCHORS.at(-1));
    expect(colourAt(Number.NaN)).toEqual(SCALE_ANCHORS[0]);
    expect(cssColourAt(0)).toBe("rgb(11 39 81)");
  });

  it("returns strictly rising luminance over 2001 samples, so the scale reads in grey (WCAG 2.x relative luminance)", () => {
    let previous = -1;
    for (let k = 0; k <= 2000; k++) {
      const l = relativeLuminance(colourAt(k / 2000));
      expect(l).toBeGreaterThan(previous);
      previous = l;
    }
  });

  it("returns a dark low end and a light high end, far apart in grey", () => {
    // WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05): at least 7:1 between the ends.
    const low = relativeLuminance(colourAt(0));
    const high = relativeLuminance(colourAt(1));
    expect(low).toBeLessThan(0.03);
    expect(high).toBeGreaterThan(0.75);
    expect((high + 0.05) / (low + 0.05)).toBeGreaterThan(7);
  });

  it("returns luminance rising at every lookup-table step the maps draw with", () => {
    const table = scaleTable();
    expect(table.length).toBe(SCALE_STEPS * 4);
    let previous = -1;
    for (let k = 0; k < SCALE_STEPS; k++) {
      const l = relativeLuminance([table[k * 4]!, table[k * 4 + 1]!, table[k * 4 + 2]!]);
      expect(l).toBeGreaterThan(previous);
      expect(table[k * 4 + 3]).toBe(255);
      previous = l;
    }
  });

  it("returns blue at the low end and yellow at the high end (the axis red–green deficiencies keep)", () => {
    const [r0, , b0] = colourAt(0);
    const [r1, g1, b1] = colourAt(1);
    expect(b0).toBeGreaterThan(r0);
    expect(r1).toBeGreaterThan(b1);
    expect(g1).toBeGreaterThan(b1);
  });

  it("returns the range of the finite values and a position on it", () => {
    expect(figureRange(Float64Array.of(3, Number.NaN, -1, Infinity, 2))).toEqual({ min: -1, max: 3 });
    expect(figureRange(Float64Array.of(Number.NaN))).toBeNull();
    expect(scalePosition(2, { min: 1, max: 5 })).toBe(0.25);
    expect(scalePosition(4, { min: 4, max: 4 })).toBe(0.5);
  });
});

describe("nice ticks", () => {
  it("returns steps of 1, 2, 2.5 or 5 × 10^k (Heckbert, Graphics Gems 1990)", () => {
    expect(niceStep(17, 5)).toBe(5);
    expect(niceStep(0.2, 5)).toBeCloseTo(0.05, 12);
    expect(niceStep(1, 4)).toBe(0.25);
    expect(niceStep(100, 5)).toBe(20);
    expect(niceStep(9, 10)).toBe(1);
  });

  it("returns ticks inside the range, at multiples of the step", () => {
    expect(niceTicks(0, 0.2, 5).values).toEqual([0, 0.05, 0.1, 0.15, 0.2]);
    // span 0.1222 / 5 = 0.0244 → step 0.025.
    expect(niceTicks(1.4712, 1.5934, 5).values).toEqual([1.475, 1.5, 1.525, 1.55, 1.575]);
    expect(niceTicks(20, -20, 4).values).toEqual([-20, -10, 0, 10, 20]);
    const t = niceTicks(0, 1, 4);
    expect(t.values).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(t.decimals).toBe(2);
  });

  describe("edge cases", () => {
    it("returns one tick for a single value and none for NaN", () => {
      expect(niceTicks(3, 3).values).toEqual([3]);
      expect(niceTicks(0, 0).values).toEqual([0]);
      expect(niceTicks(Number.NaN, 1).values).toEqual([]);
    });

    it("prints ticks with the step's decimals and a true minus", () => {
      expect(stepDecimals(0.25)).toBe(2);
      expect(stepDecimals(5)).toBe(0);
      expect(stepDecimals(0.1)).toBe(1);
      expect(tickText(-0.5, 1)).toBe("−0.5");
      expect(tickText(-0.00001, 1)).toBe("0.0");
    });
  });
});
