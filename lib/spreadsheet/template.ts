/**
 * Gelwright's own spreadsheet template: the sheets, columns and settings that
 * the export writes and the import reads. The same definitions serve both
 * directions, so an exported revision can be imported again unchanged.
 *
 * The format is documented for users on the "Read me" sheet of every file we
 * produce (see `readMeRows`).
 */

/** Sheet names of the formulation workbook. */
export const SHEET = {
  readMe: "Read me",
  overview: "Overview",
  batchSheet: "Batch sheet",
  composite: "Dry composite",
  thermal: "Thermal check",
  input: "Input",
  components: "Components",
  modifiers: "Modifiers",
  coating: "Coating",
  coatAndVoc: "Coating and VOC",
  steps: "Process steps",
  order: "Addition order",
  materials: "Materials",
  sources: "Material sources",
  batchRecord: "Batch record",
  actual: "Composition made",
} as const;

/** Sheets the formulation import reads; every other sheet is for people and is ignored. */
export const FORMULATION_INPUT_SHEETS = [SHEET.input, SHEET.components, SHEET.modifiers, SHEET.coating, SHEET.steps, SHEET.order, SHEET.materials, SHEET.sources] as const;
/** Sheets the materials import reads. */
export const MATERIALS_INPUT_SHEETS = [SHEET.materials, SHEET.sources] as const;

/**
 * How a Materials column is read: "material" holds another material's name
 * (the solvent a material carries), "flag" holds yes / no (blank = not set).
 */
export type ColumnType = "text" | "number" | "kind" | "hazards" | "material" | "flag";

/** One column of the Materials sheet and the Material field it holds (dotted path). */
export interface MaterialColumn {
  header: string;
  path: string;
  type: ColumnType;
  width: number;
}

/** Columns of the Materials sheet, in order. Units are in the headers. */
export const MATERIAL_COLUMNS: readonly MaterialColumn[] = [
  { header: "Name", path: "name", type: "text", width: 34 },
  { header: "Kind", path: "kind", type: "kind", width: 11 },
  { header: "CAS number", path: "casNumber", type: "text", width: 12 },
  { header: "Formula", path: "formula", type: "text", width: 20 },
  { header: "Molar mass (g/mol)", path: "molarMass", type: "number", width: 12 },
  { header: "Density as supplied (g/cm³)", path: "density", type: "number", width: 14 },
  { header: "Assay (mass fraction)", path: "assay", type: "number", width: 11 },
  { header: "Water fraction (mass fraction)", path: "waterFraction", type: "number", width: 12 },
  { header: "Solvent fraction (mass fraction)", path: "solventFraction", type: "number", width: 12 },
  { header: "Carried solvent (material name)", path: "solventId", type: "material", width: 24 },
  { header: "Water of crystallisation (mol per formula unit)", path: "crystalWaterPerFormula", type: "number", width: 14 },
  { header: "Dry phase density (g/cm³)", path: "phaseDensity", type: "number", width: 12 },
  { header: "Refractive index (n_D, 589 nm, 20–25 °C)", path: "refractiveIndex", type: "number", width: 12 },
  { header: "Boiling point at 1 atm (°C)", path: "boilingPointC", type: "number", width: 12 },
  { header: "Residue formula", path: "precursor.residueFormula", type: "text", width: 14 },
  { header: "Residue molar mass (g/mol)", path: "precursor.residueMolarMass", type: "number", width: 12 },
  { header: "Residue units per molecule", path: "precursor.residuePerMolecule", type: "number", width: 10 },
  { header: "Residue density (g/cm³)", path: "precursor.residueDensity", type: "number", width: 11 },
  { header: "Residue refractive index (n_D, 589 nm, as in the dry coat)", path: "precursor.residueRefractiveIndex", type: "number", width: 12 },
  { header: "Network-forming atoms per molecule", path: "precursor.networkAtomsPerMolecule", type: "number", width: 12 },
  { header: "Hydrolysable groups per molecule", path: "precursor.hydrolysableGroupsPerMolecule", type: "number", width: 12 },
  { header: "Leaving alcohol", path: "precursor.leavingAlcohol.name", type: "text", width: 12 },
  { header: "Leaving alcohol molar mass (g/mol)", path: "precursor.leavingAlcohol.molarMass", type: "number", width: 12 },
  { header: "Conversion temperature (°C)", path: "precursor.conversionTemperatureC", type: "number", width: 12 },
  { header: "Hydrolyses fast, wants a modifier (yes/no)", path: "fastHydrolysing", type: "flag", width: 12 },
  { header: "Moisture-sensitive and flammable (yes/no)", path: "moistureSensitive", type: "flag", width: 12 },
  { header: "Alkoxy groups replaced per ligand", path: "modifier.groupsReplacedPerMolecule", type: "number", width: 12 },
  { header: "Bonded ligand formula", path: "modifier.bondedFormula", type: "text", width: 14 },
  { header: "Bonded ligand molar mass (g/mol)", path: "modifier.bondedMolarMass", type: "number", width: 12 },
  { header: "Bonded ligand density (g/cm³)", path: "modifier.bondedDensity", type: "number", width: 12 },
  { header: "Ligand removal temperature (°C)", path: "modifier.removalTemperatureC", type: "number", width: 12 },
  { header: "Glass transition (°C)", path: "thermal.glassTransitionC", type: "number", width: 11 },
  { header: "Melting point (°C)", path: "thermal.meltingC", type: "number", width: 11 },
  { header: "Degradation onset (°C)", path: "thermal.degradationOnsetC", type: "number", width: 11 },
  { header: "Degradation onset in inert gas (°C)", path: "thermal.degradationOnsetInertC", type: "number", width: 12 },
  { header: "Heat deflection temperature at 1.8 MPa, ISO 75-2 method A (°C)", path: "thermal.heatDeflectionC", type: "number", width: 14 },
  { header: "Maximum service temperature (°C)", path: "thermal.maxServiceC", type: "number", width: 12 },
  { header: "Epoxy equivalent weight, EEW (g/eq)", path: "epoxyEquivalentWeight", type: "number", width: 12 },
  { header: "Amine hydrogen equivalent weight, AHEW (g/eq)", path: "amineHydrogenEquivalentWeight", type: "number", width: 12 },
  { header: "Price per kg as supplied (team's currency)", path: "pricePerKg", type: "number", width: 12 },
  { header: "GHS hazard statements", path: "hazards", type: "hazards", width: 24 },
];

