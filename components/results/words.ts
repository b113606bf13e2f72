import type { FormulationInput, Material } from "@/lib/formulation";

export { KIND_LABELS, LIMIT_LABELS, LINE_ROLE_LABELS } from "@/lib/labels";

/** Material records of an input by id. */
export function materialsById(input: FormulationInput): Map<string, Material> {
  return new Map(input.materials.map((m) => [m.id, m]));
}

/** Words for a process step's stage (input "stage"; absent = curing). */
export const STAGE_LABELS: Record<"sol" | "drying" | "curing", string> = { sol: "Sol", drying: "Drying", curing: "Curing" };

/** Words for a process step's atmosphere (input "atmosphere"; absent = air). */
export const ATMOSPHERE_LABELS: Record<"air" | "inert", string> = { air: "Air", inert: "Inert gas" };
