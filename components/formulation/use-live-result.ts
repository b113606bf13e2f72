"use client";

import { useMemo } from "react";
import { computeFormulation, isFormulationError, type FormulationInput, type FormulationResult, type Material } from "@/lib/formulation";
import { formFieldFor, inputFromValues, type EditorValues } from "./editor-model";

export interface LiveResult {
  input: FormulationInput;
  result: FormulationResult | null;
  /** Engine messages by form field ("general" for those without a field). */
  messages: Record<string, string>;
  /** The engine's first message, when it refused the input. */
  error: string | null;
  /** Time of the last recompute, ms. */
  ms: number;
}

/** Recomputes the formulation in the browser whenever the form values change. */
export function useLiveResult(values: EditorValues, record: (id: string) => Material | undefined): LiveResult {
  return useMemo(() => {
    const started = performance.now();
    const input = inputFromValues(values, record);
    const messages: Record<string, string> = {};
    let result: FormulationResult | null = null;
    let error: string | null = null;
    try {
      result = computeFormulation(input);
      for (const n of result.notices) {
        if (n.level === "error" && n.field) {
          const { field, prefix } = formFieldFor(n.field, values, input);
          messages[field] ??= `${prefix ?? ""}${n.message}`;
        }
      }
    } catch (err) {
      if (!isFormulationError(err)) throw err;
      error = err.message;
      for (const issue of err.issues) {
        const { field, prefix } = formFieldFor(issue.field, values, input);
        messages[field] ??= `${prefix ?? ""}${issue.message}`;
      }
    }
    return { input, result, messages, error, ms: performance.now() - started };
  }, [values, record]);
}
