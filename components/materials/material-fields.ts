import type { MaterialKind } from "@/lib/formulation";

/** A numeric or text property of a material, as the form shows it. */
export interface PropertyField {
  /** Path in the Material record, also the key of its source. */
  path: string;
  label: string;
  unit: string;
  /** "flag": yes / no / not set; "solvent": one of the library's solvents (its id). */
  type: "number" | "text" | "flag" | "solvent";
  /** Kinds for which the field is shown (all when absent). */
  kinds?: readonly MaterialKind[];
  /** The unit is money: the form puts the team's currency code before it. */
  money?: boolean;
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
      { path: "solventId", label: "Which solvent it carries", unit: "a solvent of the library", type: "solvent" },
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
      { path: "precursor.residueRefractiveIndex", label: "Refractive index of the residue", unit: "n_D at 589 nm, 20–25 °C, as in a low-temperature hybrid", type: "number" },
      { path: "fastHydrolysing", label: "Hydrolyses fast (Ti, Zr, Al alkoxides): wants a modifier", unit: "yes / no", type: "flag" },
      { path: "moistureSensitive", label: "Moisture-sensitive and flammable", unit: "not set: decided by the kind", type: "flag" },
    ],
  },
  {
    title: "Modifier: the ligand bonded to the alkoxide",
    kinds: ["modifier"],
    fields: [
      { path: "modifier.groupsReplacedPerMolecule", label: "Alkoxy groups replaced per ligand", unit: "–", type: "number" },
      { path: "modifier.bondedFormula", label: "Bonded ligand formula", unit: "as it stays in the dry solid, e.g. C5H7O1.5", type: "text" },
      { path: "modifier.bondedMolarMass", label: "Bonded ligand molar mass", unit: "g/mol", type: "number" },
      { path: "modifier.bondedDensity", label: "Density of the bonded ligand", unit: "g/cm³", type: "number" },
      { path: "modifier.removalTemperatureC", label: "Removal temperature (ligand burnt out)", unit: "°C", type: "number" },
    ],
  },
  {
    title: "Thermal limits",
    kinds: ["organic", "substrate"],
    fields: [
      { path: "thermal.glassTransitionC", label: "Glass transition Tg", unit: "°C", type: "number" },
      { path: "thermal.meltingC", label: "Melting point Tm", unit: "°C", type: "number" },
      { path: "thermal.degradationOnsetC", label: "Degradation onset Td in air", unit: "°C", type: "number" },
      { path: "thermal.degradationOnsetInertC", label: "Degradation onset in inert gas", unit: "°C", type: "number" },
      { path: "thermal.heatDeflectionC", label: "Heat deflection temperature at 1.8 MPa (ISO 75-2 method A)", unit: "°C, short-term limit", type: "number", kinds: ["substrate"] },
      { path: "thermal.maxServiceC", label: "Grade maximum (continuous use)", unit: "°C", type: "number" },
    ],
  },
  {
    title: "For the coat's predictions: index, boiling point, equivalents, price",
    fields: [
      {
        path: "refractiveIndex",
        label: "Refractive index",
        unit: "n_D at 589 nm, 20–25 °C; of the dry phase, the part or the bonded ligand",
        type: "number",
        kinds: ["organic", "substrate", "modifier"],
      },
      { path: "boilingPointC", label: "Boiling point", unit: "°C at 101.3 kPa; up to 250 °C counts as VOC", type: "number", kinds: ["solvent", "catalyst", "modifier", "organic"] },
      { path: "epoxyEquivalentWeight", label: "Epoxy equivalent weight (EEW)", unit: "g/eq", type: "number", kinds: ["precursor", "organic", "modifier"] },
      { path: "amineHydrogenEquivalentWeight", label: "Amine hydrogen equivalent weight (AHEW)", unit: "g/eq", type: "number", kinds: ["precursor", "organic", "modifier", "catalyst"] },
      { path: "pricePerKg", label: "Price", unit: "per kg as supplied", type: "number", money: true, kinds: ["precursor", "organic", "modifier", "solvent", "water", "catalyst"] },
    ],
  },
];

export const ALL_FIELDS: PropertyField[] = PROPERTY_GROUPS.flatMap((g) => g.fields);

/** "precursor.residueDensity" → "precursor__residueDensity" (a flat form key). */
export function formKey(path: string): string {
  return path.replace(/\./g, "__");
}
