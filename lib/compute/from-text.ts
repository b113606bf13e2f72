import { computeFormulation } from "@/lib/formulation";
import { isFormulationError, type FieldIssue, type FormulationErrorCode } from "@/lib/formulation/errors";
import type { FormulationInput } from "@/lib/formulation/input-schema";

/**
 * What one calculation gives back, as plain data that can cross a thread:
 * the result already written as JSON, or why there is none.
 */
export type EngineReply =
  | { ok: true; json: string }
  | { ok: false; kind: "malformed_json" }
  | { ok: false; kind: "formulation"; code: FormulationErrorCode; field: string; message: string; issues: FieldIssue[] }
  | { ok: false; kind: "internal"; message: string };

/**
 * Parses a request body and runs the engine on it: the whole job of the
 * calculator route, written so that it can run in an engine worker thread
 * (lib/compute/worker.ts) or, with the pool turned off, in the request's own.
 * An empty body counts as `{}`, as everywhere else in the API.
 */
export function computeFromText(text: string): EngineReply {
  let input: unknown;
  try {
    input = text.length ? JSON.parse(text) : {};
  } catch {
    return { ok: false, kind: "malformed_json" };
  }
  try {
    return { ok: true, json: JSON.stringify(computeFormulation(input as FormulationInput)) };
  } catch (err) {
    if (isFormulationError(err)) {
      return { ok: false, kind: "formulation", code: err.code, field: err.field, message: err.message, issues: [...err.issues] };
    }
    return { ok: false, kind: "internal", message: err instanceof Error ? (err.stack ?? err.message) : String(err) };
  }
}
