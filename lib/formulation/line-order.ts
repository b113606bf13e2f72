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
  let position: Map<string, number> | undefined;
  if (additionOrder && additionOrder.length > 0) {
    position = new Map<string, number>();
    for (let index = 0; index < additionOrder.length; index += 1) {
      const id = additionOrder[index]!;
      if (!position.has(id)) position.set(id, index);
    }
  }
  const unlisted = additionOrder ? additionOrder.length : 0;
  // each line's place: its position in the addition order, else after all of those by its role
  const keys = new Array<number>(lines.length);
  let sorted = true;
  for (let index = 0; index < lines.length; index += 1) {
    const line = lines[index]!;
    keys[index] = position?.get(line.materialId) ?? unlisted + ROLE_ORDER[line.role];
    if (index > 0 && keys[index]! < keys[index - 1]!) sorted = false;
  }
  // lines already in order stay as they are (the sort is stable); otherwise sort their indices by place, then by index
  if (sorted) return lines.slice();
  const order = keys.map((_, index) => index).sort((a, b) => keys[a]! - keys[b]! || a - b);
  return order.map((index) => lines[index]!);
}
