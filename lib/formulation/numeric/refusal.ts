/**
 * How the numeric path stops on a point the decimal engine would refuse:
 * a plain thrown value (no Error, so no stack trace is captured) carrying the
 * engine's FormulationError code and field, turned into a NumericFailure by
 * the model.
 */
import type { FormulationErrorCode } from "../errors";
import type { NumericFailure } from "./figures";

/** A refusal of one point: the decimal engine's code and field. */
export class NumericRefusal {
  constructor(
    /** A FormulationErrorCode (a string, so that a coat failure passes through as it is). */
    readonly code: string,
    readonly field: string,
  ) {}

  /** The NumericFailure the model returns for it. */
  toFailure(): NumericFailure {
    return { ok: false, code: this.code, field: this.field };
  }
}

/**
 * Stops the computation of a point with the engine's code and field.
 *
 * @param code - the FormulationError code the decimal engine throws
 * @param field - its field path, e.g. "materials.3.density"
 * @example
 * ```ts
 * if (!(density > 0)) refuse("missing_density", "materials.3.density");
 * ```
 */
export function refuse(code: FormulationErrorCode, field: string): never {
  throw new NumericRefusal(code, field);
}
