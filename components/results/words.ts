import type { FormulationInput, LineRole, Material, ThermalLimit } from "@/lib/formulation";

/** Words for a recipe line's role. */
export const LINE_ROLE_LABELS: Record<LineRole, string> = {
  precursor: "Precursor",
  organic: "Organic phase",
  solvent: "Solvent",
  water: "Water",
  catalyst: "Catalyst",
};

/** Words for a material's kind. */
export const KIND_LABELS: Record<Material["kind"], string> = {
  precursor: "Precursor",
  organic: "Organic phase",
  substrate: "Substrate",
  solvent: "Solvent",
  water: "Water",
  catalyst: "Catalyst",
};

/** Words for a material's thermal limit. */
export const LIMIT_LABELS: Record<ThermalLimit, string> = {
  degradationOnset: "degradation onset",
  maxService: "grade maximum",
  melting: "melting point",
  glassTransition: "glass transition",
  conversion: "conversion temperature",
};


/** Material records of an input by id. */
export function materialsById(input: FormulationInput): Map<string, Material> {
  return new Map(input.materials.map((m) => [m.id, m]));
}
