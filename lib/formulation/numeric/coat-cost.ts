/**
 * Cost of the batch in plain float64: the numeric twin of cost.ts
 * (batchCost), figures only, no notices.
 */
import { ML_PER_L } from "../constants";
import type { Material } from "../material-schema";
import type { NumericLine } from "./context";
import { coatMaterialData } from "./coat-material";

/** g per kg (exact). */
const G_PER_KG = 1000;

/** The cost figures in the team's currency; all NaN when cost.ts gives no cost. */
export interface NumericCost {
  costTotal: number;
  /** per kg of dry composite */
  costPerKgDry: number;
  /** per litre of sol */
  costPerLitreSol: number;
  /** per m² at the predicted coverage; NaN without a coat */
  costPerM2: number;
}

const ABSENT: NumericCost = { costTotal: Number.NaN, costPerKgDry: Number.NaN, costPerLitreSol: Number.NaN, costPerM2: Number.NaN };

/**
 * Σ mass as supplied [g] · price per kg / 1000 over every dispensed line
 * (mass > 0); per kg dry, per litre of sol and per m² (per litre / coverage).
 * No cost (NaN) when no line is priced or any dispensed line lacks a price.
 *
 * @param lines - the recipe lines
 * @param byId - the materials by id
 * @param solidMassGrams - S, g of dry composite
 * @param solVolumeMl - sol volume, mL
 * @param coverageM2PerL - predicted coverage, NaN without a coat
 * @returns the cost figures
 * @example
 * ```ts
 * // 100 g TEOS at 40/kg + 50 g ethanol at 6/kg = 4.3
 * numericCost(lines, byId, 28.84, 180, Number.NaN).costTotal; // 4.3
 * ```
 */
export function numericCost(
  lines: readonly NumericLine[],
  byId: ReadonlyMap<string, Material>,
  solidMassGrams: number,
  solVolumeMl: number,
  coverageM2PerL: number,
): NumericCost {
  let total = 0;
  let priced = 0;
  for (const line of lines) {
    if (!(line.massGrams > 0)) continue;
    const material = byId.get(line.materialId);
    if (!material) continue;
    const price = coatMaterialData(material).pricePerKg;
    if (Number.isNaN(price)) return ABSENT;
    priced += 1;
    total += line.massGrams * price;
  }
  if (priced === 0) return ABSENT;
  total /= G_PER_KG;
  const perLitre = (total * ML_PER_L) / solVolumeMl;
  return {
    costTotal: total,
    costPerKgDry: (total * G_PER_KG) / solidMassGrams,
    costPerLitreSol: perLitre,
    costPerM2: Number.isNaN(coverageM2PerL) ? Number.NaN : perLitre / coverageM2PerL,
  };
}
