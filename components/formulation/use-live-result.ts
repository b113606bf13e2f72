"use client";

import { useMemo } from "react";
import { computeFormulation, isFormulationError, type FormulationInput, type FormulationResult, type Material } from "@/lib/formulation";
import { formFieldFor, inputFromValues, type EditorValues } from "./editor-model";
import { fieldMessage, isEmptyDraft } from "./editor-words";

export interface LiveResult {
  input: FormulationInput;
  result: FormulationResult | null;
  /** Engine messages by form field ("general" for those without a field), in the editor's words. */
  messages: Record<string, string>;
  /** The engine's first message in the editor's words, when it refused the input. */
  error: string | null;
  /** No component has a material yet: nothing to compute, nothing to complain about. */
  empty: boolean;
  /** Time of the last recompute, ms. */
  ms: number;
}

/** Places an engine message at its form field, worded for the screen. */
function placeMessage(messages: Record<string, string>, path: string, message: string, values: EditorValues, input: FormulationInput): string {
  const { field, prefix } = formFieldFor(path, values, input);
  const text = prefix ? `${prefix}${message}` : fieldMessage(field, message);
  messages[field] ??= text;
  return text;
}

/** Recomputes the formulation in the browser whenever the form values change. */
export function useLiveResult(values: EditorValues, record: (id: string) => Material | undefined): LiveResult {
  return useMemo(() => {
    const started = performance.now();
    const input = inputFromValues(values, record);
    const messages: Record<string, string> = {};
    let result: FormulationResult | null = null;
    let error: string | null = null;
    const empty = isEmptyDraft(values);
    try {
      result = computeFormulation(input);
      for (const n of result.notices) {
        if (n.level === "error" && n.field) placeMessage(messages, n.field, n.message, values, input);
      }
    } catch (err) {
      if (!isFormulationError(err)) throw err;
      const worded = err.issues.map((issue) => placeMessage(messages, issue.field, issue.message, values, input));
      error = worded[0] ?? err.message;
    }
    if (empty) return { input, result: null, messages: {}, error: null, empty, ms: performance.now() - started };
    return { input, result, messages, error, empty, ms: performance.now() - started };
  }, [values, record]);
}