/** Columns of the Material sources sheet. */
export const SOURCE_COLUMNS = ["Material", "Property", "Source"] as const;
/** Columns of the Components sheet. */
export const COMPONENT_COLUMNS = ["Material", "Weight fraction (mass fraction of the dry composite)"] as const;
/** Columns of the Process steps sheet. */
export const STEP_COLUMNS = ["Step", "Temperature (°C)", "Duration (h)"] as const;
/** Optional columns of the Process steps sheet (older files have none: every step is then a cure in air). */
export const STEP_EXTRA_COLUMNS = ["Stage (sol | drying | curing)", "Atmosphere (air | inert)"] as const;
/** Columns of the Modifiers sheet. */
export const MODIFIER_COLUMNS = ["Modifier", "Precursor modified", "Modifier ratio (mol per mol metal)"] as const;
/** Columns of the Addition order sheet. */
export const ORDER_COLUMNS = ["Position", "Material"] as const;
/** Columns of the Input sheet. */
export const INPUT_COLUMNS = ["Setting", "Value", "Unit"] as const;

/** Written in the hazards column for "checked: no GHS hazard statements" (a blank cell means "not recorded"). */
export const NO_HAZARDS = "none";

/** Settings of the Input sheet: label (first column), unit, and what the value is. */
export const INPUT_SETTINGS = {
  name: { label: "Formulation name", unit: "", type: "text" },
  project: { label: "Project", unit: "", type: "text" },
  description: { label: "Description", unit: "", type: "text" },
  basis: { label: "Basis", unit: "dry solid mass | solids content | gel body", type: "text" },
  solidGrams: { label: "Dry solid mass", unit: "g", type: "number" },
  solMassGrams: { label: "Sol mass", unit: "g", type: "number" },
  solidsFraction: { label: "Solids content", unit: "mass fraction", type: "number" },
  volumeMl: { label: "Mould volume", unit: "mL", type: "number" },
  bulkDensity: { label: "Bulk density", unit: "g/cm³", type: "number" },
  linearShrinkage: { label: "Linear shrinkage", unit: "fraction", type: "number" },
  water: { label: "Water material", unit: "material name", type: "text" },
  waterRatio: { label: "Water ratio", unit: "R | h | per precursor", type: "text" },
  waterValue: { label: "Water ratio value", unit: "mol H2O per mol network atom (R), per mol alkoxy group (h) or per mol of the reference precursor", type: "number" },
  waterReference: { label: "Water ratio reference precursor", unit: "material name (for per precursor)", type: "text" },
  waterCountCarried: { label: "Count water carried by other materials", unit: "yes | no (blank = yes)", type: "text" },
  solvent: { label: "Solvent material", unit: "material name", type: "text" },
  solventMode: { label: "Solvent amount", unit: "molar ratio | fill", type: "text" },
  solventValue: { label: "Solvent ratio", unit: "mol per mol network atom", type: "number" },
  catalyst: { label: "Catalyst material", unit: "material name", type: "text" },
  catalystValue: { label: "Catalyst ratio", unit: "mol per mol network atom", type: "number" },
  substrate: { label: "Substrate", unit: "material name", type: "text" },
  marginC: { label: "Thermal margin", unit: "°C", type: "number" },
  measuredBulkDensity: { label: "Measured bulk density", unit: "g/cm³", type: "number" },
} as const satisfies Record<string, { label: string; unit: string; type: "text" | "number" }>;

