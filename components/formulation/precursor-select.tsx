"use client";

import { useWatch } from "react-hook-form";
import { inputClass } from "@/components/ui/field";
import { a11y, idFor, useEditor } from "./editor-context";

interface PrecursorSelectProps {
  field: `modifiers.${number}.precursorId` | "water.referenceId";
  message?: string;
}

/** A select of the precursors chosen as components of this formulation. */
export function PrecursorSelect({ field, message }: PrecursorSelectProps) {
  const { control, register, record, readOnly } = useEditor();
  const components = useWatch({ control, name: "components" });
  const precursors = (components ?? [])
    .map((c) => record(c?.materialId ?? ""))
    .filter((m): m is NonNullable<typeof m> => m?.kind === "precursor");
  return (
    <select disabled={readOnly} className={inputClass(!!message)} {...a11y(idFor(field), message)} {...register(field)}>
      <option value="">Pick a component precursor</option>
      {precursors.map((m) => (
        <option key={m.id} value={m.id}>
          {m.name}
        </option>
      ))}
    </select>
  );
}
