/**
 * Epoxy–amine balance in plain float64: the numeric twin of cure.ts
 * (cureBalance), the ratio only, no notices.
 */
import type { Material } from "../material-schema";
import type { NumericLine } from "./context";
import { coatMaterialData } from "./coat-material";

/**
 * r = amine-H eq / epoxy eq over every line whose material has an EEW or an
 * AHEW (Lee & Neville, Handbook of Epoxy Resins, 1967); eq = active mass /
 * equivalent weight, active mass = the organic phase's dry mass, else mass
 * × assay. NaN when no line has an equivalent weight or there is no epoxy,
 * where cure.ts gives no ratio.
 *
 * @param lines - the recipe lines
 * @param byId - the materials by id
 * @returns r, dimensionless, or NaN
 * @example
 * ```ts
 * // GPTMS 23.634 g (EEW 236.339) + APTES 11.069 g (AHEW 110.686) → 0.1 eq each
 * numericCureRatio(lines, byId); // 1
 * ```
 */
export function numericCureRatio(lines: readonly NumericLine[], byId: ReadonlyMap<string, Material>): number {
  let epoxy = 0;
  let amine = 0;
  for (const line of lines) {
    const material = byId.get(line.materialId);
    if (!material) continue;
    const data = coatMaterialData(material);
    if (!data.curing) continue;
    const active = line.role === "organic" && line.residueGrams !== 0 ? line.residueGrams : line.massGrams * data.assayFactor;
    epoxy += active * data.epoxyPerGram;
    amine += active * data.aminePerGram;
  }
  return epoxy > 0 ? amine / epoxy : Number.NaN;
}
