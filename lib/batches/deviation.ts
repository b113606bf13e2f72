/**
 * A weighed line's deviation from its target and the tolerance check.
 * Arithmetic in decimal.js; plain numbers at full precision out (round only
 * for display).
 */
import { Dec, toNumber } from "@/lib/formulation/decimal";

/** Team default for the relative tolerance on a weighed line: ±1 % (common practice, no source). */
export const DEFAULT_TOLERANCE_FRACTION = 0.01;
/** Default balance readability, g: a two-decimal laboratory balance (same as lib/format.ts). */
export const DEFAULT_BALANCE_RESOLUTION_G = 0.01;

/** A line's deviation from target. */
export interface LineDeviation {
  /** actual − target, g. */
  absoluteGrams: number;
  /** (actual − target) / target (0.01 = +1 %); null when the target is 0. */
  relative: number | null;
  /** The allowed |actual − target|, g: max(tolerance × target, balance resolution). */
  toleranceGrams: number;
  /** True when |actual − target| is beyond the tolerance. */
  outside: boolean;
}

/**
 * Deviation of an actual mass from its target, and whether it is beyond the
 * tolerance: |actual − target| > max(toleranceFraction × target, resolution).
 *
 * @param targetGrams - g as supplied, from the recipe
 * @param actualGrams - g weighed
 * @param toleranceFraction - relative tolerance (0.01 = ±1 %)
 * @param resolutionGrams - balance readability, g
 * @example
 * ```ts
 * lineDeviation(34.67, 35.0, 0.01, 0.01);
 * // { absoluteGrams: 0.33, relative: 0.0095183…, toleranceGrams: 0.3467, outside: false }
 * ```
 */
export function lineDeviation(targetGrams: number, actualGrams: number, toleranceFraction: number, resolutionGrams: number): LineDeviation {
  const target = new Dec(targetGrams);
  const diff = new Dec(actualGrams).minus(target);
  const byFraction = target.times(toleranceFraction).abs();
  const resolution = new Dec(resolutionGrams);
  const tolerance = byFraction.greaterThan(resolution) ? byFraction : resolution;
  return {
    absoluteGrams: toNumber(diff),
    relative: target.isZero() ? null : toNumber(diff.div(target)),
    toleranceGrams: toNumber(tolerance),
    outside: diff.abs().greaterThan(tolerance),
  };
}
