import { type Dec, dec, toNumber, ZERO } from "./decimal";

/**
 * The decimal sum of plain numbers, each taken as `dec(value)`, added in
 * order with the 20 significant digits of `Dec`.
 *
 * @example
 * ```ts
 * decimalSum([0.1, 0.2]).toNumber(); // 0.3 (the float sum would be 0.30000000000000004)
 * ```
 */
export function decimalSum(values: readonly number[]): Dec {
  let sum = ZERO;
  for (const value of values) sum = sum.plus(dec(value));
  return sum;
}

/**
 * The sign of Σ values − bound, with the sum taken as `decimalSum(values)`:
 * −1, 0 or 1, always the sign the decimal sum gives. The float sum decides
 * when it lies farther from the bound than its error can reach; only a sum
 * within that error of the bound is added up in decimals. The float sum
 * errs from the decimal one by less than (n + 2) · 2⁻⁵² · (Σ|v| + |bound|):
 * each number differs from its shortest decimal form by at most 2⁻⁵³ of
 * itself, the n − 1 float additions by 2⁻⁵³ of Σ|v| each, and the 20-digit
 * decimal additions by far less; the margin used is twice that.
 *
 * @param values - plain numbers (fractions, weight fractions …)
 * @param bound - the decimal to compare the sum with
 * @returns −1 when the sum is below the bound, 0 when equal, 1 when above
 * @example
 * ```ts
 * compareSum([0.333, 0.333, 0.333], dec(0.995)); // 1 (0.999 > 0.995)
 * compareSum([0.1, 0.2], dec(0.3));              // 0 (decimals: 0.1 + 0.2 = 0.3 exactly)
 * ```
 */
export function compareSum(values: readonly number[], bound: Dec): -1 | 0 | 1 {
  let sum = 0;
  let size = 0;
  for (const value of values) {
    sum += value;
    size += Math.abs(value);
  }
  const boundValue = toNumber(bound);
  const margin = 2 * (values.length + 2) * Number.EPSILON * (size + Math.abs(boundValue));
  const difference = sum - boundValue;
  // NaN or infinite values leave the decision to the decimals
  if (difference > margin && Number.isFinite(difference)) return 1;
  if (difference < -margin && Number.isFinite(difference)) return -1;
  return decimalSum(values).comparedTo(bound) as -1 | 0 | 1;
}
