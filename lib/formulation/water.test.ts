/**
 * clearlyBelow's float shortcut against the decimal comparison it stands for
 * (the oracle is decimal.js itself): value < reference · (1 − 1e-9).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec } from "./decimal";
import { clearlyBelow, WATER_RATIO_TOLERANCE } from "./water";

const FACTOR = new Dec(1).minus(WATER_RATIO_TOLERANCE);

/** Decimals as the engine makes them, in any range a double holds and beyond. */
const decimal: fc.Arbitrary<Dec> = fc.oneof(
  fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }).map((x) => new Dec(x)),
  fc.tuple(fc.bigInt({ min: 1n, max: 10n ** 20n - 1n }), fc.integer({ min: -400, max: 400 })).map(([digits, exponent]) => new Dec(`${digits}e${exponent}`)),
);

describe("clearlyBelow", () => {
  it("decides as the decimal comparison value < reference · (1 − tolerance)", () => {
    fc.assert(
      fc.property(decimal, decimal, (value, reference) => {
        expect(clearlyBelow(value, reference)).toBe(value.lessThan(reference.times(FACTOR)));
      }),
      { numRuns: 3000 },
    );
  });

  it("decides right at the edge of the tolerance", () => {
    fc.assert(
      fc.property(decimal, fc.integer({ min: -30, max: 30 }), (reference, nudge) => {
        // values within a few units of the 20th digit of the bound, on either side
        const bound = reference.times(FACTOR);
        const value = bound.plus(bound.abs().times(`${nudge}e-19`));
        expect(clearlyBelow(value, reference)).toBe(value.lessThan(bound));
      }),
      { numRuns: 3000 },
    );
  });

  it("keeps the worked cases", () => {
    expect(clearlyBelow(new Dec("3.99999999999999999999"), new Dec(4))).toBe(false);
    expect(clearlyBelow(new Dec(3.99), new Dec(4))).toBe(true);
    expect(clearlyBelow(new Dec(0), new Dec(0))).toBe(false);
  });
});
