/**
 * Deviation from target and the tolerance check (±1 % or the balance
 * resolution, whichever is larger), worked by hand in the comments
 * (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { lineDeviation } from "./deviation";

describe("lineDeviation", () => {
  it("returns the absolute and relative deviation and flags nothing inside ±1 %", () => {
    // target 24.00 g, actual 24.20 g: +0.20 g; 0.20 / 24.00 = 0.0083333…; tolerance max(0.01 × 24 = 0.24 g, 0.01 g) = 0.24 g → inside.
    const d = lineDeviation(24, 24.2, 0.01, 0.01);
    expect(d.absoluteGrams).toBeCloseTo(0.2, 12);
    expect(d.relative).toBeCloseTo(0.2 / 24, 12);
    expect(d.toleranceGrams).toBe(0.24);
    expect(d.outside).toBe(false);
  });

  it("flags a line beyond ±1 % of its target", () => {
    // target 24.00 g, actual 23.70 g: −0.30 g; −0.30 / 24 = −0.0125 (−1.25 %); |−0.30| > 0.24 g → outside.
    const d = lineDeviation(24, 23.7, 0.01, 0.01);
    expect(d.absoluteGrams).toBeCloseTo(-0.3, 12);
    expect(d.relative).toBeCloseTo(-0.0125, 12);
    expect(d.outside).toBe(true);
  });

  it("uses the balance resolution when it is larger than 1 % of a small target", () => {
    // target 0.500 g: 1 % = 0.005 g < resolution 0.01 g → tolerance 0.01 g.
    // actual 0.508 g: +0.008 g → inside; actual 0.515 g: +0.015 g → outside.
    expect(lineDeviation(0.5, 0.508, 0.01, 0.01)).toMatchObject({ toleranceGrams: 0.01, outside: false });
    expect(lineDeviation(0.5, 0.515, 0.01, 0.01)).toMatchObject({ toleranceGrams: 0.01, outside: true });
  });

  describe("edge cases", () => {
    it("treats a deviation exactly at the tolerance as inside (decimal arithmetic, no binary rounding)", () => {
      // target 10 g, actual 10.1 g: deviation exactly 0.1 g = 1 % of 10 g. In binary floating point 10.1 − 10 = 0.0999999999999996.
      const d = lineDeviation(10, 10.1, 0.01, 0.01);
      expect(d.absoluteGrams).toBe(0.1);
      expect(d.outside).toBe(false);
    });

    it("returns a null relative deviation for a zero target", () => {
      expect(lineDeviation(0, 0.02, 0.01, 0.01)).toMatchObject({ relative: null, toleranceGrams: 0.01, outside: true });
    });
  });
});
