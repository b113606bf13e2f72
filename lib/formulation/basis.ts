import { type Dec, dec, ONE, wide } from "./decimal";
import type { Basis } from "./input-schema";

/**
 * Dry composite mass S (g) fixed by the basis:
 * - solidMass: S = grams;
 * - solidsContent: S = x · sol mass;
 * - gelBody: S = ρb · V · (1 − s)³ (ρb g/cm³, V mL, s linear shrinkage, default 0).
 *
 * @param basis - the validated basis
 * @returns S in grams (decimal)
 * @example
 * ```ts
 * solidMassFromBasis({ type: "gelBody", volumeMl: 100, bulkDensity: 0.5, linearShrinkage: 0.1 }).toNumber();
 * // 0.5 × 100 × 0.9³ = 36.45
 * ```
 */
export function solidMassFromBasis(basis: Basis): Dec {
  switch (basis.type) {
    case "solidMass":
      return wide(basis.grams);
    case "solidsContent":
      return wide(basis.solidsFraction).times(dec(basis.solMassGrams));
    case "gelBody": {
      const remaining = ONE.minus(dec(basis.linearShrinkage ?? 0));
      return wide(basis.bulkDensity).times(dec(basis.volumeMl)).times(remaining.pow(3));
    }
  }
}
