import type { FormulationInput, LineRole, Material, ThermalLimit } from "@/lib/formulation";

export const ROLE_WORDS: Record<LineRole, string> = {
  precursor: "Precursor",
  organic: "Organic phase",
  solvent: "Solvent",
  water: "Water",
  catalyst: "Catalyst",
};

export const KIND_WORDS: Record<Material["kind"], string> = {
  precursor: "Precursor",
  organic: "Organic phase",
  substrate: "Substrate",
  solvent: "Solvent",
  water: "Water",
  catalyst: "Catalyst",
};

export const LIMIT_WORDS: Record<ThermalLimit, string> = {
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
