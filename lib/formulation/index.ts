/**
 * Gelwright formulation engine: pure TypeScript, no framework, database or
 * auth imports; runs on the server and in the browser.
 */
export { computeFormulation } from "./compute";
export { ENGINE_VERSION, WATER_MOLAR_MASS_G_PER_MOL, DEFAULT_THERMAL_MARGIN_C, WEIGHT_FRACTION_SCALE_TOLERANCE } from "./constants";
export { FormulationError, isFormulationError, type FieldIssue, type FormulationErrorCode } from "./errors";
export {
  materialSchema,
  precursorDataSchema,
  thermalDataSchema,
  MATERIAL_KINDS,
  type Material,
  type MaterialKind,
  type PrecursorData,
  type ThermalData,
} from "./material-schema";
export {
  formulationInputSchema,
  basisSchema,
  componentSchema,
  waterSpecSchema,
  solventSpecSchema,
  catalystSpecSchema,
  processStepSchema,
  coatingSpecSchema,
  COATING_METHODS,
  type CoatingSpec,
  type FormulationInput,
  type Basis,
  type Component,
  type ProcessStep,
} from "./input-schema";
export { parseFormulationInput } from "./validate";
export { textProblem, nameText, multilineText } from "./text-rules";
export { parseFormula, molarMassOf } from "./formula";
export { residueYield } from "./precursor";
export { hardLimit, LIMIT_LABELS } from "./thermal";
export type {
  FormulationResult,
  RecipeLine,
  LineRole,
  WaterResult,
  AlcoholRelease,
  SolResult,
  CompositeResult,
  CompositePhase,
  Shrinkage,
  ThermalResult,
  ThermalCheck,
  ThermalLimit,
  ThermalStatus,
  Notice,
  CoatingResult,
  OpticsResult,
  VocResult,
  CureResult,
  CostResult,
} from "./result-types";
export {
  decimalModel,
  figuresFromResult,
  organicShareOfResidue,
  organicShares,
  type NumericFigures,
  type NumericFailure,
  type NumericModel,
  type NumericOutcome,
  type NumericPhase,
} from "./numeric/figures";
export { numericModel } from "./numeric/model";
