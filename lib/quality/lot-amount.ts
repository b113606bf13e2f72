/**
 * Amounts of a batch line in the unit of the lot it takes from, and the mass
 * corrected for a lot's measured assay. Arithmetic in decimal.js; plain
 * numbers at full precision out (round only for display).
 */
import { Dec, toNumber } from "@/lib/formulation/decimal";
import type { LotUnit } from "@/lib/enums";

/**
 * A mass in g expressed in a lot's unit: g, kg, or (with the material's
 * density, g/mL = g/cm³) mL and L. Returns null when a volume unit is asked
 * for and the material has no density.
 *
 * @param grams - mass of the line, g
 * @param unit - the lot's unit
 * @param density - g/cm³ (= g/mL), needed only for mL and L
 * @example
 * ```ts
 * gramsInLotUnit(1500, "kg");        // 1.5
 * gramsInLotUnit(93.4, "mL", 0.934); // 100
 * ```
 */
export function gramsInLotUnit(grams: number, unit: LotUnit, density?: number | null): number | null {
  const g = new Dec(grams);
  switch (unit) {
    case "g":
      return toNumber(g);
    case "kg":
      return toNumber(g.div(1000));
    case "mL":
    case "L": {
      if (!density || density <= 0) return null;
      const ml = g.div(density);
      return toNumber(unit === "mL" ? ml : ml.div(1000));
    }
  }
}

/**
 * The mass of a line to weigh when its lot's measured assay replaces the
 * material's nominal one, so that the active amount stays the same:
 * mass × nominal assay / measured assay.
 *
 * @param grams - the line's target mass at the nominal assay, g
 * @param nominalAssay - the material's assay (mass fraction, 0–1]; 1 when not given
 * @param measuredAssay - the lot's measured assay (0–1]
 * @example
 * ```ts
 * correctedGrams(100, 0.98, 0.95); // 103.157894736842…
 * ```
 */
export function correctedGrams(grams: number, nominalAssay: number | undefined | null, measuredAssay: number): number {
  return toNumber(new Dec(grams).times(nominalAssay ?? 1).div(measuredAssay));
}
