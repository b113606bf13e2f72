import { CATALYST_RATIO_CAUTION } from "./constants";
import { Dec, ONE } from "./decimal";
import { compareSum, decimalSum } from "./sum-compare";
import type { Material } from "./material-schema";
import type { Notice } from "./result-types";

/** Tolerance on assay + water + solvent fractions = 1 (dimensionless). Common practice, no source. */
const BALANCE_TOLERANCE = 1e-9;
/** The largest stated sum (assay + water + solvent fractions) that leaves an unstated balance: 1 − BALANCE_TOLERANCE. */
const HIGHEST_UNBALANCED = new Dec(1).minus(BALANCE_TOLERANCE);

function percent(value: number): string {
  return `${Number((value * 100).toPrecision(4))} %`;
}

/**
 * Info notices for dispensed materials whose assay is below 1 with the
 * balance not stated (neither water nor solvent fractions make it up): the
 * rest is counted as inert, which is right for an impurity and wrong for
 * water or an alcohol the material carries.
 *
 * @param dispensed - materials with a recipe line, each with its "materials.N" path
 * @returns notices, possibly empty
 * @example
 * ```ts
 * assayBalanceNotices([{ material: { ...tmos, assay: 0.98 }, path: "materials.0" }]);
 * // [{ level: "info", code: "assay_balance_unstated", … "2 %" … }]
 * ```
 */
export function assayBalanceNotices(dispensed: readonly { material: Material; path: string }[]): Notice[] {
  const notices: Notice[] = [];
  for (const { material, path } of dispensed) {
    if (material.assay === undefined || material.assay >= 1) continue;
    // 1 − (assay + water + solvent) > tolerance, i.e. the stated fractions below 1 − tolerance (decided as the decimal sum decides)
    const fractions = [material.assay, material.waterFraction ?? 0, material.solventFraction ?? 0];
    if (compareSum(fractions, HIGHEST_UNBALANCED) >= 0) continue;
    const rest = ONE.minus(decimalSum(fractions));
    notices.push({
      level: "info",
      code: "assay_balance_unstated",
      field: `${path}.assay`,
      message:
        `${material.name}: assay ${percent(material.assay)}, and the other ${percent(rest.toNumber())} is not stated; ` +
        "it is counted as inert. If it is water or a solvent, enter its water or solvent fraction so that it counts.",
    });
  }
  return notices;
}

/**
 * A caution when the catalyst ratio exceeds CATALYST_RATIO_CAUTION mol per
 * mol network atom (likely a unit slip).
 *
 * @param molPerNetworkAtom - the catalyst ratio, mol/mol
 * @param name - the catalyst's name
 * @returns zero or one notice
 * @example
 * ```ts
 * catalystRatioNotices(10_000, "Hydrochloric acid, 37 wt%"); // [{ level: "caution", code: "catalyst_ratio_high", … }]
 * ```
 */
export function catalystRatioNotices(molPerNetworkAtom: number, name: string): Notice[] {
  if (molPerNetworkAtom <= CATALYST_RATIO_CAUTION) return [];
  return [
    {
      level: "caution",
      code: "catalyst_ratio_high",
      field: "catalyst.molPerNetworkAtom",
      message:
        `The catalyst ratio is ${Number(molPerNetworkAtom.toPrecision(4))} mol ${name} per mol network atom; acid and base catalysts ` +
        `are usually 0.001–0.1 mol/mol. Check the unit (mmol typed as mol, or a percentage typed as a fraction).`,
    },
  ];
}

/**
 * An info notice when weight fractions that summed to within 0.5 % of 1 were
 * scaled to 1.
 *
 * @param sum - the sum as entered
 * @returns zero or one notice
 * @example
 * ```ts
 * fractionsScaledNotice(new Dec(0.999)); // [{ code: "fractions_scaled", message: "…0.999…" }]
 * ```
 */
export function fractionsScaledNotice(sum: Dec): Notice[] {
  if (sum.minus(1).abs().lessThanOrEqualTo(1e-6)) return [];
  return [
    {
      level: "info",
      code: "fractions_scaled",
      field: "components",
      message: `The weight fractions summed to ${Number(sum.toPrecision(6))} (${percent(sum.toNumber())}); each was divided by that sum so that they add up to 1.`,
    },
  ];
}
