/**
 * Types of the engine's result. All numbers are plain JS numbers at full
 * precision; rounding is for display only.
 */

/** Role of a dispensed material in the batch. */
export type LineRole = "precursor" | "organic" | "modifier" | "solvent" | "water" | "catalyst";

/** One dispensed material of the batch recipe. */
export interface RecipeLine {
  materialId: string;
  role: LineRole;
  /** mol of the active compound (precursor, solvent, catalyst) or of water to add. */
  moles?: number;
  /** g to weigh, as supplied. */
  massGrams: number;
  /** mL to dispense, as supplied (mass / density as supplied). */
  volumeMl: number;
  /** g of residue (precursor) or of dry phase (organic) in the dry composite. */
  residueGrams?: number;
  /** mol of network-forming atoms (Si, Ti, Zr, Al, P). */
  networkAtomMol?: number;
  /** mol of hydrolysable (alkoxy) groups. */
  hydrolysableGroupMol?: number;
  /** mol of water carried (solution water and water of crystallisation). */
  carriedWaterMol?: number;
  /** g of solvent carried (e.g. 1-propanol in a zirconium propoxide solution). */
  carriedSolventGrams?: number;
}

/** Water bookkeeping, mol unless stated. */
export interface WaterResult {
  /** W = R·Σa or h·Σg. */
  targetMol: number;
  /** C, water brought by the other materials. */
  carriedMol: number;
  /** max(W − C, 0). */
  addMol: number;
  addGrams: number;
  addMl: number;
  /** Σg: water for full hydrolysis. */
  hydrolysisMol: number;
  /** Σg / 2: net water consumed by complete condensation. */
  condensationMol: number;
  /** (C + added) / Σa. */
  effectiveR: number;
  /** (C + added) / Σg'; absent when there are no hydrolysable groups (colloidal silica alone). */
  effectiveH?: number;
  /** q · Σ n_L: alkoxy groups replaced by modifier ligands, when there are any (Σg' = Σg − this). */
  groupsReplacedMol?: number;
}

/** The solvent: what was added, what precursor solutions carried in, and the molar ratio they make together. */
export interface SolventResult {
  materialId: string;
  addedGrams: number;
  carriedGrams: number;
  addedMol?: number;
  carriedMol?: number;
  /** (added + carried) / Σa, mol/mol. */
  molPerNetworkAtom?: number;
}

/** One modifier line (chemistry: "Modifiers"). */
export interface ModifierResult {
  materialId: string;
  precursorId: string;
  /** x, mol ligand per mol metal of that precursor. */
  molPerMetal: number;
  /** n_L = x · a_p. */
  ligandMol: number;
  /** q · n_L. */
  groupsReplacedMol: number;
  /** g of bonded ligand in the dry composite (0 when burnt out). */
  bondedGrams: number;
  /** The step that reaches the ligand's removal temperature, when one does. */
  removedInStep?: string;
}

/** Alcohol released on full hydrolysis. */
export interface AlcoholRelease {
  name: string;
  mol: number;
  grams: number;
}

/** The sol (everything dispensed, ideal mixing). */
export interface SolResult {
  massGrams: number;
  /** mL, ideal mixing (Σ mass / density): an approximation. */
  volumeMl: number;
  /** g of dry composite per litre of sol. */
  residueGramsPerL: number;
  /** mol network-forming atoms per litre of sol. */
  networkAtomMolarity: number;
  /** dry composite mass / sol mass. */
  solidsFraction: number;
}

/** One phase of the dry composite. */
export interface CompositePhase {
  materialId: string;
  residueFormula?: string;
  weightFraction: number;
  volumeFraction: number;
  /** g/cm³ of the dry phase. */
  density: number;
}

/** Volumetric and linear shrinkage (fractions, 0.3 = 30 %). */
export interface Shrinkage {
  volumetric: number;
  linear: number;
}

/** The ideal dry composite. */
export interface CompositeResult {
  /** g. */
  massGrams: number;
  /** g/cm³, rule of mixtures. */
  theoreticalDensity: number;
  /** 1 − ρb / ρth, when a bulk density is known. */
  porosity?: number;
  phases: CompositePhase[];
  /** sol → dense solid. */
  denseShrinkage: Shrinkage;
  /** sol → dry gel of the known bulk density. */
  dryGelShrinkage?: Shrinkage;
}

/** Status of a thermal check, worst last. */
export type ThermalStatus = "clear" | "caution" | "fail";

/** Which thermal limit a check or the allowed maximum refers to. */
export type ThermalLimit =
  | "degradationOnset"
  | "degradationOnsetInert"
  | "heatDeflection"
  | "maxService"
  | "melting"
  | "glassTransition"
  | "conversion";

