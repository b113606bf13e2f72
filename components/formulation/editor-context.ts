"use client";

import { createContext, useContext } from "react";
import type { Control, FieldErrors, UseFormRegister, UseFormSetValue, UseFormGetValues } from "react-hook-form";
import type { Material } from "@/lib/formulation";
import type { EditorValues } from "./editor-model";

export interface EditorContextValue {
  control: Control<EditorValues>;
  register: UseFormRegister<EditorValues>;
  setValue: UseFormSetValue<EditorValues>;
  getValues: UseFormGetValues<EditorValues>;
  errors: FieldErrors<EditorValues>;
  /** Message for a form field: the form's own check first, then the engine's or the server's. */
  messageFor: (field: string) => string | undefined;
  /** Materials offered in the selects (library plus the revision's own copies). */
  options: Material[];
  record: (id: string) => Material | undefined;
  readOnly: boolean;
}

export const EditorContext = createContext<EditorContextValue | null>(null);

export function useEditor(): EditorContextValue {
  const ctx = useContext(EditorContext);
  if (!ctx) throw new Error("useEditor outside the formulation editor");
  return ctx;
}

/** Props that tie a control to its label, its message region and its validity. */
export function a11y(id: string, message: string | undefined) {
  return { id, "aria-invalid": message ? true : undefined, "aria-describedby": `${id}-error` } as const;
}

/** "components.0.weightPercent" → "f-components-0-weightPercent" (a valid id). */
export function idFor(field: string): string {
  return `f-${field.replace(/\./g, "-")}`;
}