export type InputSettingKey = keyof typeof INPUT_SETTINGS;

/** Columns of the Coating sheet (the same layout as the Input sheet). */
export const COATING_COLUMNS = INPUT_COLUMNS;

/**
 * Settings of the optional Coating sheet: how the coat is applied, for the
 * film predictions. A method's own settings are needed with it (dip: speed,
 * viscosity, surface tension; spin: rpm and one measured film; wet film: its
 * wet thickness); the target and the area go with any method. An empty sheet,
 * or none, means no coating.
 */
export const COATING_SETTINGS = {
  method: { label: "Coating method", unit: "dip | spin | wet film", type: "text" },
  withdrawalMmPerS: { label: "Withdrawal speed", unit: "mm/s (dip)", type: "number" },
  viscosityMPaS: { label: "Sol viscosity", unit: "mPa·s (dip)", type: "number" },
  surfaceTensionMNPerM: { label: "Sol surface tension", unit: "mN/m (dip)", type: "number" },
  rpm: { label: "Spin speed", unit: "rpm (spin)", type: "number" },
  calibrationRpm: { label: "Calibration spin speed", unit: "rpm (spin: the speed of one measured film)", type: "number" },
  calibrationDryThicknessNm: { label: "Calibration dry thickness", unit: "nm (spin: the dry thickness of that film)", type: "number" },
  wetThicknessUm: { label: "Wet film thickness", unit: "µm (wet film)", type: "number" },
  targetDryThicknessNm: { label: "Target dry thickness", unit: "nm (optional)", type: "number" },
  areaM2: { label: "Area to coat", unit: "m² (optional)", type: "number" },
} as const satisfies Record<string, { label: string; unit: string; type: "text" | "number" }>;

export type CoatingSettingKey = keyof typeof COATING_SETTINGS;

/** Plain words for the coating methods, and the engine's names. */
export const COATING_METHOD_LABELS = { dip: "dip", spin: "spin", wetFilm: "wet film" } as const;

/** Plain words for the basis types, and the engine's names. */
export const BASIS_LABELS = { solidMass: "dry solid mass", solidsContent: "solids content", gelBody: "gel body" } as const;
/** Plain words for the water conventions, and the engine's names. */
export const WATER_RATIO_LABELS = { R: "R", h: "h", perPrecursor: "per precursor" } as const;
/** Plain words for the step stages and atmospheres (the engine's names are the same words). */
export const STAGE_WORDS = ["sol", "drying", "curing"] as const;
export const ATMOSPHERE_WORDS = ["air", "inert"] as const;
/** Words read as yes / no in flag cells. */
export const YES_WORDS = ["yes", "y", "true", "1", "x"] as const;
export const NO_WORDS = ["no", "n", "false", "0"] as const;

/** Plain words for the solvent modes, and the engine's names. */
export const SOLVENT_MODE_LABELS = { molPerNetworkAtom: "molar ratio", fill: "fill" } as const;

