/**
 * One problem with a formulation input: the path of the field in
 * `FormulationInput` (dot-separated, array indices as numbers) and a plain
 * message that says what is wrong.
 */
export interface FieldIssue {
  readonly field: string;
  readonly message: string;
}

/**
 * Machine-readable reasons for which the engine refuses an input.
 * Route handlers map every one of them to HTTP 422.
 */
export type FormulationErrorCode =
  | "invalid_input"
  | "fractions_do_not_sum"
  | "unknown_material"
  | "duplicate_material"
  | "duplicate_component"
  | "wrong_kind"
  | "missing_density"
  | "missing_molar_mass"
  | "no_residue"
  | "no_network_atoms"
  | "no_hydrolysable_groups"
  | "nothing_to_fill"
  | "mould_too_small"
  | "solids_content_too_high"
  | "bulk_density_above_theoretical"
  | "invalid_formula"
  | "too_much_modifier";

/**
 * The typed error of the formulation engine. It is thrown for infeasible or
 * inconsistent input instead of returning NaN or a negative mass.
 *
 * @example
 * ```ts
 * try {
 *   computeFormulation(input);
 * } catch (error) {
 *   if (error instanceof FormulationError) {
 *     // error.code === "fractions_do_not_sum", error.field === "components"
 *   }
 * }
 * ```
 */
export class FormulationError extends Error {
  /** Machine-readable reason, e.g. "fractions_do_not_sum". */
  readonly code: FormulationErrorCode;
  /** Path of the offending field in FormulationInput, e.g. "materials.3.density". */
  readonly field: string;
  /** Every issue found; the first one is `{ field, message }` of this error. */
  readonly issues: readonly FieldIssue[];

  constructor(code: FormulationErrorCode, field: string, message: string, issues?: readonly FieldIssue[]) {
    super(message);
    this.name = "FormulationError";
    this.code = code;
    this.field = field;
    this.issues = issues && issues.length > 0 ? issues : [{ field, message }];
  }
}

/**
 * Type guard for FormulationError that also works across bundles.
 *
 * @example
 * ```ts
 * isFormulationError(new FormulationError("no_residue", "materials.0.precursor", "…")); // true
 * ```
 */
export function isFormulationError(value: unknown): value is FormulationError {
  return value instanceof FormulationError || (value instanceof Error && value.name === "FormulationError");
}
