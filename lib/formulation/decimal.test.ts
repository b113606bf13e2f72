/**
 * The fast path of decimal.ts against the plain decimal.js operation it
 * stands for (the oracle is decimal.js itself, no external values):
 * toNumber(value) gives the very number of Number(value.toString()).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec, toNumber } from "./decimal";

/** Decimals as the engine makes them: JS numbers, and quotients and products rounded to 20 digits. */
const decimal: fc.Arbitrary<Dec> = fc.oneof(
  fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }).map((x) => new Dec(x)),
  fc
    .tuple(fc.double({ min: 1e-9, max: 1e9, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }))
    .map(([a, b]) => new Dec(a).div(b)),
  fc.tuple(fc.bigInt({ min: 1n, max: 10n ** 20n - 1n }), fc.integer({ min: -30, max: 30 })).map(([digits, exponent]) => new Dec(`${digits}e${exponent}`)),
);

describe("toNumber", () => {
  it("gives exactly Number(value.toString())", () => {
    fc.assert(
      fc.property(decimal, (value) => {
        expect(Object.is(toNumber(value), Number(value.toString()))).toBe(true);
        expect(Object.is(toNumber(value.negated()), Number(value.negated().toString()))).toBe(true);
      }),
      { numRuns: 5000 },
    );
  });

  it("gives +0 for zero and keeps NaN and infinities", () => {
    expect(Object.is(toNumber(new Dec(-0)), 0)).toBe(true);
    expect(toNumber(new Dec(NaN))).toBeNaN();
    expect(toNumber(new Dec(-Infinity))).toBe(-Infinity);
  });
});
