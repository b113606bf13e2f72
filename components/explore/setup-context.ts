"use client";

import { createContext, useContext } from "react";
import type { UseFormReturn } from "react-hook-form";
import type { OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import type { SetupValues } from "./setup-values";

export interface SetupContextValue {
  form: UseFormReturn<SetupValues>;
  base: FormulationInput;
  catalogue: readonly OutputInfo[];
  /** The message at a form path ("variables.0.step"), live as the values change. */
  messageFor: (path: string) => string | undefined;
}

export const SetupContext = createContext<SetupContextValue | null>(null);

/** The setup form's context (inside <Explorer>). */
export function useSetup(): SetupContextValue {
  const ctx = useContext(SetupContext);
  if (!ctx) throw new Error("useSetup outside the explorer");
  return ctx;
}

/** "variables.0.step" → "x-variables-0-step" (a valid id). */
export function xid(path: string): string {
  return `x-${path.replace(/\./g, "-")}`;
}

/** id, aria-invalid and aria-describedby of a control with a message beside it. */
export function a11y(path: string, message: string | undefined) {
  const id = xid(path);
  return { id, "aria-invalid": message ? true : undefined, "aria-describedby": `${id}-error` } as const;
}
