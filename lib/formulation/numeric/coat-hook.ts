/**
 * Where the numeric path gets its coat figures (film, optics, VOC,
 * epoxy–amine balance, cost): numericCoat of lib/formulation/numeric/coat.ts.
 * One place to unplug it (undefined: the coat figures stay NaN), for a
 * benchmark of the core figures alone.
 */
import { numericCoat } from "./coat";
import type { NumericCoatContext, NumericCoatFigures } from "./context";
import type { NumericFailure } from "./figures";

/** The coat figures of a point from its context, or the engine's refusal. */
export type CoatHook = (context: NumericCoatContext) => NumericCoatFigures | NumericFailure;

/** The coat figures' function of the numeric path. */
export const numericCoatHook: CoatHook | undefined = numericCoat;

/** The figures the coat path gives (NumericCoatFigures' keys). */
export const COAT_FIGURES: readonly string[] = [
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
];
