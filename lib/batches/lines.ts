/** The lines of a batch record: what is weighed, against which target. */
import type { FormulationInput, FormulationResult, RecipeLine } from "@/lib/formulation";

/** The fields of a batch line that the batch arithmetic and the record's export need. */
export interface LineValues {
  materialId: string;
  name?: string;
  role?: RecipeLine["role"];
  /** Target mass as supplied, g. */
  targetGrams?: number;
  /** Target volume as supplied, mL. */
  targetMl?: number;
  /** Mass weighed, g; null until weighed. */
  actualGrams: number | null;
  lotNumber: string | null;
  at?: string;
  initials?: string;
}

/**
 * Lines of a new batch, copied from the revision's recipe (lines with a mass
 * to weigh), in the recipe's order of addition.
 *
 * @example
 * ```ts
 * batchLinesFrom(input, computeFormulation(input))[0];
 * // { materialId: "teos", name: "Tetraethoxysilane (TEOS)", role: "precursor", targetGrams: 34.67…, targetMl: 37.1…, actualGrams: null, lotNumber: null }
 * ```
 */
export function batchLinesFrom(input: FormulationInput, result: FormulationResult): LineValues[] {
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  return result.lines
    .filter((line) => line.massGrams > 0)
    .map((line) => ({
      materialId: line.materialId,
      name: names.get(line.materialId) ?? line.materialId,
      role: line.role,
      targetGrams: line.massGrams,
      targetMl: line.volumeMl,
      actualGrams: null,
      lotNumber: null,
    }));
}
