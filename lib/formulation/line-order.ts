import type { LineRole, RecipeLine } from "./result-types";

/** Default order of addition: precursors, modifiers (before any water), organics, solvent, water, catalyst. */
const ROLE_ORDER: Record<LineRole, number> = { precursor: 0, modifier: 1, organic: 2, solvent: 3, water: 4, catalyst: 5 };

/**
 * Orders recipe lines for addition: by their position in `additionOrder`
 * when listed there, the others after them in the default order
 * (precursors, modifiers, organics, solvent, water, catalyst; components in input order).
 * The sort is stable.
 *
 * @param lines - recipe lines, components in input order
 * @param additionOrder - material ids in the wanted order, optional
 * @returns a new, ordered array
 * @example
 * ```ts
 * orderLines(lines, ["ethanol", "hcl-37"]).map((l) => l.materialId);
 * // ["ethanol", "hcl-37", "teos", "water-di"]
 * ```
 */
export function orderLines(lines: readonly RecipeLine[], additionOrder?: readonly string[]): RecipeLine[] {
  const position = new Map<string, number>();
  additionOrder?.forEach((id, index) => {
    if (!position.has(id)) position.set(id, index);
  });
  const unlisted = additionOrder ? additionOrder.length : 0;
  return lines
    .map((line, index) => ({ line, index }))
    .sort((a, b) => {
      const pa = position.get(a.line.materialId) ?? unlisted + ROLE_ORDER[a.line.role];
      const pb = position.get(b.line.materialId) ?? unlisted + ROLE_ORDER[b.line.role];
      return pa - pb || a.index - b.index;
    })
    .map(({ line }) => line);
}
