import { Dec, quotient } from "./decimal";
import type { Basis } from "./input-schema";
import type { Notice } from "./result-types";

/** Relative tolerance for "the sol matches the basis" (dimensionless). Common practice, no source. */
const BASIS_MATCH_TOLERANCE = 1e-9;

function show(value: Dec | number): string {
  return String(Number(new Dec(value).toPrecision(5)));
}

/**
 * Notices when the sol does not match what the basis fixes and no solvent
 * fill adjusts it: a solids-content basis whose sol mass differs (caution), a
 * gel-body target whose reagents do not fit the mould (error) or do not fill
 * it (caution).
 *
 * @param p - basis, whether a fill is used, sol mass (g), sol volume (mL), dry mass S (g)
 * @returns notices, possibly empty
 * @example
 * ```ts
 * basisNotices({ basis: { type: "gelBody", volumeMl: 10, bulkDensity: 1 }, fill: false,
 *   solMassGrams: new Dec(20), solVolumeMl: new Dec(25), solidMassGrams: new Dec(10) });
 * // [{ level: "error", code: "gel_body_does_not_fit", field: "basis.volumeMl", … }]
 * ```
 */
export function basisNotices(p: {
  basis: Basis;
  fill: boolean;
  solMassGrams: Dec;
  solVolumeMl: Dec;
  solidMassGrams: Dec;
}): Notice[] {
  if (p.fill) return [];
  const basis = p.basis;
  if (basis.type === "solidsContent") {
    const target = new Dec(basis.solMassGrams);
    if (p.solMassGrams.minus(target).abs().greaterThan(target.times(BASIS_MATCH_TOLERANCE))) {
      return [
        {
          level: "caution",
          code: "sol_mass_differs_from_basis",
          field: "basis.solMassGrams",
          message:
            `The sol weighs ${show(p.solMassGrams)} g, not the ${show(target)} g of the basis, so its solids content is ` +
            `${show(quotient(p.solidMassGrams, p.solMassGrams))} instead of ${show(basis.solidsFraction)}. Use a solvent fill to match the basis.`,
        },
      ];
    }
  }
  if (basis.type === "gelBody") {
    const mould = new Dec(basis.volumeMl);
    const excess = p.solVolumeMl.minus(mould);
    if (excess.greaterThan(mould.times(BASIS_MATCH_TOLERANCE))) {
      return [
        {
          level: "error",
          code: "gel_body_does_not_fit",
          field: "basis.volumeMl",
          message:
            `The reagents take ${show(p.solVolumeMl)} mL, more than the ${show(mould)} mL mould: this gel-body target cannot be reached. ` +
            "Lower the bulk density or the solvent ratio, or use a larger mould.",
        },
      ];
    }
    if (excess.negated().greaterThan(mould.times(BASIS_MATCH_TOLERANCE))) {
      return [
        {
          level: "caution",
          code: "sol_below_mould_volume",
          field: "basis.volumeMl",
          message:
            `The sol takes ${show(p.solVolumeMl)} mL, less than the ${show(mould)} mL mould, so the gel body will be smaller and denser than targeted. ` +
            "Use a solvent fill to make the sol up to the mould volume.",
        },
      ];
    }
  }
  return [];
}
