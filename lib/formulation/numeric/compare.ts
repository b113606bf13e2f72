/**
 * How far two sets of exploration figures are apart: the largest relative
 * difference over every number (phases included), NaN matched only by NaN,
 * and the thermal status matched exactly. Used by the property test of the
 * numeric path and by the explorer benchmark.
 */
import { COAT_KEYS } from "./context";
import type { NumericFigures } from "./figures";

/** The numeric figures compared one by one (every key of NumericFigures but phases and thermalStatus). */
export const SCALAR_FIGURES = [
  "solMassGrams",
  "solVolumeMl",
  "solidsFraction",
  "residueGramsPerL",
  "compositeMassGrams",
  "theoreticalDensity",
  "porosity",
  "denseLinearShrinkage",
  "denseVolumetricShrinkage",
  "organicWeightFraction",
  "organicVolumeFraction",
  "organicContent",
  "effectiveR",
  "effectiveH",
  "waterAddGrams",
  "solventAddedGrams",
  "solventMolPerNetworkAtom",
  "maxAllowedC",
  ...COAT_KEYS,
] as const satisfies readonly (keyof NumericFigures)[];

/** A scalar figure's key. */
export type ScalarFigure = (typeof SCALAR_FIGURES)[number];

/**
 * The smallest scale a difference is measured against: values near 0 have no meaningful relative
 * error, so |a − b| ≤ 1e-9 · 1e-3 = 1e-12 passes the 1e-9 bound whatever a and b are.
 */
export const SCALE_FLOOR = 1e-3;

/**
 * |a − b| / max(|a|, |b|, 1e-3): 0 when both are NaN, Infinity when only one is. At most 1e-9 exactly
 * when |a − b| ≤ 1e-9 · max(|a|, |b|) or |a − b| ≤ 1e-12.
 *
 * @example
 * ```ts
 * relativeDifference(1, 1 + 1e-12); // ≈ 1e-12
 * relativeDifference(1e-20, 2e-20); // 1e-17 (near 0: measured against 1e-3)
 * relativeDifference(Number.NaN, 0); // Infinity
 * ```
 */
export function relativeDifference(a: number, b: number): number {
  const aNaN = Number.isNaN(a);
  const bNaN = Number.isNaN(b);
  if (aNaN || bNaN) return aNaN && bNaN ? 0 : Number.POSITIVE_INFINITY;
  if (a === b) return 0;
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), SCALE_FLOOR);
}

/** The largest difference between two figures objects and where it is. */
export interface FiguresDifference {
  /** Largest relative difference (Infinity for a NaN mismatch, a different phase list or thermal status). */
  max: number;
  /** The figure it is on, e.g. "solMassGrams", "phases.2.volumeFraction", "thermalStatus". */
  figure: string;
}

/**
 * The largest relative difference between two figures objects.
 *
 * @param a - figures, e.g. of the numeric path
 * @param b - figures, e.g. of the decimal engine
 * @param keys - the scalar figures to compare (default all)
 * @example
 * ```ts
 * figuresDifference(numeric.figures, decimal.figures).max <= 1e-9;
 * ```
 */
export function figuresDifference(a: NumericFigures, b: NumericFigures, keys: readonly ScalarFigure[] = SCALAR_FIGURES): FiguresDifference {
  let max = 0;
  let figure = "";
  const note = (value: number, name: string): void => {
    if (value > max || (Number.isNaN(value) && max === 0)) {
      max = value;
      figure = name;
    }
  };
  for (const key of keys) note(relativeDifference(a[key], b[key]), key);
  if (a.thermalStatus !== b.thermalStatus) note(Number.POSITIVE_INFINITY, "thermalStatus");
  if (a.phases.length !== b.phases.length) note(Number.POSITIVE_INFINITY, "phases");
  else {
    a.phases.forEach((phase, k) => {
      const other = b.phases[k]!;
      if (phase.materialId !== other.materialId || phase.organic !== other.organic) note(Number.POSITIVE_INFINITY, `phases.${k}`);
      note(relativeDifference(phase.weightFraction, other.weightFraction), `phases.${k}.weightFraction`);
      note(relativeDifference(phase.volumeFraction, other.volumeFraction), `phases.${k}.volumeFraction`);
    });
  }
  return { max, figure };
}
