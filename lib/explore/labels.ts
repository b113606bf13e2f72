/**
 * Plain words and units for what an exploration varies: axis labels built
 * from the revision's own material names. Pure TypeScript.
 */
import type { FormulationInput } from "../formulation/input-schema";
import type { Variable } from "./spec";

/** A material's name from the revision's materials, or its id when it is not listed. */
export function materialName(base: FormulationInput, id: string): string {
  return base.materials.find((m) => m.id === id)?.name ?? id;
}

/**
 * The label and unit of one variable. Weight fractions and the solids content are stored 0–1 and
 * shown in % ("wt%", `percent` true); ratios in mol/mol; temperatures in °C; withdrawal speeds in mm/s.
 *
 * @example
 * ```ts
 * variableLabel(base, { kind: "waterRatio", from: 1, to: 4, step: 0.5 });
 * // { label: "Water ratio R (mol water per mol network-forming atom)", unit: "mol/mol", percent: false }
 * ```
 */
export function variableLabel(base: FormulationInput, variable: Variable): { label: string; unit: string; percent: boolean } {
  switch (variable.kind) {
    case "weightFraction":
      return { label: `${materialName(base, variable.materialId)}, weight fraction of the dry composite`, unit: "wt%", percent: true };
    case "solidsContent":
      return { label: "Solids content of the sol (dry composite / sol mass)", unit: "wt%", percent: true };
    case "waterRatio": {
      const water = base.water;
      if (water.ratio === "R") return { label: "Water ratio R (mol water per mol network-forming atom)", unit: "mol/mol", percent: false };
      if (water.ratio === "h") return { label: "Water ratio h (mol water per mol hydrolysable group)", unit: "mol/mol", percent: false };
      const reference = water.referenceId === undefined ? "precursor" : materialName(base, water.referenceId);
      return { label: `Water ratio (mol water per mol ${reference})`, unit: "mol/mol", percent: false };
    }
    case "modifierRatio": {
      const modifier = base.modifiers?.[variable.index];
      const label = modifier
        ? `${materialName(base, modifier.materialId)} per mol metal of ${materialName(base, modifier.precursorId)} (modifier ratio)`
        : `Modifier ratio of modifier ${variable.index + 1}`;
      return { label, unit: "mol/mol", percent: false };
    }
    case "stepTemperature": {
      const step = base.steps[variable.index];
      return { label: `Temperature of step ${variable.index + 1}${step ? `, ${step.name}` : ""}`, unit: "°C", percent: false };
    }
    case "withdrawalSpeed":
      return { label: "Dip-coating withdrawal speed", unit: "mm/s", percent: false };
  }
}

/**
 * A value of a variable as shown: ×100 for fractions, to 12 significant digits
 * (so 0.05 shows as 5, not 5.000000000000001).
 *
 * @example
 * ```ts
 * shownValue(0.05, true); // 5
 * ```
 */
export function shownValue(value: number, percent: boolean): number {
  return percent ? Number((value * 100).toPrecision(12)) : value;
}
