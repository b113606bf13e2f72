/**
 * The fast paths of decimal.ts against the plain decimal.js operations they
 * stand for (the oracle is decimal.js itself, no external values):
 * - divideBy(value, d) gives the very decimal of value.div(dec(d));
 * - toNumber(value) gives the very number of Number(value.toString()).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec, dec, divideBy, toNumber } from "./decimal";

/** Same sign, exponent and digit words: the same decimal, not only an equal one. */
function sameDecimal(actual: Dec, expected: Dec): void {
  expect({ s: actual.s, e: actual.e, d: actual.d }).toEqual({ s: expected.s, e: expected.e, d: expected.d });
}

/** Decimals as the engine makes them: JS numbers, and quotients and products rounded to 20 digits. */
const decimal: fc.Arbitrary<Dec> = fc.oneof(
  fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }).map((x) => new Dec(x)),
  fc
    .tuple(fc.double({ min: 1e-9, max: 1e9, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }))
    .map(([a, b]) => new Dec(a).div(b)),
  fc.tuple(fc.bigInt({ min: 1n, max: 10n ** 20n - 1n }), fc.integer({ min: -30, max: 30 })).map(([digits, exponent]) => new Dec(`${digits}e${exponent}`)),
);

/** Divisors as material data gives them: up to 7 significant digits (0.933, 2.2, 60.083, 208.329), and any double. */
const divisor: fc.Arbitrary<number> = fc.oneof(
  fc.tuple(fc.integer({ min: 1, max: 9_999_999 }), fc.integer({ min: 0, max: 7 })).map(([digits, places]) => digits / 10 ** places),
  fc.double({ min: 1e-6, max: 1e7, noNaN: true }),
  fc.constantFrom(2.2, 60.083, 18.015, 208.329, 0.933, 1.2, 1e7, 12_000_000, 0.5, 1),
);

describe("divideBy", () => {
  it("gives exactly value.div(dec(divisor))", () => {
    fc.assert(
      fc.property(decimal, divisor, fc.boolean(), (value, d, negative) => {
        const divisorValue = negative ? -d : d;
        sameDecimal(divideBy(value, divisorValue), value.div(dec(divisorValue)));
      }),
      { numRuns: 5000 },
    );
  });

  it("keeps division by zero as decimal.js has it", () => {
    expect(divideBy(new Dec(1), 0).toString()).toBe("Infinity");
    expect(divideBy(new Dec(0), 0).isNaN()).toBe(true);
  });
});

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
