import { z } from "zod";
import { FormulationError, type FieldIssue, type FormulationErrorCode } from "./errors";
import { formulationInputSchema, type FormulationInput } from "./input-schema";
import { fieldPath } from "./zod-helpers";

const CUSTOM_CODES: ReadonlySet<string> = new Set<FormulationErrorCode>([
  "fractions_do_not_sum",
  "unknown_material",
  "duplicate_material",
  "duplicate_component",
  "wrong_kind",
  "nothing_to_fill",
]);

/** `formulationInputSchema` with zod's compiled fast path, built on first use (see `inputSchema`). */
let compiledInputSchema: typeof formulationInputSchema | undefined;

/**
 * `formulationInputSchema` compiled by zod (`z.compile`): a generated
 * validator of the same schema for the common, valid case, about 3× faster
 * than zod's interpreter. Input the fast path does not accept is parsed again
 * by the schema itself, so every issue (path, message, params) is the one of
 * `formulationInputSchema`. Where code generation is not allowed (a strict
 * Content-Security-Policy, zod's `jitless` setting), the schema as it is.
 */
function inputSchema(): typeof formulationInputSchema {
  compiledInputSchema ??= z.util.allowsEval.value ? z.compile(formulationInputSchema) : formulationInputSchema;
  return compiledInputSchema;
}

function codeOf(issue: { code: string; params?: unknown }): FormulationErrorCode {
  if (issue.code === "custom" && issue.params && typeof issue.params === "object") {
    const code = (issue.params as { code?: unknown }).code;
    if (typeof code === "string" && CUSTOM_CODES.has(code)) return code as FormulationErrorCode;
  }
  return "invalid_input";
}

/**
 * Validates raw input against `formulationInputSchema`. Throws a
 * FormulationError naming the first offending field (code "invalid_input",
 * or the specific code of a cross-field check such as
 * "fractions_do_not_sum"), with every issue in `error.issues`.
 *
 * @param raw - untrusted input (e.g. a parsed request body)
 * @returns the validated FormulationInput
 * @example
 * ```ts
 * const input = parseFormulationInput(JSON.parse(body));
 * ```
 */
export function parseFormulationInput(raw: unknown): FormulationInput {
  const parsed = inputSchema().safeParse(raw);
  if (parsed.success) return parsed.data;
  const issues: FieldIssue[] = parsed.error.issues.map((issue) => ({
    field: fieldPath(issue.path),
    message: issue.message,
  }));
  const first = parsed.error.issues[0];
  const firstIssue = issues[0] ?? { field: "", message: "the input is not valid" };
  throw new FormulationError(first ? codeOf(first) : "invalid_input", firstIssue.field, firstIssue.message, issues);
}
