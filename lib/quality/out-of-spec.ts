/**
 * Whether a test result meets its specification. Limits are inclusive: a
 * value equal to the lower or the upper limit meets it (common practice, no
 * source). Pure.
 */
import type { Specification } from "./specification";

/**
 * True when a numeric value lies outside [lower, upper] (a missing limit does not bound).
 *
 * @example
 * isOutOfSpec({ lower: 1, upper: 2 }, 2) // false
 * isOutOfSpec({ lower: 1, upper: 2 }, 2.0001) // true
 */
export function isOutOfSpec(spec: Pick<Specification, "lower" | "upper">, value: number): boolean {
  if (spec.lower !== null && value < spec.lower) return true;
  if (spec.upper !== null && value > spec.upper) return true;
  return false;
}
