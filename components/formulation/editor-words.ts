/**
 * Engine and server messages in the editor's own words: each message is
 * prefixed with the form row it points at ("Component 1: choose a material"),
 * and no path of the engine's input (`components.0.materialId`,
 * `precursor.leavingAlcohol`) ever reaches the screen.
 */
import type { EditorValues } from "./editor-model";

const BASIS_LABELS: Record<string, string> = {
  type: "Basis",
  grams: "Dry solid mass",
  solMassGrams: "Sol mass",
  solidsPercent: "Solids content",
  volumeMl: "Mould volume",
  bulkDensity: "Bulk density",
  linearShrinkagePercent: "Linear shrinkage",
};

const STEP_LABELS: Record<string, string> = { name: "name", temperatureC: "temperature", durationH: "duration", stage: "stage", atmosphere: "atmosphere" };

const MODIFIER_LABELS: Record<string, string> = { materialId: "modifier", precursorId: "precursor modified", molPerMetal: "mol per mol metal" };

const FIELD_LABELS: Record<string, string> = {
  "water.materialId": "Water",
  "water.ratio": "Water ratio",
  "water.value": "Water ratio",
  "water.referenceId": "Water ratio, precursor",
  modifiers: "Modifiers",
  "solvent.materialId": "Solvent",
  "solvent.mode": "Solvent",
  "solvent.value": "Solvent ratio",
  "catalyst.materialId": "Catalyst",
  "catalyst.molPerNetworkAtom": "Catalyst ratio",
  substrateId: "Substrate",
  marginC: "Thermal margin",
  measuredBulkDensity: "Measured bulk density",
  components: "Components",
  steps: "Process steps",
  "coating.method": "Coating method",
  "coating.withdrawalMmPerS": "Withdrawal speed",
  "coating.viscosityMPaS": "Sol viscosity",
  "coating.surfaceTensionMNPerM": "Surface tension",
  "coating.rpm": "Spin speed",
  "coating.calibrationRpm": "Measured film, spin speed",
  "coating.calibrationDryThicknessNm": "Measured film, dry thickness",
  "coating.wetThicknessUm": "Wet film thickness",
  "coating.targetDryThicknessNm": "Target dry thickness",
  "coating.areaM2": "Area to coat",
};

/**
 * The words for a form field, as a person finds it on the screen.
 *
 * @example
 * ```ts
 * fieldLabel("components.0.weightPercent"); // "Component 1"
 * fieldLabel("steps.1.temperatureC"); // "Step 2, temperature"
 * ```
 */
export function fieldLabel(field: string): string | null {
  const parts = field.split(".");
  const row = Number(parts[1]) + 1;
  if (parts[0] === "components" && parts.length === 3) return `Component ${row}`;
  if (parts[0] === "modifiers" && parts.length === 3) return `Modifier ${row}, ${MODIFIER_LABELS[parts[2] ?? ""] ?? "value"}`;
  if (parts[0] === "steps" && parts.length === 3) return `Step ${row}, ${STEP_LABELS[parts[2] ?? ""] ?? "value"}`;
  if (parts[0] === "basis") return BASIS_LABELS[parts[1] ?? ""] ?? "Basis";
  return FIELD_LABELS[field] ?? null;
}

/** A dotted path or a camelCase word: an engine-internal name a person should never read. */
const INTERNAL_NAME = /\b[a-z]{2,}(?:[A-Z][a-z]*)+\b|\b[A-Za-z]\w*(?:\.[A-Za-z]\w*)+\b/;

/**
 * The message to show beside a form field: the row's words, then the
 * engine's message with any engine-internal name dropped.
 *
 * @example
 * ```ts
 * fieldMessage("components.0.materialId", "choose a material for the component"); // "Component 1: choose a material"
 * ```
 */
export function fieldMessage(field: string, message: string): string {
  const label = fieldLabel(field);
  let text = message;
  if (field.startsWith("components.") && field.endsWith(".materialId") && /choose a material/.test(message)) text = "choose a material";
  else if (field.endsWith(".weightPercent") && /must be 0 or between/.test(message)) text = "enter a weight fraction from 0 to 100 %";
  else if (INTERNAL_NAME.test(text) && !/^\S+ \(library record/.test(text)) text = "check this value";
  if (!label || field === "components" || text.startsWith(`${label}:`)) return text;
  return `${label}: ${text.charAt(0).toLowerCase()}${text.slice(1)}`;
}

/**
 * True while no component has a material yet: the draft is empty, and the
 * editor shows its first steps instead of the engine's refusal.
 */
export function isEmptyDraft(values: Pick<EditorValues, "components">): boolean {
  return (values.components ?? []).every((c) => !c?.materialId);
}