/** Limits on uploaded files (bytes, rows, columns, sheets, characters, milliseconds). */
export interface ImportLimits {
  maxBytes: number;
  maxRows: number;
  maxColumns: number;
  maxSheets: number;
  maxCellChars: number;
  parseMs: number;
}

/** Limits on uploaded files; each has a plain message when exceeded. */
export const IMPORT_LIMITS: Readonly<ImportLimits> = {
  /** 5 MB: larger than any realistic formulation or library file. */
  maxBytes: 5 * 1024 * 1024,
  /** Rows read per sheet (header included). */
  maxRows: 5_000,
  /** Columns read per sheet. */
  maxColumns: 60,
  /** Sheets in a workbook. */
  maxSheets: 20,
  /** Characters in one cell. */
  maxCellChars: 2_000,
  /** Wall-clock time for parsing one workbook in the worker thread. */
  parseMs: 10_000,
};

/** The "Read me" sheet: how the template is laid out, for the person filling it in. */
export function readMeRows(kind: "formulation" | "materials"): string[][] {
  const common = [
    ["Materials", "One row per material as supplied. Units are in the column headers; write numbers alone (0.933, not 0.933 g/cm³), with a point as decimal separator."],
    ["", "Kind is one of: precursor, organic, substrate, solvent, water, catalyst, modifier. Precursor columns (residue …) are needed for precursors only; dry phase density for organic phases; the ligand columns (alkoxy groups replaced, bonded ligand …) for modifiers (chelating or exchanging ligands such as acetylacetone)."],
    ["", "Optical, VOC, cure and cost columns, all optional: refractive index (n_D at 589 nm) of an organic phase, a substrate or a modifier's bonded ligand; the residue's refractive index for precursors (as the residue is in a low-temperature dry coat); boiling point at 1 atm, 101.3 kPa (decides what counts as VOC); epoxy and amine hydrogen equivalent weights (g of the active compound per mol of groups); price per kg as supplied, in your team's currency."],
    ["", "Carried solvent: the name of the solvent a solution carries (its solvent fraction), e.g. 1-propanol in zirconium propoxide 70 %. Hydrolyses fast / moisture-sensitive and flammable: yes or no; blank leaves the usual choice by kind."],
    ["", `GHS hazard statements: codes separated by semicolons (H225; H319). Write "${NO_HAZARDS}" when the material has none; leave blank when not recorded.`],
    ["", "A material whose name or CAS number matches one in your team's library is linked to it; any other is offered for creation in the library."],
    ["Material sources", "Optional: where each value comes from. One row per material and property (property as in the column header, e.g. Density as supplied (g/cm³))."],
  ];
  const formulation = [
    ["Input", "Settings of the formulation, one per row: the setting in column A, its value in column B; the unit is in column C."],
    ["Components", "The dry composite: one row per precursor or organic phase with its weight fraction. Weight fractions must sum to 1."],
    ["Modifiers", "Optional: chelating or exchanging ligands, one row per modifier and the precursor it modifies, in mol of modifier per mol of that precursor's metal atoms."],
    ["Coating", "Optional: how the coat is applied, for the film predictions. Coating method: dip (withdrawal speed, sol viscosity, sol surface tension), spin (spin speed and one measured film: its spin speed and dry thickness) or wet film (its wet thickness, laid by a bar, a slot die or a spray). Target dry thickness and area to coat are optional with any method. Leave the values blank for no coating."],
    ["Process steps", "Every step with its temperature and duration, its stage (sol, drying or curing; blank = curing) and atmosphere (air or inert; blank = air)."],
    ["Addition order", "Optional: the order in which the batch is made up, by material name. Materials not listed follow in the usual order."],
    ["Overview, Batch sheet, Coating and VOC, Dry composite, Thermal check", "Written by Gelwright when a revision is exported; they are for reading and printing and are ignored on import."],
  ];
  return [
    ["Gelwright spreadsheet template", kind === "formulation" ? "Formulation" : "Materials library"],
    ["Sheet", "What it holds"],
    ...(kind === "formulation" ? formulation : []),
    ...common,
    ["Limits", `Files up to ${IMPORT_LIMITS.maxBytes / 1024 / 1024} MB, ${IMPORT_LIMITS.maxRows.toLocaleString("en")} rows per sheet, ${IMPORT_LIMITS.maxSheets} sheets. CSV files hold one table; further tables start after a line with the sheet name in brackets, e.g. [Material sources].`],
  ];
}
