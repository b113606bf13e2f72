/**
 * The catalogue of figures an exploration can show or search on: every
 * number of NumericFigures with plain words and a unit, the absolute index
 * mismatch, and each phase's volume and weight fraction. Pure TypeScript.
 */
import type { FormulationInput } from "../formulation/input-schema";
import { SCALAR_FIGURES } from "../formulation/numeric/compare";
import type { NumericEvaluator, NumericFigures } from "../formulation/numeric/figures";
import { materialName } from "./labels";
import type { OutputKey } from "./spec";
import type { OutputInfo } from "./types";

/** The plain number figures of NumericFigures (every key but `phases` and `thermalStatus`). */
export type ScalarFigureKey = Exclude<keyof NumericFigures, "phases" | "thermalStatus">;

const SCALARS: Record<ScalarFigureKey, Omit<OutputInfo, "key">> = {
  theoreticalDensity: { label: "Theoretical density of the dry composite", unit: "g/cm³" },
  organicContent: { label: "Organic content of the dry composite (burn-off)", unit: "wt%", percent: true },
  organicWeightFraction: { label: "Organic phases, weight fraction of the dry composite", unit: "wt%", percent: true },
  organicVolumeFraction: { label: "Organic phases, volume fraction of the dry composite", unit: "vol%", percent: true },
  refractiveIndex: { label: "Refractive index of the coat (n_D)", unit: "" },
  indexMismatch: { label: "Index mismatch, coat − substrate", unit: "" },
  maxAllowedC: { label: "Highest allowed step temperature", unit: "°C" },
  dryThicknessNm: { label: "Dry film thickness", unit: "nm" },
  wetThicknessUm: { label: "Wet film thickness", unit: "µm" },
  coverageM2PerL: { label: "Coverage per litre of sol", unit: "m²/L" },
  capillaryNumber: { label: "Capillary number of the dip coat", unit: "" },
  effectiveR: { label: "Effective water ratio R (per network-forming atom)", unit: "mol/mol" },
  effectiveH: { label: "Effective water ratio h (per hydrolysable group)", unit: "mol/mol" },
  waterAddGrams: { label: "Water to add", unit: "g" },
  solventAddedGrams: { label: "Solvent to add", unit: "g" },
  solventMolPerNetworkAtom: { label: "Solvent per network-forming atom", unit: "mol/mol" },
  solMassGrams: { label: "Sol mass", unit: "g" },
  solVolumeMl: { label: "Sol volume (ideal mixing)", unit: "mL" },
  solidsFraction: { label: "Solids content of the sol", unit: "wt%", percent: true },
  residueGramsPerL: { label: "Dry residue per litre of sol", unit: "g/L" },
  compositeMassGrams: { label: "Dry composite mass", unit: "g" },
  porosity: { label: "Porosity of the dry composite", unit: "vol%", percent: true },
  denseLinearShrinkage: { label: "Linear shrinkage to full density", unit: "%", percent: true },
  denseVolumetricShrinkage: { label: "Volume shrinkage to full density", unit: "%", percent: true },
  vocMassGrams: { label: "VOC of the batch", unit: "g" },
  vocGramsPerLitre: { label: "VOC per litre of sol", unit: "g/L" },
  vocGramsPerLitreLessWater: { label: "VOC per litre of sol less water", unit: "g/L" },
  cureRatio: { label: "Cure ratio, amine H per epoxy group", unit: "eq/eq" },
  costTotal: { label: "Cost of the batch (team's currency)", unit: "per batch" },
  costPerKgDry: { label: "Cost per kg of dry composite (team's currency)", unit: "per kg" },
  costPerLitreSol: { label: "Cost per litre of sol (team's currency)", unit: "per L" },
  costPerM2: { label: "Cost per m² coated (team's currency)", unit: "per m²" },
};

/** Every plain figure key, in catalogue order. */
export const SCALAR_FIGURE_KEYS = Object.keys(SCALARS) as ScalarFigureKey[];

const ABS_MISMATCH = "absIndexMismatch";
const PHASE_VOLUME = "phaseVolumeFraction:";
const PHASE_WEIGHT = "phaseWeightFraction:";

/** The phases of the base's dry composite, by material id: its components and the bonded ligands of its modifiers. */
function phaseIds(base: FormulationInput): string[] {
  return [...new Set([...base.components.map((c) => c.materialId), ...(base.modifiers ?? []).map((m) => m.materialId)])];
}

/** A phase's name: "<precursor> residue", "<organic>", "<modifier>, bonded ligand". */
function phaseName(base: FormulationInput, id: string): string {
  const material = base.materials.find((m) => m.id === id);
  const name = materialName(base, id);
  if (material?.kind === "precursor") return `${name} residue`;
  if (material?.kind === "modifier") return `${name}, bonded ligand`;
  return name;
}

