/**
 * The fast path of decimal.ts against the plain decimal.js operation it
 * stands for (the oracle is decimal.js itself, no external values):
 * toNumber(value) gives the very number of Number(value.toString());
 * per(value, d) (a product with the memoised reciprocal) stays within two
 * units of the 20th digit of value.div(d); add and positive agree with
 * plus and greaterThan(0).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { add, Dec, per, positive, reciprocal, toNumber, ZERO } from "./decimal";

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

/** Divisors as materials carry them: densities, molar masses, assays (plain numbers). */
const divisor = fc.double({ min: 1e-3, max: 1e7, noNaN: true });

describe("per and reciprocal", () => {
  it("agree with division to 1e-19 relative, and give the same JS number almost always", () => {
    let sameNumber = 0;
    const runs = 3000;
    fc.assert(
      fc.property(decimal, divisor, (value, d) => {
        const quotient = value.div(d);
        const product = per(value, d);
        if (quotient.isZero()) expect(product.isZero()).toBe(true);
        else expect(product.minus(quotient).div(quotient).abs().lessThanOrEqualTo("1e-19")).toBe(true);
        if (toNumber(product) === toNumber(quotient)) sameNumber += 1;
      }),
      { numRuns: runs },
    );
    // a JS number keeps ~16 digits: the last-bit differences are rare
    expect(sameNumber / runs).toBeGreaterThan(0.99);
  });

  it("is memoised and exact for 1", () => {
    expect(reciprocal(0.7893)).toBe(reciprocal(0.7893));
    expect(per(new Dec(5), 1).toNumber()).toBe(5);
    expect(reciprocal(4).toNumber()).toBe(0.25);
  });
});

describe("add and positive", () => {
  it("agree with plus and greaterThan(0)", () => {
    fc.assert(
      fc.property(fc.oneof(decimal, fc.constant(ZERO)), fc.oneof(decimal, fc.constant(ZERO)), (a, b) => {
        expect(add(a, b).equals(a.plus(b))).toBe(true);
        expect(positive(a)).toBe(a.greaterThan(0));
      }),
      { numRuns: 2000 },
    );
  });
});
