/**
 * Rounding to what production weighs or measures (balance readability; common
 * practice, no source). Expected strings worked by hand.
 */
import { describe, expect, it } from "vitest";
import { decimalPlaces, roundToResolution } from "./resolution";

describe("roundToResolution", () => {
  it("returns a mass at the balance's readability with its decimal places", () => {
    // 98.9247498288342 g on a 0.01 g balance: 98.92 (the third decimal, 4, rounds down).
    expect(roundToResolution(98.9247498288342, 0.01)).toBe("98.92");
    expect(roundToResolution(98.9247498288342, 0.001)).toBe("98.925");
    expect(roundToResolution(98.9247498288342, 0.1)).toBe("98.9");
    expect(roundToResolution(98.9247498288342, 1)).toBe("99");
    // Trailing zeros show the resolution: 12.5 g at 0.01 g is 12.50 g.
    expect(roundToResolution(12.5, 0.01)).toBe("12.50");
  });

  it("rounds to a multiple of a step that is not a power of ten", () => {
    // 3.14159 / 0.05 = 62.83 → 63 × 0.05 = 3.15.
    expect(roundToResolution(3.14159, 0.05)).toBe("3.15");
    expect(roundToResolution(7.3, 0.5)).toBe("7.5");
  });

  describe("edge cases", () => {
    it("rounds halves away from zero in decimal, not in binary", () => {
      // 1.005 is 1.00499999999999989… as a double; decimal rounding of the written value gives 1.01.
      expect(roundToResolution(1.005, 0.01)).toBe("1.01");
      expect(roundToResolution(-0.125, 0.01)).toBe("-0.13");
    });

    it("never writes a negative zero", () => {
      expect(roundToResolution(-0.001, 0.01)).toBe("0.00");
    });
  });
});

describe("decimalPlaces", () => {
  it("returns the places a resolution shows", () => {
    expect([1, 0.1, 0.01, 0.001, 0.0001, 0.05, 0.5].map(decimalPlaces)).toEqual([0, 1, 2, 3, 4, 2, 1]);
  });
});