/**
 * What an output key means, in words and units, or undefined for a key the catalogue does not know.
 *
 * @example
 * ```ts
 * outputInfo("phaseVolumeFraction:teos", input)?.label; // "TEOS residue, volume fraction of the dry composite"
 * ```
 */
export function outputInfo(key: OutputKey, base: FormulationInput): OutputInfo | undefined {
  if (Object.hasOwn(SCALARS, key)) return { key, ...SCALARS[key as ScalarFigureKey] };
  if (key === ABS_MISMATCH) return { key, label: "Index mismatch, |coat − substrate|", unit: "" };
  for (const [prefix, what, unit] of [
    [PHASE_VOLUME, "volume", "vol%"],
    [PHASE_WEIGHT, "weight", "wt%"],
  ] as const) {
    if (key.startsWith(prefix)) {
      const id = key.slice(prefix.length);
      if (!phaseIds(base).includes(id)) return undefined;
      return { key, label: `${phaseName(base, id)}, ${what} fraction of the dry composite`, unit, percent: true };
    }
  }
  return undefined;
}

/**
 * Every figure an exploration of `base` can show: the plain figures, |index mismatch|, then each phase's
 * volume and weight fraction (components, then the bonded ligands of the base's modifiers).
 *
 * @example
 * ```ts
 * outputCatalogue(input).map((o) => o.key); // ["theoreticalDensity", …, "phaseWeightFraction:acac"]
 * ```
 */
export function outputCatalogue(base: FormulationInput): OutputInfo[] {
  const list: OutputInfo[] = SCALAR_FIGURE_KEYS.map((key) => ({ key, ...SCALARS[key] }));
  list.splice(list.findIndex((o) => o.key === "indexMismatch") + 1, 0, outputInfo(ABS_MISMATCH, base)!);
  for (const id of phaseIds(base)) list.push(outputInfo(PHASE_VOLUME + id, base)!);
  for (const id of phaseIds(base)) list.push(outputInfo(PHASE_WEIGHT + id, base)!);
  return list;
}

/** Reads one output from a figures object (NaN when absent). */
export type OutputReader = (figures: NumericFigures) => number;

const nanReader: OutputReader = () => Number.NaN;

function phaseReader(id: string, field: "volumeFraction" | "weightFraction"): OutputReader {
  return (figures) => {
    let sum = 0;
    for (const phase of figures.phases) if (phase.materialId === id) sum += phase[field];
    return sum;
  };
}

/**
 * A reader for one output key, made once per run so that each point only calls it.
 * Unknown keys read NaN. A phase absent from a point's composite (e.g. a component at 0) reads 0:
 * it makes up none of that composite.
 *
 * @example
 * ```ts
 * const read = outputReader("absIndexMismatch");
 * read(figures); // |coat − substrate|
 * ```
 */
export function outputReader(key: OutputKey): OutputReader {
  if (Object.hasOwn(SCALARS, key)) {
    const k = key as ScalarFigureKey;
    return (figures) => figures[k];
  }
  if (key === ABS_MISMATCH) return (figures) => Math.abs(figures.indexMismatch);
  if (key.startsWith(PHASE_VOLUME)) return phaseReader(key.slice(PHASE_VOLUME.length), "volumeFraction");
  if (key.startsWith(PHASE_WEIGHT)) return phaseReader(key.slice(PHASE_WEIGHT.length), "weightFraction");
  return nanReader;
}

/**
 * One output's value at a point (NaN when absent or when the key is unknown).
 *
 * @example
 * ```ts
 * outputValue(figures, "refractiveIndex"); // e.g. 1.512
 * ```
 */
export function outputValue(figures: NumericFigures, key: OutputKey): number {
  return outputReader(key)(figures);
}

/** How a run reads one output from a prepared evaluator: a slot of its figures, or a function. */
export type EvaluatorReader = { slot: number } | { read: (evaluator: NumericEvaluator) => number };

/**
 * The reader of one output from a NumericEvaluator (the prepared numeric path): a scalar figure is a
 * slot of `evaluator.figures`; |mismatch| and phase fractions are computed from it.
 *
 * @example
 * ```ts
 * const reader = evaluatorReader("refractiveIndex");
 * if ("slot" in reader) evaluator.figures[reader.slot]; // the index at the last point
 * ```
 */
export function evaluatorReader(key: OutputKey): EvaluatorReader {
  if (Object.hasOwn(SCALARS, key)) return { slot: SCALAR_FIGURES.indexOf(key as ScalarFigureKey) };
  if (key === ABS_MISMATCH) {
    const slot = SCALAR_FIGURES.indexOf("indexMismatch");
    return { read: (e) => Math.abs(e.figures[slot]!) };
  }
  for (const [prefix, field] of [
    [PHASE_VOLUME, "volumeFraction"],
    [PHASE_WEIGHT, "weightFraction"],
  ] as const) {
    if (key.startsWith(prefix)) {
      const id = key.slice(prefix.length);
      return { read: (e) => e.phaseFraction(id, field) };
    }
  }
  return { read: () => Number.NaN };
}
