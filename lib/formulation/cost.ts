import type { DecLine } from "./composition";
import { ML_PER_L } from "./constants";
import { add, type Dec, dec, positive, quotient, toNumber, ZERO } from "./decimal";
import type { IndexedMaterial } from "./material-index";
import type { CostResult, Notice } from "./result-types";

/** g per kg (exact). */
const G_PER_KG = 1000;

/**
 * Cost of the batch in the team's currency (chemistry: "What the coat will
 * be"): Σ mass as supplied [g] · price per kg / 1000 over every dispensed
 * line; per kg of dry composite, per litre of sol and, when a coat is
 * predicted, per m² at its coverage (per litre / m² per litre).
 * When no dispensed line has a price (the team keeps no prices) there is no
 * cost and nothing is said; when some have one and others not, no cost and
 * a notice naming the lines without a price.
 *
 * @param lines - the recipe lines (decimal)
 * @param byId - the indexed materials
 * @param solidMassGrams - S, g of dry composite
 * @param solVolumeMl - sol volume, mL
 * @param coverageM2PerL - predicted coverage, when a coat is set
 * @returns the cost (or none) and notices
 * @example
 * ```ts
 * // 100 g TEOS at 40/kg + 50 g ethanol at 6/kg = 4.3
 * batchCost(lines, byId, dec(28.84), dec(180)).cost?.total; // 4.3
 * ```
 */
export function batchCost(
  lines: readonly DecLine[],
  byId: Map<string, IndexedMaterial>,
  solidMassGrams: Dec,
  solVolumeMl: Dec,
  coverageM2PerL?: Dec,
): { cost?: CostResult; notices: Notice[] } {
  let total = ZERO;
  let priced = 0;
  const unpriced: IndexedMaterial[] = [];
  for (const line of lines) {
    if (!positive(line.massGrams)) continue;
    const entry = byId.get(line.materialId);
    if (!entry) continue;
    const price = entry.material.pricePerKg;
    if (price === undefined) {
      if (!unpriced.includes(entry)) unpriced.push(entry);
      continue;
    }
    priced += 1;
    total = add(total, line.massGrams.times(dec(price)));
  }
  if (priced === 0) return { notices: [] };
  if (unpriced.length > 0) {
    unpriced.sort((a, b) => a.index - b.index); // in the order of the materials list
    return {
      notices: [
        {
          level: "info",
          code: "cost_prices_missing",
          field: `${unpriced[0]!.path}.pricePerKg`,
          message: `No cost is given because ${unpriced.map((e) => e.material.name).join(", ")} ${unpriced.length === 1 ? "has" : "have"} no price per kg; add the price to the material.`,
        },
      ],
    };
  }
  total = quotient(total, G_PER_KG);
  const perLitre = quotient(total.times(ML_PER_L), solVolumeMl);
  const cost: CostResult = {
    total: toNumber(total),
    perKgDry: toNumber(quotient(total.times(G_PER_KG), solidMassGrams)),
    perLitreSol: toNumber(perLitre),
  };
  if (coverageM2PerL) cost.perM2 = toNumber(perLitre.div(coverageM2PerL));
  return { cost, notices: [] };
}
