/**
 * Rounding a figure to what production can weigh or measure: masses to the
 * balance resolution, volumes to VOLUME_RESOLUTION_ML. Decimal arithmetic, so
 * 98.9247498288342 g at 0.01 g is exactly "98.92", never 98.92000000000002.
 */
import { Dec } from "@/lib/formulation/decimal";

/**
 * Volumes on a batch sheet, mL: 0.01 mL, finer than a graduated cylinder or a
 * pipette a production bench reads, so no reading is lost (common practice,
 * no source).
 */
export const VOLUME_RESOLUTION_ML = 0.01;

/**
 * Decimal places that show a resolution: 2 for 0.01 g, 0 for 1 g, 1 for 0.5 g.
 *
 * @example decimalPlaces(0.001) // 3
 */
export function decimalPlaces(resolution: number): number {
  if (!(resolution > 0) || !Number.isFinite(resolution)) return 2;
  return Math.max(0, new Dec(resolution).decimalPlaces());
}

/**
 * `value` rounded to the nearest multiple of `resolution` (half away from
 * zero), written with the resolution's decimal places.
 *
 * @param value - the figure, in its unit (g or mL)
 * @param resolution - the step, in the same unit (e.g. 0.01 g)
 * @example roundToResolution(98.9247498288342, 0.01) // "98.92"
 * @example roundToResolution(12.5, 0.1) // "12.5"
 * @example roundToResolution(3.14159, 0.05) // "3.15"
 */
export function roundToResolution(value: number, resolution: number): string {
  const places = decimalPlaces(resolution);
  if (!(resolution > 0) || !Number.isFinite(resolution)) return new Dec(value).toFixed(places, Dec.ROUND_HALF_UP);
  const rounded = new Dec(value).toNearest(resolution, Dec.ROUND_HALF_UP);
  const text = rounded.toFixed(places);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}
