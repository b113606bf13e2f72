/**
 * toNumber against the conversion it stands for, Number(value.toString())
 * (JavaScript's own correctly rounded parse is the oracle), bit for bit:
 * decimals of 1 to 28 digits at any exponent, longer ones (the engine's Wide
 * amounts, up to 60 digits, read from their first 4 words), and the hard cases, decimals
 * within a unit of their last digit of a point exactly halfway between two
 * neighbouring doubles, where a conversion that errs by a hair rounds the
 * wrong way.
 */
import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Dec, Wide } from "./decimal";
import { toNumber } from "./to-number";

/** A wide decimal, to build values of up to 80 digits exactly. */
const Exact = Decimal.clone({ precision: 80, rounding: Decimal.ROUND_HALF_EVEN });

function sameAsParse(value: Decimal): void {
  expect(Object.is(toNumber(value), Number(value.toString()))).toBe(true);
  const negated = value.negated();
  expect(Object.is(toNumber(negated), Number(negated.toString()))).toBe(true);
}

/** M · 2^E for an odd M of 54 bits: exactly halfway between two neighbouring doubles, written exactly in decimal. */
function halfway(m: bigint, e: number): Decimal {
  return e >= 0 ? new Exact((m << BigInt(e)).toString()) : new Exact(`${m * 5n ** BigInt(-e)}e${e}`);
}

describe("toNumber", () => {
  it("gives Number(value.toString()) bit for bit for 1 to 28 digits at exponents −60 … +45", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: 1n, max: 10n ** 28n - 1n }), fc.integer({ min: -60, max: 45 }), (digits, exponent) => {
        sameAsParse(new Exact(`${digits}e${exponent}`));
      }),
      { numRuns: 5000 },
    );
  });

  it("gives Number(value.toString()) bit for bit for 29 to 60 digits (the first 4 words read, the rest bounded)", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: 10n ** 28n, max: 10n ** 60n - 1n }), fc.integer({ min: -80, max: 45 }), (digits, exponent) => {
        sameAsParse(new Exact(`${digits}e${exponent}`));
      }),
      { numRuns: 5000 },
    );
  });

  it("gives Number(value.toString()) for Wide amounts: exact products and sums of engine-like decimals", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e3, noNaN: true }),
        fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        (a, b, c) => {
          const product = new Wide(a).times(new Dec(b).div(c));
          sameAsParse(product);
          sameAsParse(product.plus(new Dec(c).div(b)));
        },
      ),
      { numRuns: 3000 },
    );
  });

  it("gives Number(value.toString()) bit for bit next to points halfway between two doubles", () => {
    const oddMantissa = fc.bigInt({ min: 2n ** 53n, max: 2n ** 54n - 1n }).map((m) => m | 1n);
    fc.assert(
      fc.property(oddMantissa, fc.integer({ min: -150, max: 120 }), fc.integer({ min: 15, max: 60 }), fc.integer({ min: -2, max: 2 }), (m, e, digits, steps) => {
        const rounded = halfway(m, e).toSignificantDigits(digits);
        // steps units of the last digit kept away from the rounded halfway point
        const unit = new Exact(10).pow(rounded.e - digits + 1);
        sameAsParse(rounded.plus(unit.times(steps)));
      }),
      { numRuns: 5000 },
    );
  });

  it("rounds exact halfway points of up to 28 digits to even, as the parse does", () => {
    const oddMantissa = fc.bigInt({ min: 2n ** 53n, max: 2n ** 54n - 1n }).map((m) => m | 1n);
    fc.assert(
      fc.property(oddMantissa, fc.integer({ min: -17, max: 38 }), (m, e) => {
        const point = halfway(m, e);
        fc.pre(point.sd() <= 28);
        sameAsParse(point);
      }),
      { numRuns: 3000 },
    );
  });

  it("gives Number(value.toString()) for the decimals the engine makes: quotients and products rounded to 20 digits", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e12, noNaN: true }), fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (a, b) => {
        sameAsParse(new Dec(a).div(b));
        sameAsParse(new Dec(a).times(b));
      }),
      { numRuns: 3000 },
    );
  });

  describe("edge cases", () => {
    it("rounds an exact halfway point to even, as the parse does", () => {
      // 2^53 + 1 lies halfway between 2^53 and 2^53 + 2: ties to even give 2^53
      expect(toNumber(new Dec("9007199254740993"))).toBe(9007199254740992);
      expect(toNumber(new Dec("9007199254740995"))).toBe(9007199254740996);
    });

    it("gives +0 for zero and −0, and keeps NaN and infinities", () => {
      expect(Object.is(toNumber(new Dec(0)), 0)).toBe(true);
      expect(Object.is(toNumber(new Dec(-0)), 0)).toBe(true);
      expect(toNumber(new Dec(NaN))).toBeNaN();
      expect(toNumber(new Dec(Infinity))).toBe(Infinity);
      expect(toNumber(new Dec(-Infinity))).toBe(-Infinity);
    });

    it("reads values beyond the fast path (more digits, far exponents, subnormal) as the parse does", () => {
      for (const text of ["1.2345678901234567890123456789012345", "1e-320", "4.9e-324", "2e-324", "1.7976931348623157e308", "1e309", "123456789e-330"]) {
        sameAsParse(new Exact(text));
      }
    });
  });
});
