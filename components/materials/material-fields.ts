import type { MaterialKind } from "@/lib/formulation";

/** A numeric or text property of a material, as the form shows it. */
export interface PropertyField {
  /** Path in the Material record, also the key of its source. */
  path: string;
  label: string;
  unit: string;
  type: "number" | "text";
  /** Kinds for which the field is shown (all when absent). */
  kinds?: readonly MaterialKind[];
}

export interface PropertyGroup {
  title: string;
  kinds?: readonly MaterialKind[];
  fields: PropertyField[];
}

export const PROPERTY_GROUPS: PropertyGroup[] = [
  {
    title: "As supplied",
    fields: [
      { path: "formula", label: "Formula (repeat unit for polymers)", unit: "", type: "text" },
      { path: "molarMass", label: "Molar mass", unit: "g/mol", type: "number" },
      { path: "density", label: "Density as supplied", unit: "g/cm³", type: "number" },
      { path: "assay", label: "Assay", unit: "mass fraction, 0–1", type: "number" },
      { path: "waterFraction", label: "Carried water", unit: "mass fraction, 0–1", type: "number" },
      { path: "solventFraction", label: "Carried solvent", unit: "mass fraction, 0–1", type: "number" },
      { path: "crystalWaterPerFormula", label: "Water of crystallisation", unit: "mol per formula unit", type: "number" },
      { path: "phaseDensity", label: "Dry phase density", unit: "g/cm³", type: "number", kinds: ["organic"] },
    ],
  },
  {
    title: "Precursor: residue and hydrolysis",
    kinds: ["precursor"],
    fields: [
      { path: "precursor.residueFormula", label: "Residue formula", unit: "oxide or R-SiO1.5", type: "text" },
      { path: "precursor.residueMolarMass", label: "Residue molar mass", unit: "g/mol", type: "number" },
      { path: "precursor.residuePerMolecule", label: "Residue units per molecule", unit: "–", type: "number" },
      { path: "precursor.residueDensity", label: "Residue density", unit: "g/cm³", type: "number" },
      { path: "precursor.networkAtomsPerMolecule", label: "Network-forming atoms per molecule", unit: "–", type: "number" },
      { path: "precursor.hydrolysableGroupsPerMolecule", label: "Hydrolysable groups per molecule", unit: "–", type: "number" },
      { path: "precursor.leavingAlcohol.name", label: "Alcohol released", unit: "name", type: "text" },
      { path: "precursor.leavingAlcohol.molarMass", label: "Molar mass of that alcohol", unit: "g/mol", type: "number" },
      { path: "precursor.conversionTemperatureC", label: "Conversion temperature", unit: "°C", type: "number" },
    ],
  },
  {
    title: "Thermal limits",
    kinds: ["organic", "substrate"],
    fields: [
      { path: "thermal.glassTransitionC", label: "Glass transition Tg", unit: "°C", type: "number" },
      { path: "thermal.meltingC", label: "Melting point Tm", unit: "°C", type: "number" },
      { path: "thermal.degradationOnsetC", label: "Degradation onset Td", unit: "°C", type: "number" },
      { path: "thermal.maxServiceC", label: "Grade maximum", unit: "°C", type: "number" },
    ],
  },
];

export const ALL_FIELDS: PropertyField[] = PROPERTY_GROUPS.flatMap((g) => g.fields);

/** "precursor.residueDensity" → "precursor__residueDensity" (a flat form key). */
export function formKey(path: string): string {
  return path.replace(/\./g, "__");
}
