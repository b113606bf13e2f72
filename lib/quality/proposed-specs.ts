/**
 * Specifications Gelwright can propose from a revision's computed result:
 * solids content by gravimetry, sol density, expected dry film thickness at
 * the set coating, and VOC. Target = the computed figure; limits ±10 % of it
 * (common practice for a first specification, no source), editable by the
 * formulator. Pure: runs in the browser and on the server.
 */
import Decimal from "decimal.js";
import type { FormulationResult } from "@/lib/formulation";
import type { Specification } from "./specification";

/** Default half-width of the proposed limits: ±10 % of the target (common practice, no source). */
export const PROPOSED_LIMIT_FRACTION = 0.1;

/** Stable keys of the proposed properties, so the editor can tell which ones a revision already has. */
export const PROPOSED_PROPERTIES = {
  solids: "Solids content (gravimetric)",
  density: "Sol density",
  dryThickness: "Dry film thickness",
  voc: "VOC content",
} as const;

function limits(target: Decimal, fraction: number): { target: number; lower: number; upper: number } {
  const half = target.abs().times(fraction);
  return { target: target.toNumber(), lower: target.minus(half).toNumber(), upper: target.plus(half).toNumber() };
}

/**
 * The specifications computable from `result` (none when the result is
 * missing). Each gets a fresh id from `newId`.
 *
 * @example
 * proposedSpecifications(result).map((s) => s.property)
 * // ["Solids content (gravimetric)", "Sol density", "Dry film thickness", "VOC content"]
 */
export function proposedSpecifications(
  result: FormulationResult | null | undefined,
  newId: () => string = () => crypto.randomUUID(),
  fraction: number = PROPOSED_LIMIT_FRACTION,
): Specification[] {
  if (!result) return [];
  const out: Specification[] = [];
  const base = { numeric: true, requirement: null, origin: "computed" as const };
  const solids = new Decimal(result.sol.solidsFraction).times(100);
  if (solids.gt(0)) {
    out.push({
      id: newId(),
      property: PROPOSED_PROPERTIES.solids,
      method:
        "Non-volatile content by weighing, e.g. 105 °C for 1 h (ISO 3251). A sol loses alcohol, water and condensation water on drying and may keep some organic groups, so the measured figure differs from the ideal dry-oxide figure computed here: set the target from the first good batches.",
      unit: "% w/w",
      ...base,
      ...limits(solids, fraction),
    });
  }
  if (result.sol.volumeMl > 0) {
    const density = new Decimal(result.sol.massGrams).div(result.sol.volumeMl);
    out.push({
      id: newId(),
      property: PROPOSED_PROPERTIES.density,
      method: "Pycnometer or density meter at 20 °C (ISO 2811). Computed as sol mass / sol volume with ideal mixing, an approximation.",
      unit: "g/cm³",
      ...base,
      ...limits(density, fraction),
    });
  }
  if (result.coating && result.coating.dryThicknessNm > 0) {
    out.push({
      id: newId(),
      property: PROPOSED_PROPERTIES.dryThickness,
      method: "Ellipsometry or profilometer on a coated witness substrate, after the cure, at the revision's coating settings.",
      unit: "nm",
      ...base,
      ...limits(new Decimal(result.coating.dryThicknessNm), fraction),
    });
  }
  if (result.voc && result.voc.gramsPerLitre > 0) {
    out.push({
      id: newId(),
      property: PROPOSED_PROPERTIES.voc,
      method: "Computed from the recipe (EU 2004/42/EC definition); confirm by ISO 11890-2 when required.",
      unit: "g/L",
      ...base,
      ...limits(new Decimal(result.voc.gramsPerLitre), fraction),
    });
  }
  return out;
}
