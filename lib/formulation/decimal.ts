import Decimal from "decimal.js";
import { WATER_MOLAR_MASS_G_PER_MOL } from "./constants";
import { toNumber } from "./to-number";

export { toNumber };

/**
 * The engine's decimal constructor: 20 significant digits, banker's
 * rounding, for constants, quotients, roots and whatever is not a sum or
 * product of amounts (those are `Wide`, exact). A private clone, so that
 * global changes to decimal.js settings elsewhere in the application cannot
 * alter results.
 *
 * @example
 * ```ts
 * new Dec(0.1).plus(0.2).toNumber(); // 0.3
 * ```
 */
export const Dec: Decimal.Constructor = Decimal.clone({ precision: 20, rounding: Decimal.ROUND_HALF_EVEN });

/** A decimal value produced by `Dec`. */
export type Dec = Decimal;

/**
 * Significant digits kept by `Wide`: far more than a product or a sum of the
 * engine's amounts needs (a 20-digit factor times a weight fraction and a
 * mass has at most ~40 digits; adding terms of unlike size a few more), so
 * those results are exact and decimal.js skips its rounding step, about half
 * the cost of each operation.
 */
export const WIDE_PRECISION = 60;

/**
 * The decimal constructor for amounts that are only multiplied and added
 * (residue grams, line amounts, their running totals, the phases' weighted
 * terms): a `Wide` value on the left of `times` or `plus` gives an exact
 * result, no rounding to 20 digits. Quotients and roots keep `Dec`'s 20
 * digits: the engine divides with a `Dec` on the left (`ONE.div(x)`,
 * `reciprocal`), so no quotient is ever worked to 60 digits. A private clone
 * like `Dec`.
 *
 * @example
 * ```ts
 * new Wide("0.12345678901234567890").times("0.1").toString(); // "0.01234567890123456789" (exact, 21 digits)
 * ```
 */
export const Wide: Decimal.Constructor = Decimal.clone({ precision: WIDE_PRECISION, rounding: Decimal.ROUND_HALF_EVEN });

/** Largest number of cached conversions kept by `dec` and `wide` before a cache is emptied. */
const DEC_CACHE_LIMIT = 10_000;

/** A memoised conversion of JS numbers to decimals of one constructor (0 gives `ZERO`). */
function memoisedConversion(Ctor: Decimal.Constructor): (value: number) => Dec {
  const cache = new Map<number, Dec>();
  return (value) => {
    if (value === 0) return ZERO;
    let cached = cache.get(value);
    if (cached === undefined) {
      if (cache.size >= DEC_CACHE_LIMIT) cache.clear();
      cached = new Ctor(value);
      cache.set(value, cached);
    }
    return cached;
  };
}

/**
 * The decimal of a JS number, memoised: material constants (molar masses,
 * densities, fractions) recur on every call, and decimals are immutable, so
 * converting each distinct number once saves parsing it again.
 *
 * @example
 * ```ts
 * dec(208.329).times(2).toNumber(); // 416.658
 * ```
 */
export const dec: (value: number) => Dec = memoisedConversion(Dec);

/**
 * a ÷ b to `Dec`'s 20 digits whatever a's constructor: decimal.js works a
 * quotient to the precision of its left operand, and a `Wide` amount on the
 * left would cost a 60-digit quotient. Use it wherever the dividend may be
 * an amount (wide.test.ts watches every division the engine makes).
 *
 * @example
 * ```ts
 * quotient(wide(1), 3).toString(); // "0.33333333333333333333"
 * ```
 */
export function quotient(a: Dec, b: Dec | number): Dec {
  return (a.constructor === Wide ? new Dec(a) : a).div(b);
}

/**
 * The `Wide` decimal of a JS number, memoised like `dec` (a weight fraction
 * typed on the form recurs on every call). Products and sums with it on the
 * left are exact (see `Wide`).
 *
 * @example
 * ```ts
 * wide(0.25).times(dec(1).div(3)).toString(); // "0.0833333333333333333325" (exact: 0.25 × the 20-digit third)
 * ```
 */
export const wide: (value: number) => Dec = memoisedConversion(Wide);

const reciprocalCache = new Map<number, Dec>();

/**
 * 1 / value as a decimal, memoised like `dec`: dividing by a material
 * constant (a density, a molar mass, an assay) becomes a multiplication by
 * its reciprocal, which decimal.js does in under half the time of a division.
 * The reciprocal is rounded to the 20 significant digits of `Dec`, so the
 * product differs from the quotient by at most a unit in the 19th digit,
 * far below the 16 digits of the JS numbers the engine returns.
 *
 * @param value - a non-zero finite number
 * @example
 * ```ts
 * reciprocal(4).toNumber(); // 0.25
 * ```
 */
export function reciprocal(value: number): Dec {
  let cached = reciprocalCache.get(value);
  if (cached === undefined) {
    if (reciprocalCache.size >= DEC_CACHE_LIMIT) reciprocalCache.clear();
    cached = new Dec(1).div(value);
    reciprocalCache.set(value, cached);
  }
  return cached;
}