/** One (material × step) thermal check. */
export interface ThermalCheck {
  materialId: string;
  stepName: string;
  /** °C of the step. */
  temperatureC: number;
  limit: ThermalLimit;
  /** °C of that limit. */
  limitC: number;
  /** °C margin applied. */
  marginC: number;
  status: ThermalStatus;
  /** The step's stage ("curing" when the step did not say); absent in results stored before stages existed. */
  stage?: "sol" | "drying" | "curing";
  /** The step's atmosphere ("air" when the step did not say); absent in results stored before atmospheres existed. */
  atmosphere?: "air" | "inert";
}

/** Thermal compatibility of the process steps. */
export interface ThermalResult {
  status: ThermalStatus;
  /** °C: lowest (hard limit − margin) over organic phases and the substrate. */
  maxAllowedC?: number;
  binding?: { materialId: string; limit: ThermalLimit };
  checks: ThermalCheck[];
}

/** A message for the formulator or reviewer. */
export interface Notice {
  level: "info" | "caution" | "error";
  code: string;
  message: string;
  field?: string;
}

/**
 * The coat's film (chemistry: "What the coat will be"), when the input states a coating method.
 * Thicknesses: wet in µm, dry in nm.
 */
export interface CoatingResult {
  method: "dip" | "spin" | "wetFilm";
  /** φ_s = (S / ρ_th) / V_sol: dense dry solid per sol volume (dimensionless). */
  solidVolumeFraction: number;
  /** µm of wet film (dip: Landau–Levich; spin: back-computed from the dry film; wet film: as stated). */
  wetThicknessUm: number;
  /** nm of dry film, h_wet · φ_s / (1 − P). */
  dryThicknessNm: number;
  /** m² per litre of sol, no losses: 1000 / h_wet[µm]. */
  coverageM2PerL: number;
  /** mL of sol for the stated area, no losses. */
  solMlForArea?: number;
  /** Ca = η U / γ (dip only); Landau–Levich holds for Ca ≪ 1. */
  capillaryNumber?: number;
  /** mm/s that gives the target dry thickness (dip with a target). */
  withdrawalMmPerSForTarget?: number;
  /** rpm that gives the target dry thickness (spin with a target). */
  rpmForTarget?: number;
}

/** The dry coat's refractive index (Lorentz–Lorenz, porosity as air), beside the substrate's. */
export interface OpticsResult {
  /** n_D of the dry coat. */
  refractiveIndex: number;
  /** n_D of the substrate, when it has one. */
  substrateIndex?: number;
  /** coat − substrate. */
  mismatch?: number;
}

/** Volatile organic compounds the sol emits (EU 2004/42/EC definition). */
export interface VocResult {
  /** g of VOC for the batch, the hydrolysis alcohol included. */
  massGrams: number;
  /** g per litre of sol. */
  gramsPerLitre: number;
  /** g per litre of sol less water (ASTM D3960, US EPA Method 24). */
  gramsPerLitreLessWater: number;
  /** mL of water in the sol (added and carried). */
  waterMl: number;
}

/** Epoxy–amine balance, when either group is present. */
export interface CureResult {
  /** mol of epoxy groups. */
  epoxyEq: number;
  /** mol of amine hydrogens. */
  amineHydrogenEq: number;
  /** amine-H eq / epoxy eq; absent when there are no epoxy groups. */
  ratio?: number;
}

/** Cost of the batch in the team's currency, when every dispensed line has a price. */
export interface CostResult {
  /** For the whole batch. */
  total: number;
  /** Per kg of dry composite. */
  perKgDry: number;
  /** Per litre of sol. */
  perLitreSol: number;
  /** Per m² at the predicted coverage, when a coat is set. */
  perM2?: number;
}

/** Everything computeFormulation derives from a FormulationInput. */
export interface FormulationResult {
  engineVersion: string;
  lines: RecipeLine[];
  water: WaterResult;
  alcohol: AlcoholRelease[];
  sol: SolResult;
  /** The solvent's added and carried amounts, when there is a solvent. */
  solvent?: SolventResult;
  /** Modifier lines, when there are any. */
  modifiers?: ModifierResult[];
  composite: CompositeResult;
  thermal: ThermalResult;
  /** The film, when the input sets a coating method. */
  coating?: CoatingResult;
  /** The coat's refractive index, when every phase of the dry composite has one (otherwise a notice names those without). */
  optics?: OpticsResult;
  /** VOC of the sol (results stored before engine 2.1 lack it). */
  voc?: VocResult;
  /** Epoxy–amine balance, when an epoxy or amine equivalent weight is present. */
  cure?: CureResult;
  /** Cost, when every dispensed line has a price (otherwise a notice names those without). */
  cost?: CostResult;
  notices: Notice[];
}
