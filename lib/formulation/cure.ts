import type { DecLine } from "./composition";
import { CURE_RATIO_RANGE } from "./constants";
import { add, type Dec, quotient, reciprocal, timesFactor, toNumber, ZERO } from "./decimal";
import type { IndexedMaterial } from "./material-index";
import type { CureResult, Notice } from "./result-types";

/**
 * Active mass of a line, g: the organic phase's dry mass, else the mass as
 * supplied times its assay (mol · M for a precursor or a dosed reagent).
 */
function activeGrams(line: DecLine, assay: number | undefined): Dec {
  if (line.role === "organic" && line.residueGrams) return line.residueGrams;
  return assay === undefined || assay === 1 ? line.massGrams : timesFactor(line.massGrams, assay);
}

/**
 * Epoxy–amine balance (chemistry: "What the coat will be"; Lee & Neville,
 * Handbook of Epoxy Resins, 1967): equivalents = active mass / equivalent
 * weight over every dispensed line whose material has an epoxy equivalent
 * weight (EEW, g/eq) or an amine hydrogen equivalent weight (AHEW, g/eq);
 * r = amine-H eq / epoxy eq. A caution when both groups are present and r
 * is outside 0.8–1.2. Nothing when neither is present.
 *
 * @param lines - the recipe lines (decimal)
 * @param byId - the indexed materials
 * @returns the balance (or none) and its notices
 * @example
 * ```ts
 * // GPTMS 23.634 g (EEW 236.339) + APTES 11.069 g (AHEW 110.686) → 0.1 eq each, r = 1
 * cureBalance(lines, byId).cure?.ratio; // 1
 * ```
 */
export function cureBalance(lines: readonly DecLine[], byId: Map<string, IndexedMaterial>): { cure?: CureResult; notices: Notice[] } {
  let epoxy = ZERO;
  let amine = ZERO;
  let any = false;
  for (const line of lines) {
    const material = byId.get(line.materialId)?.material;
    if (!material) continue;
    const eew = material.epoxyEquivalentWeight;
    const ahew = material.amineHydrogenEquivalentWeight;
    if (eew === undefined && ahew === undefined) continue;
    any = true;
    const active = activeGrams(line, material.assay);
    if (eew !== undefined) epoxy = add(epoxy, active.times(reciprocal(eew)));
    if (ahew !== undefined) amine = add(amine, active.times(reciprocal(ahew)));
  }
  if (!any) return { notices: [] };
  const cure: CureResult = { epoxyEq: toNumber(epoxy), amineHydrogenEq: toNumber(amine) };
  const notices: Notice[] = [];
  if (epoxy.greaterThan(0)) {
    const ratio = quotient(amine, epoxy);
    cure.ratio = toNumber(ratio);
    if (amine.greaterThan(0) && (ratio.lessThan(CURE_RATIO_RANGE.min) || ratio.greaterThan(CURE_RATIO_RANGE.max))) {
      notices.push({
        level: "caution",
        code: "epoxy_amine_unbalanced",
        field: "components",
        message:
          `Amine hydrogens and epoxy groups are in the ratio ${toNumber(ratio).toFixed(2)} : 1, outside ${CURE_RATIO_RANGE.min}–${CURE_RATIO_RANGE.max}: ` +
          `${ratio.lessThan(1) ? "epoxy groups will be left unreacted" : "amine will be left unreacted"}, and the cured network ` +
          `is softer and less resistant than at a balanced ratio.`,
      });
    }
  }
  return { cure, notices };
}