/**
 * value ÷ divisor for a divisor that is a material constant (plain number),
 * as value × reciprocal(divisor).
 *
 * @example
 * ```ts
 * per(new Dec(10), 2).toNumber(); // 5
 * ```
 */
export function per(value: Dec, divisor: number): Dec {
  return divisor === 1 ? value : value.times(reciprocal(divisor));
}

/**
 * a + b, returning the other operand when one is zero: running totals
 * (carried water, network atoms, sol mass) often add a zero, which
 * decimal.js would still copy and round.
 *
 * @example
 * ```ts
 * add(ZERO, new Dec(2)).toNumber(); // 2
 * ```
 */
export function add(a: Dec, b: Dec): Dec {
  if (b.isZero()) return a;
  return a.isZero() ? b : a.plus(b);
}

/**
 * value > 0, without parsing a literal 0 as decimal.js's `greaterThan(0)` does on every call.
 *
 * @example
 * ```ts
 * positive(new Dec(-1)); // false
 * ```
 */
export function positive(value: Dec): boolean {
  return !value.isZero() && value.isPositive();
}

/** Decimal zero (dimensionless). */
export const ZERO: Dec = new Dec(0);
/** Decimal one (dimensionless). */
export const ONE: Dec = new Dec(1);
/**
 * Decimal one half (dimensionless). x · HALF is the same decimal as x / 2
 * (both round the same exact half to 20 digits), and a multiplication costs
 * decimal.js less than a division.
 */
export const HALF: Dec = new Dec(0.5);

/**
 * Molar mass of water as a decimal, g/mol (see WATER_MOLAR_MASS_G_PER_MOL in
 * constants.ts: IUPAC/CIAAW 2021 abridged atomic weights, 2 × 1.008 + 15.999).
 */
export const WATER_MOLAR_MASS: Dec = new Dec(WATER_MOLAR_MASS_G_PER_MOL);

/** mol of water per g, 1 / WATER_MOLAR_MASS (for water carried by a material as supplied). */
export const WATER_MOL_PER_GRAM: Dec = new Dec(1).div(WATER_MOLAR_MASS_G_PER_MOL);

/**
 * value × factor, skipping the multiplication when the factor is 1 and
 * returning 0 when it is 0 or absent (factor as a plain number).
 *
 * @example
 * ```ts
 * timesFactor(new Dec(5), undefined).toNumber(); // 0
 * timesFactor(new Dec(5), 0.3).toNumber();       // 1.5
 * ```
 */
export function timesFactor(value: Dec, factor: number | undefined): Dec {
  if (factor === undefined || factor === 0) return ZERO;
  return factor === 1 ? value : value.times(dec(factor));
}

/**
 * value ÷ divisor, skipping the division when the divisor is 1 or absent
 * (e.g. an assay that defaults to 1).
 *
 * @example
 * ```ts
 * divideUnlessOne(new Dec(37), 0.37).toNumber(); // 100
 * ```
 */
export function divideUnlessOne(value: Dec, divisor: number | undefined): Dec {
  return divisor === undefined || divisor === 1 ? value : value.times(reciprocal(divisor));
}

/**
 * Cube root of a positive decimal: a double-precision first guess refined by
 * one Newton step in decimal arithmetic, x₁ = x₀ − (x₀³ − v) / (3 x₀²), which
 * doubles the ~16 correct digits of the guess past the 20 kept here. Much
 * cheaper than decimal.js's own cbrt. Zero gives zero.
 *
 * @example
 * ```ts
 * cubeRoot(new Dec(27)).toNumber(); // 3
 * ```
 */
export function cubeRoot(value: Dec): Dec {
  if (value.isZero()) return ZERO;
  const approximate = Math.cbrt(toNumber(value));
  // outside the range of a double: let decimal.js do the whole root
  if (!Number.isFinite(approximate) || approximate === 0) return new Dec(value).cbrt();
  const guess = new Dec(approximate);
  const square = guess.times(guess);
  return guess.minus(square.times(guess).minus(value).div(square.times(3)));
}

/**
 * Square root of a non-negative decimal: a double-precision first guess
 * refined by one Newton step in decimal arithmetic, x₁ = (x₀ + v / x₀) / 2,
 * which doubles the ~16 correct digits of the guess past the 20 kept here.
 * Much cheaper than decimal.js's own sqrt. Zero gives zero.
 *
 * @example
 * ```ts
 * squareRoot(new Dec(2)).toNumber(); // 1.4142135623730951
 * ```
 */
export function squareRoot(value: Dec): Dec {
  if (value.isZero()) return ZERO;
  const approximate = Math.sqrt(toNumber(value));
  // outside the range of a double: let decimal.js do the whole root
  if (!Number.isFinite(approximate) || approximate === 0) return new Dec(value).sqrt();
  const guess = new Dec(approximate);
  return guess.plus(quotient(value, guess)).times(HALF);
}
