import Decimal from "decimal.js";

/**
 * The decimal constructor used by every engine computation: 20 significant
 * digits, banker's rounding. A private clone, so that global changes to
 * decimal.js settings elsewhere in the application cannot alter results.
 *
 * @example
 * ```ts
 * new Dec(0.1).plus(0.2).toNumber(); // 0.3
 * ```
 */
export const Dec: Decimal.Constructor = Decimal.clone({ precision: 20, rounding: Decimal.ROUND_HALF_EVEN });

/** A decimal value produced by `Dec`. */
export type Dec = Decimal;

/** Largest number of cached conversions kept by `dec` before the cache is emptied. */
const DEC_CACHE_LIMIT = 10_000;
const decCache = new Map<number, Dec>();

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
export function dec(value: number): Dec {
  if (value === 0) return ZERO;
  let cached = decCache.get(value);
  if (cached === undefined) {
    if (decCache.size >= DEC_CACHE_LIMIT) decCache.clear();
    cached = new Dec(value);
    decCache.set(value, cached);
  }
  return cached;
}

/** A divisor as used by `divideBy`: the divisor itself, or a one-word multiple of it and the power of ten between them. */
interface Divisor {
  /** The divisor × 10^k, an integer below 1e7 when `power` is set. */
  readonly scaled: Dec;
  /** 10^k, when the divisor was scaled. */
  readonly power?: Dec;
}

/** Largest number of divisors kept by `divideBy` before the cache is emptied. */
const DIVISOR_CACHE_LIMIT = 10_000;
const divisorCache = new Map<number, Divisor>();

/** A divisor of at most 7 significant digits that spans two digit words (e.g. 2.2 or 60.083), scaled to one word. */
function makeDivisor(divisor: number): Divisor {
  const exact = dec(divisor);
  const words = exact.d as readonly number[] | null;
  if (!words || words.length < 2) return { scaled: exact };
  const digits = exact.sd();
  if (digits > 7) return { scaled: exact };
  // exact × 10^k is an integer of `digits` digits, below 1e7: one digit word
  const power = new Dec(`1e${digits - 1 - exact.e}`);
  const scaled = exact.times(power);
  return (scaled.d as readonly number[]).length === 1 ? { scaled, power } : { scaled: exact };
}

/**
 * value ÷ divisor (divisor as a plain number, e.g. a density or molar mass),
 * with exactly the result of `value.div(dec(divisor))`, but faster when the
 * divisor has both integer and fraction digits (2.2, 60.083, 18.015):
 * decimal.js stores such a number in two digit words (base 1e7) and divides
 * by it with long division, while a divisor of one word takes a short loop.
 * So the value is divided by divisor × 10^k (e.g. 22, 60083, 18015; one
 * word) and the quotient multiplied by 10^k. Both steps are exact up to the
 * final rounding to 20 significant digits, which is the same in both
 * (rounding to significant digits does not depend on a power-of-ten scale,
 * and the multiplication by 10^k only moves the decimal point).
 *
 * @example
 * ```ts
 * divideBy(new Dec(1), 2.2).toString(); // "0.45454545454545454545", as new Dec(1).div(2.2)
 * ```
 */
export function divideBy(value: Dec, divisor: number): Dec {
  let entry = divisorCache.get(divisor);
  if (entry === undefined) {
    if (divisorCache.size >= DIVISOR_CACHE_LIMIT) divisorCache.clear();
    entry = makeDivisor(divisor);
    divisorCache.set(divisor, entry);
  }
  return entry.power === undefined ? value.div(entry.scaled) : value.div(entry.scaled).times(entry.power);
}

/** Decimal zero (dimensionless). */
export const ZERO: Dec = new Dec(0);
/** Decimal one (dimensionless). */
export const ONE: Dec = new Dec(1);

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
  return divisor === undefined || divisor === 1 ? value : divideBy(value, divisor);
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
  const approximate = Math.cbrt(value.toNumber());
  // outside the range of a double: let decimal.js do the whole root
  if (!Number.isFinite(approximate) || approximate === 0) return value.cbrt();
  const guess = new Dec(approximate);
  const square = guess.times(guess);
  return guess.minus(square.times(guess).minus(value).div(square.times(3)));
}

/**
 * Converts a decimal to the nearest JS number, correctly rounded from its
 * exact decimal value: the same number as `Number(value.toString())`, but
 * read from the digit words (base 1e7) as "digits e exponent", without the
 * formatting of `toString`; about twice as fast as `Decimal#toNumber`.
 * Zero gives +0, as `Number("0")` does.
 *
 * @example
 * ```ts
 * toNumber(new Dec("0.1")); // 0.1
 * ```
 */
export function toNumber(value: Dec): number {
  const words = value.d as readonly number[] | null;
  // NaN and ±Infinity have no digit words
  if (!words) return Number(value.toString());
  const first = words[0] as number;
  if (first === 0) return 0;
  let digits = String(first);
  for (let i = 1; i < words.length; i += 1) {
    const word = words[i] as number;
    // every word after the first stands for exactly 7 digits
    digits += word < 1e6 ? String(word + 1e7).slice(1) : String(word);
  }
  // value.e is the exponent of the leading digit
  const magnitude = Number(`${digits}e${value.e + 1 - digits.length}`);
  return value.s < 0 ? -magnitude : magnitude;
}
