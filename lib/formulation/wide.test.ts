/**
 * The engine's exact amounts (`Wide`, decimal.ts): products and sums of
 * line amounts are carried exactly, and no quotient or root is ever worked
 * at Wide's 60 digits. decimal.js gives the result of an operation the
 * precision of its left operand's constructor, so a Wide value on the left
 * of a division or a root would cost a 60-digit quotient and then make every
 * later operation on it longer. These tests watch every division and root
 * the engine makes on random formulations of every kind (the numeric path's
 * input generator and the coat cases) and refuse any whose left operand is
 * Wide; and they check that Wide products and sums are exact (no rounding),
 * against BigInt arithmetic on the digits.
 */
import Decimal from "decimal.js";
import fc from "fast-check";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { Dec, Wide, WIDE_PRECISION, wide } from "./decimal";
import { FormulationError } from "./errors";
import { aqueousCaseArb, coatCaseArb } from "./numeric/coat-arbitraries";
import { formulationInputs } from "./numeric/test-arbitraries";

const WATCHED = ["div", "dividedBy", "sqrt", "squareRoot", "cbrt", "cubeRoot", "pow", "toPower", "ln", "log", "exp", "mod"] as const;

describe("Wide amounts in the engine", () => {
  const prototype = Dec.prototype as unknown as Record<string, (...args: unknown[]) => unknown>;
  const originals = new Map<string, (...args: unknown[]) => unknown>();
  let wideLeft: string[] = [];

  beforeEach(() => {
    wideLeft = [];
    for (const name of WATCHED) {
      const original = prototype[name] as (...args: unknown[]) => unknown;
      originals.set(name, original);
      prototype[name] = function (this: Decimal, ...args: unknown[]) {
        if ((this.constructor as Decimal.Constructor).precision === WIDE_PRECISION) wideLeft.push(`${name} at ${new Error().stack?.split("\n")[2]?.trim()}`);
        return original.apply(this, args);
      };
    }
  });
  afterEach(() => {
    for (const [name, original] of originals) prototype[name] = original;
  });

  function run(input: Parameters<typeof computeFormulation>[0]): void {
    try {
      computeFormulation(input);
    } catch (error) {
      // refusals are part of the generated cases; anything else is a bug
      if (!(error instanceof FormulationError)) throw error;
    }
  }

  it("never divides or takes a root with a Wide value on the left (random formulations of every kind)", () => {
    fc.assert(
      fc.property(formulationInputs, (input) => {
        run(input);
        expect(wideLeft).toEqual([]);
      }),
      { numRuns: 400 },
    );
  });

  it("never divides or takes a root with a Wide value on the left (coat cases, aqueous sols)", () => {
    fc.assert(
      fc.property(coatCaseArb, aqueousCaseArb, (coat, aqueous) => {
        run(coat.input);
        run(aqueous);
        expect(wideLeft).toEqual([]);
      }),
      { numRuns: 150 },
    );
  });

  it("sees a Wide value on the left of a division (the watch itself works)", () => {
    wide(0.3).div(7);
    expect(wideLeft).toHaveLength(1);
  });
});

describe("Wide arithmetic", () => {
  /** The exact value of a finite decimal as digits × 10^exponent, in BigInt. */
  function exact(value: Decimal): { digits: bigint; exponent: number } {
    const [mantissa = "0", exponent = "0"] = value.toExponential().split("e");
    const [whole = "0", fraction = ""] = mantissa.replace("-", "").split(".");
    const sign = value.isNegative() ? -1n : 1n;
    return { digits: sign * BigInt(whole + fraction), exponent: Number(exponent) - fraction.length };
  }
  function align(a: { digits: bigint; exponent: number }, exponent: number): bigint {
    return a.digits * 10n ** BigInt(a.exponent - exponent);
  }

  const engineLike = fc
    .tuple(fc.double({ min: 1e-6, max: 1e4, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }))
    .map(([a, b]) => new Dec(a).div(b)); // a 20-digit quotient, as the folded factors are

  it("multiplies exactly: a Wide fraction times two 20-digit decimals", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 1, noNaN: true }), engineLike, engineLike, (w, f, g) => {
        const product = wide(w).times(f).times(g);
        const [x, y, z, p] = [exact(new Wide(w)), exact(f), exact(g), exact(product)];
        const exponent = x.exponent + y.exponent + z.exponent;
        expect(p.exponent).toBeGreaterThanOrEqual(exponent);
        expect(align(p, exponent)).toBe(x.digits * y.digits * z.digits);
      }),
      { numRuns: 2000 },
    );
  });

  it("adds exactly: ten terms of unlike size", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ min: 1e-4, max: 1, noNaN: true }), engineLike), { minLength: 10, maxLength: 10 }), (terms) => {
        let sum: Decimal = new Wide(0);
        const parts = terms.map(([w, f]) => wide(w).times(f));
        for (const part of parts) sum = sum.plus(part);
        const exponent = Math.min(...parts.map((part) => exact(part).exponent));
        const expected = parts.reduce((total, part) => total + align(exact(part), exponent), 0n);
        expect(align(exact(sum), exponent)).toBe(expected);
      }),
      { numRuns: 1000 },
    );
  });
});
