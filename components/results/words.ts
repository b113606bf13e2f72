import type { FormulationInput, Material } from "@/lib/formulation";

export { KIND_LABELS, LIMIT_LABELS, LINE_ROLE_LABELS } from "@/lib/labels";

/** Material records of an input by id. */
export function materialsById(input: FormulationInput): Map<string, Material> {
  return new Map(input.materials.map((m) => [m.id, m]));
}

export { ATMOSPHERE_LABELS, STAGE_LABELS } from "@/lib/labels";
