"use client";

import type { FieldPath } from "react-hook-form";
import { Field, inputClass } from "@/components/ui/field";
import { useEditor } from "./editor-context";
import type { EditorValues } from "./editor-model";

/** Name, project and description of a new formulation. */
export function MetaFields() {
  const { register, messageFor } = useEditor();
  const f = (name: FieldPath<EditorValues>) => ({
    id: `f-${name}`,
    "aria-invalid": messageFor(name) ? true : undefined,
    "aria-describedby": `f-${name}-error`,
    ...register(name),
  });
  return (
    <fieldset className="flex flex-col gap-3 rounded border border-rule bg-panel p-3">
      <legend className="px-1 text-sm font-semibold">Formulation</legend>
      <Field id="f-name" label="Name" error={messageFor("name")}>
        <input className={inputClass(!!messageFor("name"))} {...f("name")} />
      </Field>
      <Field id="f-project" label="Project" hint="optional" error={messageFor("project")}>
        <input className={inputClass()} {...f("project")} />
      </Field>
      <Field id="f-description" label="Description" hint="optional" error={messageFor("description")}>
        <textarea rows={2} className={inputClass()} {...f("description")} />
      </Field>
    </fieldset>
  );
}
