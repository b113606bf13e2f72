import type Decimal from "decimal.js";

/** 2²⁷ + 1, the constant that splits a double into two halves of 26 bits (Veltkamp). */
const SPLITTER = 134_217_729;
/** Exact powers of ten as doubles: 10⁰ … 10²² (5²² < 2⁵³). */
const POWERS_OF_TEN: readonly number[] = Array.from({ length: 23 }, (_, k) => 10 ** k);
/** Most digit words (base 1e7) whose integer fits a double-double exactly: 4 words, < 10²⁸ < 2¹⁰⁶. */
const MAX_WORDS = 4;
/** Bound on the relative error of the double-double result, far above its true ~2⁻¹⁰² (see `toNumber`). */
const RELATIVE_ERROR = 2 ** -96;
/**
 * Bound on the relative error when only the first 4 of more words are read:
 * those 4 words hold at least 22 digits, so the words left out add less than
 * 10⁻²¹ of the value; 2 · 10⁻²¹ covers that and the double-double's own error.
 */
const TRUNCATED_ERROR = 2e-21;
/** Results kept well inside the normal range of doubles; beyond, the string path decides. */
const SMALLEST = 1e-290;
const LARGEST = 1e290;

/** The rounding error of the product a · b (exactly a · b − fl(a · b)), by Dekker's two-product. */
function productError(a: number, b: number, product: number): number {
  let c = SPLITTER * a;
  const aHigh = c - (c - a);
  const aLow = a - aHigh;
  c = SPLITTER * b;
  const bHigh = c - (c - b);
  const bLow = b - bHigh;
  return aHigh * bHigh - product + aHigh * bLow + aLow * bHigh + aLow * bLow;
}

/** Number of decimal digits of a word 1 … 9,999,999. */
function digitCount(word: number): number {
  if (word >= 1e4) return word >= 1e6 ? 7 : word >= 1e5 ? 6 : 5;
  return word >= 1e3 ? 4 : word >= 100 ? 3 : word >= 10 ? 2 : 1;
}

/** The string path: the digit words (base 1e7) written out as "digits e exponent" and parsed. */
function viaString(words: readonly number[], exponent: number, negative: boolean): number {
  let digits = String(words[0]);
  for (let i = 1; i < words.length; i += 1) {
    const word = words[i] as number;
    // every word after the first stands for exactly 7 digits
    digits += word < 1e6 ? String(word + 1e7).slice(1) : String(word);
  }
  const magnitude = Number(`${digits}e${exponent + 1 - digits.length}`);
  return negative ? -magnitude : magnitude;
}

/**
 * Converts a decimal to the nearest JS number, correctly rounded from its
 * exact decimal value: the same number as `Number(value.toString())`.
 * Up to 14 digits with a power of ten up to 10²²: D and the power are exact
 * doubles, and one IEEE multiplication or division rounds correctly
 * (W. D. Clinger, "How to read floating point numbers accurately", PLDI
 * 1990). Otherwise, for results inside the normal range: the digits D of the first
 * 4 words (up to 28 digits) as an exact double-double (hi + lo, by exact
 * products and sums), times or divided by exact powers of ten in
 * double-double arithmetic, whose result s + t lies within 2⁻⁹⁶ · |s| of the
 * value those words give; words beyond the fourth (a `Wide` amount) add
 * less than 10⁻²¹ of it, so the bound becomes 2 · 10⁻²¹ · |s|. s is the
 * nearest double to s + t; when s + t ± the bound both still round to s, so
 * does every value between them, the exact one included (rounding is
 * monotonic). Otherwise (a value within the bound of a point halfway between
 * two doubles, a far exponent) the digits are written out and parsed.
 * Zero gives +0, as `Number("0")` does.
 *
 * @example
 * ```ts
 * toNumber(new Dec("0.1")); // 0.1
 * toNumber(new Dec(1).div(3)); // 0.3333333333333333
 * ```
 */
export function toNumber(value: Decimal): number {
  const words = value.d as readonly number[] | null;
  // NaN and ±Infinity have no digit words
  if (!words) return Number(value.toString());
  const first = words[0] as number;
  if (first === 0) return 0;
  const negative = value.s < 0;
  if (words.length <= 2) {
    // up to 14 digits: D < 10¹⁴ is an exact double, and so is 10^|scale| for |scale| ≤ 22, so one
    // IEEE multiplication or division gives the correctly rounded result (Clinger's fast path)
    const digits = words.length === 1 ? first : first * 1e7 + (words[1] as number);
    const shift = value.e + 1 - digitCount(first) - 7 * (words.length - 1);
    if (shift >= -22 && shift <= 22) {
      const magnitude = shift >= 0 ? digits * (POWERS_OF_TEN[shift] as number) : digits / (POWERS_OF_TEN[-shift] as number);
      return negative ? -magnitude : magnitude;
    }
  }
  const truncated = words.length > MAX_WORDS;
  const count = truncated ? MAX_WORDS : words.length;
  // D = the digits as an integer, hi + lo exactly; D · 10^scale is the value
  let hi = first;
  let lo = 0;
  for (let i = 1; i < count; i += 1) {
    const product = hi * 1e7;
    // hi · 1e7 + lo · 1e7 + word: the error and the lower terms are integers far below 2⁵³
    const rest = productError(hi, 1e7, product) + lo * 1e7 + (words[i] as number);
    hi = product + rest;
    lo = rest - (hi - product);
  }
  let scale = value.e + 1 - digitCount(first) - 7 * (count - 1);
  if (scale > 22 || scale < -44) return viaString(words, value.e, negative);
  if (scale > 0) {
    const power = POWERS_OF_TEN[scale] as number;
    const product = hi * power;
    const rest = productError(hi, power, product) + lo * power;
    hi = product + rest;
    lo = rest - (hi - product);
  }
  while (scale < 0) {
    const power = POWERS_OF_TEN[Math.min(-scale, 22)] as number;
    scale += Math.min(-scale, 22);
    // (hi + lo) / power: the quotient of hi, then the exact remainder hi − q · power (Sterbenz), plus lo, divided again
    const quotient = hi / power;
    const back = quotient * power;
    const remainder = hi - back - productError(quotient, power, back) + lo;
    const correction = remainder / power;
    hi = quotient + correction;
    lo = correction - (hi - quotient);
  }
  const magnitude = Math.abs(hi);
  if (!(magnitude > SMALLEST && magnitude < LARGEST)) return viaString(words, value.e, negative);
  const error = magnitude * (truncated ? TRUNCATED_ERROR : RELATIVE_ERROR);
  if (hi + (lo + error) !== hi || hi + (lo - error) !== hi) return viaString(words, value.e, negative);
  return negative ? -hi : hi;
}
