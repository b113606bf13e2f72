/**
 * What the numeric path's coat figures (film, optics, VOC, epoxy–amine
 * balance, cost) start from: the float64 twin of the decimal CoatContext
 * (lib/formulation/coat.ts). Every figure can also be read from a decimal
 * engine result, which is how the coat figures are tested on their own.
 */
import type { FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import type { LineRole } from "../result-types";
import type { NumericFigures } from "./figures";

/** One dispensed line, plain numbers (0 where the decimal line has no value). */
export interface NumericLine {
  materialId: string;
  role: LineRole;
  /** g as supplied. */
  massGrams: number;
  /** mL as supplied. */
  volumeMl: number;
  /** mol of the active compound (0 when the line has none). */
  moles: number;
  /** g of residue or dry organic phase (0 when none). */
  residueGrams: number;
  /** g of solvent carried by a precursor solution (0 when none). */
  carriedSolventGrams: number;
}

/** One phase of the dry composite, bonded ligands included. */
export interface NumericPhaseInput {
  materialId: string;
  /** Set for residues and bonded ligands. */
  residueFormula?: string;
  weightFraction: number;
  /** g/cm³ of the dry phase. */
  density: number;
}

/** The figures of the computation the coat figures start from (units in the names). */
export interface NumericCoatContext {
  input: FormulationInput;
  byId: ReadonlyMap<string, Material>;
  lines: readonly NumericLine[];
  phases: readonly NumericPhaseInput[];
  /** S, g of dry composite. */
  solidMass: number;
  /** g of sol. */
  solMass: number;
  /** mL of sol (ideal mixing). */
  solVolume: number;
  /** Water in the sol, added and carried, mol. */
  totalWaterMol: number;
  waterMaterial: Material;
  /** Alcohol released on full hydrolysis. */
  alcohols: readonly { mol: number; molarMass: number }[];
  /** g/cm³. */
  theoreticalDensity: number;
  /** 0 when no bulk density is known. */
  porosity: number;
}

/** Every coat figure, in the order of NumericFigures. */
export const COAT_KEYS = [
  "wetThicknessUm",
  "dryThicknessNm",
  "coverageM2PerL",
  "capillaryNumber",
  "refractiveIndex",
  "indexMismatch",
  "vocMassGrams",
  "vocGramsPerLitre",
  "vocGramsPerLitreLessWater",
  "cureRatio",
  "costTotal",
  "costPerKgDry",
  "costPerLitreSol",
  "costPerM2",
] as const satisfies readonly (keyof NumericFigures)[];

/** The coat figures, NaN where the decimal engine leaves the field out. */
export type NumericCoatFigures = Pick<NumericFigures, (typeof COAT_KEYS)[number]>;
