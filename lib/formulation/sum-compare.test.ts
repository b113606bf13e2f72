/**
 * compareSum against the decimal sum it stands for (the oracle is
 * decimal.js itself): the float sum may only settle a comparison the
 * decimal sum settles the same way, also for bounds within a unit of the
 * 20th digit of the sum, where the float sum cannot tell.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec, dec } from "./decimal";
import { compareSum, decimalSum } from "./sum-compare";

/** Numbers as fractions and weight fractions come: 0, short decimals, and any double in (0, 1]. */
const fractionValue = fc.oneof(
  fc.constant(0),
  fc.integer({ min: 1, max: 1000 }).map((n) => n / 1000),
  fc.double({ min: 1e-6, max: 1, noNaN: true }),
);
const values = fc.array(fractionValue, { minLength: 1, maxLength: 60 });

/** The sign of the decimal comparison: what compareSum must return. */
function oracle(list: readonly number[], bound: Dec): number {
  return decimalSum(list).comparedTo(bound);
}

describe("compareSum", () => {
  it("returns the sign of the decimal sum minus the bound, for bounds anywhere", () => {
    fc.assert(
      fc.property(values, fc.double({ min: 0, max: 2, noNaN: true }), (list, bound) => {
        expect(compareSum(list, dec(bound))).toBe(oracle(list, dec(bound)));
      }),
      { numRuns: 3000 },
    );
  });

  it("returns the sign of the decimal comparison for bounds at and next to the decimal sum", () => {
    fc.assert(
      fc.property(values, fc.integer({ min: -3, max: 3 }), fc.integer({ min: -25, max: -12 }), (list, steps, exponent) => {
        const bound = decimalSum(list).plus(new Dec(`${steps}e${exponent}`));
        expect(compareSum(list, bound)).toBe(oracle(list, bound));
      }),
      { numRuns: 3000 },
    );
  });

  describe("edge cases", () => {
    it("finds 0.333 + 0.333 + 0.329 equal to 0.995, though the float sum is 0.9950000000000001", () => {
      expect(0.333 + 0.333 + 0.329).not.toBe(0.995);
      expect(compareSum([0.333, 0.333, 0.329], dec(0.995))).toBe(0);
      expect(compareSum([0.333, 0.333, 0.329], new Dec("0.99500000000000000001"))).toBe(-1);
    });

    it("finds 0.1 + 0.2 above 0.3 by nothing, and above 0.29999999999999999999", () => {
      expect(compareSum([0.1, 0.2], dec(0.3))).toBe(0);
      expect(compareSum([0.1, 0.2], new Dec("0.29999999999999999999"))).toBe(1);
    });

    it("adds an empty list to 0", () => {
      expect(compareSum([], dec(0))).toBe(0);
      expect(compareSum([], dec(1e-9))).toBe(-1);
    });
  });
});
