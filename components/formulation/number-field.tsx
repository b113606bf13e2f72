"use client";

import type { ReactNode } from "react";
import type { FieldPath } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import type { EditorValues } from "./editor-model";
import { a11y, idFor, useEditor } from "./editor-context";

interface NumberFieldProps {
  name: FieldPath<EditorValues>;
  label: ReactNode;
  unit?: string;
  hint?: string;
  step?: string;
  className?: string;
}

/** A number input bound to the editor form, with its unit and its message. */
export function NumberField({ name, label, unit, hint, step = "any", className = "" }: NumberFieldProps) {
  const { register, messageFor, readOnly } = useEditor();
  const id = idFor(name);
  const message = messageFor(name);
  return (
    <Field id={id} label={label} hint={[unit ? `(${unit})` : "", hint ?? ""].filter(Boolean).join(" ")} error={message} className={className}>
      <input
        type="number"
        inputMode="decimal"
        step={step}
        readOnly={readOnly}
        className={inputClass(!!message, "num")}
        {...a11y(id, message)}
        {...register(name, { valueAsNumber: true })}
      />
    </Field>
  );
}
