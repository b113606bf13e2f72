import type { DecLine } from "./composition";
import { add, Dec, dec, positive, quotient, toNumber, ZERO } from "./decimal";
import type { IndexedMaterial } from "./material-index";
import type { CostResult, Notice } from "./result-types";

/** kg per g (exact): multiplying by it shifts the decimal point, no rounding. */
const KG_PER_G: Dec = new Dec("0.001");

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
 * @param perLitre - 1 / (sol volume in L), 1/L
 * @param coverageM2PerL - predicted coverage, when a coat is set
 * @returns the cost (or none) and notices
 * @example
 * ```ts
 * // 100 g TEOS at 40/kg + 50 g ethanol at 6/kg = 4.3
 * batchCost(lines, byId, dec(28.84), dec(1000).div(180)).cost?.total; // 4.3 (a 180 mL sol)
 * ```
 */
export function batchCost(
  lines: readonly DecLine[],
  byId: Map<string, IndexedMaterial>,
  solidMassGrams: Dec,
  perLitre: Dec,
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
  // total was Σ g · price per kg: the batch's cost is that / 1000 (an exact decimal shift)
  const perKgDry = quotient(total, solidMassGrams);
  total = total.times(KG_PER_G);
  const costPerLitre = total.times(perLitre);
  const cost: CostResult = {
    total: toNumber(total),
    perKgDry: toNumber(perKgDry),
    perLitreSol: toNumber(costPerLitre),
  };
  if (coverageM2PerL) cost.perM2 = toNumber(quotient(costPerLitre, coverageM2PerL));
  return { cost, notices: [] };
}
